import type { RegionVertex } from '../uploads/constraint-region.schema.js';
import type { LikelihoodSet } from '../schemas/likelihood-set.schema.js';
import { deltaChi2Threshold, rAtSetPivot, rSigma } from './delta-chi2.js';

/**
 * The outline of a set's region Δχ² ≤ t in the (n_s, r) plane, as vertices to draw. With the n_s
 * and r terms the region is half an ellipse: n_s = μ + σ√t cos θ, r = σ_r √t sin θ, θ from 0 to π.
 * The vertices run from the right end on r = 0 over the top to the left end; the outline closes
 * along r = 0. α_s, when the set has it, is taken at its best value (the profile over α_s).
 * r is given at the engine's pivot, as the plane draws it: for a set quoted at another pivot it is
 * moved back from there (`engineR`).
 */
export function likelihoodOutline(set: LikelihoodSet, threshold: number, segments = 96): RegionVertex[] {
  if (!(threshold > 0 && Number.isFinite(threshold))) throw new RangeError('the Δχ² level of an outline must be a positive number');
  if (!(Number.isInteger(segments) && segments >= 2)) throw new RangeError('an outline needs at least 2 segments');
  const root = Math.sqrt(threshold);
  const sigmaR = rSigma(set);
  return Array.from({ length: segments + 1 }, (_, i) => {
    const theta = (Math.PI * i) / segments;
    const ns = set.ns.mean + set.ns.sigma * root * Math.cos(theta);
    return { ns, r: engineR(set, ns, sigmaR * root * Math.sin(theta)) };
  });
}

/** The r at the engine's pivot that `rAtSetPivot` moves to `rSet`: a fixed point, reached in a few steps since the tilt barely depends on r. */
function engineR(set: LikelihoodSet, ns: number, rSet: number): number {
  if (rSet === 0) return 0;
  let r = rSet;
  for (let i = 0; i < 50; i++) {
    const next = r * (rSet / rAtSetPivot(set, ns, r));
    if (Math.abs(next - r) <= 1e-15 * Math.abs(r)) return next;
    r = next;
  }
  return r;
}

/** The outline of a set's joint (n_s, r) region at a confidence level (0–1): two parameters. */
export function confidenceOutline(set: LikelihoodSet, level: number, segments = 96): RegionVertex[] {
  return likelihoodOutline(set, deltaChi2Threshold(level, 2), segments);
}
