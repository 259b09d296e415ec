import { Text } from '@chakra-ui/react';
import type { PotentialScale } from '@sixtyfold/shared';

const SUPERSCRIPTS: Readonly<Record<string, string>> = {
  '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹',
};

/** `A`, `A²`, `A⁻¹` or `A^0.5`: the parameter to its power, as V is proportional to it. */
export function scalePowerText({ parameter, power }: PotentialScale): string {
  if (power === 1) return parameter;
  // Superscripts for short whole powers; a fraction or a power written with an exponent keeps the caret.
  if (!Number.isInteger(power) || Math.abs(power) >= 1000) return `${parameter}^${power}`;
  return parameter + [...String(power)].map((ch) => SUPERSCRIPTS[ch]).join('');
}

/**
 * Which parameter only scales V, or that none does, and so which points share one background
 * integration. Families and models say it in these same words.
 */
export function ScaleStatement({ scale }: { scale: PotentialScale | undefined }) {
  if (!scale) return <>none: no parameter only scales V, so only points that differ in N_* or the reheating share one background integration</>;
  const { parameter } = scale;
  return (
    <>
      {parameter} (V ∝ {scalePowerText(scale)}): points that differ only in {parameter}, N_* or the reheating share one background integration
    </>
  );
}

/** Shown while a model's expression is still being read for its scale parameter. */
export function ScaleStatementPending() {
  return (
    <Text as="span" color="fg.muted">
      reading the expression…
    </Text>
  );
}
