import type { RegionVertex } from '../uploads/constraint-region.schema.js';
import type { LikelihoodSet } from '../schemas/likelihood-set.schema.js';
import { deltaChi2Threshold, rSigma } from './delta-chi2.js';

/**
 * The outline of a set's region Δχ² ≤ t in the (n_s, r) plane, as vertices to draw. With the n_s
 * and r terms the region is half an ellipse: n_s = μ + σ√t cos θ, r = σ_r √t sin θ, θ from 0 to π.
 * The vertices run from the right end on r = 0 over the top to the left end; the outline closes
 * along r = 0. α_s, when the set has it, is taken at its best value (the profile over α_s).
 */
export function likelihoodOutline(set: LikelihoodSet, threshold: number, segments = 96): RegionVertex[] {
  if (!(threshold > 0 && Number.isFinite(threshold))) throw new RangeError('the Δχ² level of an outline must be a positive number');
  if (!(Number.isInteger(segments) && segments >= 2)) throw new RangeError('an outline needs at least 2 segments');
  const root = Math.sqrt(threshold);
  const sigmaR = rSigma(set);
  return Array.from({ length: segments + 1 }, (_, i) => {
    const theta = (Math.PI * i) / segments;
    return { ns: set.ns.mean + set.ns.sigma * root * Math.cos(theta), r: sigmaR * root * Math.sin(theta) };
  });
}

/** The outline of a set's joint (n_s, r) region at a confidence level (0–1): two parameters. */
export function confidenceOutline(set: LikelihoodSet, level: number, segments = 96): RegionVertex[] {
  return likelihoodOutline(set, deltaChi2Threshold(level, 2), segments);
}
