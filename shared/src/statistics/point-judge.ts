import type { LikelihoodSet } from '../schemas/likelihood-set.schema.js';
import { confidenceOf, deltaChi2 } from './delta-chi2.js';
import type { RegionLikelihood } from './region-likelihood.js';

/** A point's stored outputs, as judged: n_s and r at the engine's pivot, α_s when known (null where a failed point has none). */
export interface StoredSpectrum {
  ns: number | null;
  r: number | null;
  alphaS: number | null;
}

export interface PointJudgement {
  /** −2 ln(L / L_max) under the likelihood. */
  deltaChi2: number;
  /** The confidence level of that Δχ² in as many parameters as it assumes (2 for regions, 2 or 3 terms for a set). */
  confidence: number;
  /** Outside the outermost uploaded contour, where Δχ² is extrapolated; always false under a set. */
  outsideRegions: boolean;
}

/** One way to judge a point under any likelihood; null when the point has no finite n_s or r. */
export type PointJudge = (point: StoredSpectrum) => PointJudgement | null;

/** Judging under a set: Δχ² from `deltaChi2`, its confidence level in as many parameters as terms were summed. */
export function judgeBySet(set: LikelihoodSet): PointJudge {
  return ({ ns, r, alphaS }) => {
    const judged = ns === null || r === null ? null : deltaChi2(set, { ns, r, alphaS });
    return judged && { deltaChi2: judged.deltaChi2, confidence: confidenceOf(judged.deltaChi2, judged.terms), outsideRegions: false };
  };
}

/** Judging under uploaded contours: Δχ² from `RegionLikelihood`, its confidence level in the two parameters (n_s, r) the contours are drawn in. */
export function judgeByRegions(regions: RegionLikelihood): PointJudge {
  return ({ ns, r }) => {
    if (ns === null || r === null || !Number.isFinite(ns) || !Number.isFinite(r)) return null;
    const at = regions.at({ ns, r });
    return { deltaChi2: at.deltaChi2, confidence: confidenceOf(at.deltaChi2, 2), outsideRegions: at.outside };
  };
}

/** Shown wherever uploaded regions judge a scan: what the numbers are and are not. */
export const REGION_LIKELIHOOD_STATEMENT =
  'Δχ² from the group\'s uploaded contours, not a published likelihood: each contour sits at the two-parameter Δχ² of its level '
  + '(2.30 at 68.3 %, 6.18 at 95.4 %), √Δχ² is interpolated linearly in the distance between the contours (from 0 at the innermost '
  + 'contour\'s centroid), and beyond the outermost contour it is extrapolated along the same slope and the point is flagged outside the regions.';
