import { FAILURE_CODES } from '@sixtyfold/shared';

// One fixed colour per engine failure code, so a reason looks the same on every panel and scan.
// Chosen apart from the ink-to-ember value scale, which never marks failures.
const COLORS: Record<(typeof FAILURE_CODES)[number], string> = {
  insufficient_efolds: '#b3261e',
  no_end: '#1f7a68',
  no_inflation_at_start: '#9a7b12',
  trapped: '#c2407e',
  integration_failed: '#4f4a40',
  budget_exceeded: '#6b3fa0',
  pivot_too_early: '#d0782a',
  slow_roll_invalid: '#4d7c2a',
  spectrum_feature: '#2a4d9a',
  chunk_failed: '#2b2b2b',
  negative_potential: '#1b6f96',
  invalid_input: '#8f8676',
  invalid_potential: '#7a4b2a',
};
const OTHER = '#5e5e5e';

/** Failure codes in a fixed order (unknown codes last), for a discrete colour scale. */
export const FAILURE_ORDER: string[] = [...FAILURE_CODES];

export const failureColor = (reason: string) => COLORS[reason as keyof typeof COLORS] ?? OTHER;

/** Position of a reason on the discrete scale; codes this version does not know share the last slot. */
export const failureSlot = (reason: string) => {
  const index = FAILURE_ORDER.indexOf(reason);
  return index < 0 ? FAILURE_ORDER.length : index;
};

/** A stepped Plotly colour scale with one band per slot (zmin −½, zmax slots − ½). */
export function failureColorscale(): [number, string][] {
  const colors = [...FAILURE_ORDER.map(failureColor), OTHER];
  return colors.flatMap((color, i) => [
    [i / colors.length, color],
    [(i + 1) / colors.length, color],
  ]) as [number, string][];
}

export const FAILURE_SLOTS = FAILURE_ORDER.length + 1;
