import type { CompiledPotential } from '@sixtyfold/shared';

/** V(φ) and the potential slow-roll parameters sampled over a range; null where undefined (V ≤ 0, NaN). */
export interface SlowRollCurves {
  phi: number[];
  V: (number | null)[];
  epsilonV: (number | null)[];
  /** |η_V|, for a log axis. */
  absEtaV: (number | null)[];
}

const finite = (value: number) => (Number.isFinite(value) ? value : null);

/**
 * ε_V = ½ (V′/V)² and η_V = V″/V in reduced Planck units, as defined by Liddle, Parsons &
 * Barrow 1994 (arXiv:astro-ph/9408015); they need V > 0.
 */
export function slowRollCurves(potential: CompiledPotential, phiMin: number, phiMax: number, samples = 400): SlowRollCurves {
  const curves: SlowRollCurves = { phi: [], V: [], epsilonV: [], absEtaV: [] };
  for (let i = 0; i < samples; i++) {
    const phi = phiMin + ((phiMax - phiMin) * i) / (samples - 1);
    const V = potential.V(phi);
    curves.phi.push(phi);
    curves.V.push(finite(V));
    const positive = V > 0;
    curves.epsilonV.push(positive ? finite(0.5 * (potential.dV(phi) / V) ** 2) : null);
    curves.absEtaV.push(positive ? finite(Math.abs(potential.d2V(phi) / V)) : null);
  }
  return curves;
}

const STEP_EFOLDS = 0.05;
const MAX_STEPS = 40_000; // 2000 e-folds, where the engine also gives up

/**
 * Where slow roll ends (ε_V = 1) starting from `phiStart`, following the slow-roll attractor
 * dφ/dN = −V′/V (Liddle, Parsons & Barrow 1994, arXiv:astro-ph/9408015) with RK4 steps of
 * 0.05 e-folds. It only places the plot's default range, so it gives up after 2000 e-folds,
 * or where V stops being positive, and returns where it got to.
 */
export function slowRollEnd(potential: CompiledPotential, phiStart: number): { phiEnd: number; ended: boolean } {
  const velocity = (phi: number) => -potential.dV(phi) / potential.V(phi);
  const inflating = (phi: number) => potential.V(phi) > 0 && 0.5 * velocity(phi) ** 2 < 1;
  let phi = phiStart;
  if (!Number.isFinite(potential.V(phi)) || !(potential.V(phi) > 0)) return { phiEnd: phi, ended: false };
  for (let step = 0; step < MAX_STEPS; step++) {
    if (!inflating(phi)) return { phiEnd: phi, ended: true };
    const h = STEP_EFOLDS;
    const k1 = velocity(phi);
    const k2 = velocity(phi + 0.5 * h * k1);
    const k3 = velocity(phi + 0.5 * h * k2);
    const k4 = velocity(phi + h * k3);
    const next = phi + (h / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
    if (!Number.isFinite(next)) return { phiEnd: phi, ended: false };
    phi = next;
  }
  return { phiEnd: phi, ended: false };
}

/** A field range showing the start, the end of slow roll and a margin either side. */
export function defaultPhiRange(potential: CompiledPotential, phiStart: number): { min: number; max: number } {
  const { phiEnd } = slowRollEnd(potential, phiStart);
  const lo = Math.min(phiStart, phiEnd);
  const hi = Math.max(phiStart, phiEnd);
  const margin = hi > lo ? 0.15 * (hi - lo) : Math.max(1, Math.abs(lo));
  return { min: roundForInput(lo - margin), max: roundForInput(hi + margin) };
}

// Range inputs show these numbers, so keep them short.
function roundForInput(value: number): number {
  return Number(value.toPrecision(3));
}
