import { CashKarpStepper } from '../integrators/cash-karp.js';
import type { PotentialFunctions } from '../types.js';

/**
 * Where slow roll puts the field `efolds` e-folds before ε_V = 1: the end is bisected inside
 * [from, to] (ε_V < 1 at `from`, ≥ 1 at `to`), then the slow-roll attractor dφ/dN = −V'/V is
 * integrated backwards from it. Used for the default φ_init of built-in families, whose exact
 * backgrounds then have comfortably more e-folds than any N_* asks for.
 */
export function slowRollStart(potential: PotentialFunctions, from: number, to: number, efolds: number): number {
  const epsV = (phi: number) => 0.5 * (potential.dV(phi) / potential.V(phi)) ** 2;
  let inflating = from;
  let ended = to;
  if (!(epsV(from) < 1) || !(epsV(to) >= 1)) return from;
  for (let i = 0; i < 200 && Math.abs(ended - inflating) > 1e-12 * Math.max(1, Math.abs(ended)); i++) {
    const mid = 0.5 * (inflating + ended);
    if (epsV(mid) < 1) inflating = mid;
    else ended = mid;
  }
  const stepper = new CashKarpStepper(1, (out, y) => {
    out[0] = potential.dV(y[0]) / potential.V(y[0]); // −dφ/dN: running time backwards
  }, { tolerance: 1e-10, maxStep: 1 });
  stepper.reset(0, [inflating], 0.01);
  for (let guard = 0; stepper.t < efolds && guard < 100_000; guard++) {
    if (stepper.step(efolds) !== 'ok') break;
  }
  return stepper.y[0];
}
