import type { RefinementBoundary } from '../schemas/refinement.schema.js';
import { SIGMA_CONFIDENCE_LEVELS, deltaChi2Threshold } from '../statistics/delta-chi2.js';

/**
 * The level a boundary sits at: the Δχ² of the likelihood's 68 or 95 % region in the two
 * parameters of the n_s–r plane (2.30 or 6.18, the 1σ and 2σ levels), or the output's value.
 */
export function boundaryLevel(boundary: RefinementBoundary): number {
  if (boundary.kind === 'output') return boundary.value;
  return deltaChi2Threshold(SIGMA_CONFIDENCE_LEVELS[boundary.level === 68 ? 0 : 1], 2);
}

/**
 * A point's signed distance from the boundary: its Δχ² (under a likelihood boundary) or the
 * output's value, minus the level; null for a failed or flagged point without that value.
 */
export function boundaryDistance(boundary: RefinementBoundary, value: number | null | undefined): number | null {
  if (value == null || Number.isNaN(value)) return null;
  return value - boundaryLevel(boundary);
}
