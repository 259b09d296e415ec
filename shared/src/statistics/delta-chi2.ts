import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import chisquareQuantile from '@stdlib/stats-base-dists-chisquare-quantile';
import type { LikelihoodSet } from '../schemas/likelihood-set.schema.js';

/**
 * σ_r of the half-Gaussian that stands in for a published one-sided 95% upper limit on r: the
 * limit sits at 1.96σ_r, since a half-Gaussian in r ≥ 0 holds 95% of its mass below 1.96σ
 * (an approximation, derived; not the published likelihood).
 */
export function rSigma(set: Pick<LikelihoodSet, 'r'>): number {
  return set.r.upper95 / 1.959964;
}

/** The scale the engine's n_s, r and α_s are given at: the pivot k_* = 0.05 Mpc⁻¹ (Planck's convention for A_s and n_s; common practice). */
export const ENGINE_PIVOT_PER_MPC = 0.05;

/**
 * r moved from the engine's pivot to the one the set's limit is quoted at: r(k) = r_* (k/k_*)^(n_t − (n_s − 1))
 * with the consistency relation n_t = −r/8 (first-order slow roll; common practice). For n_s = 0.965 and
 * r = 0.04 it gives r_0.002 = 0.908 r_0.05 (derived; ../check-values §1 has 0.91).
 */
export function rAtSetPivot(set: Pick<LikelihoodSet, 'r'>, ns: number, r: number): number {
  const ratio = set.r.pivotPerMpc / ENGINE_PIVOT_PER_MPC;
  return ratio === 1 ? r : r * ratio ** (-r / 8 - (ns - 1));
}

/** What a point is judged on: n_s and r at the engine's pivot (r is moved to the set's, `rAtSetPivot`), α_s when known. */
export interface SpectrumPoint {
  ns: number;
  r: number;
  alphaS?: number | null;
}

export interface PointDeltaChi2 {
  /** −2 ln(L / L_max): 0 at the set's maximum, +Infinity for r < 0 (outside the half-Gaussian). */
  deltaChi2: number;
  /** How many Gaussian terms were summed: 2 for (n_s, r), 3 with α_s. */
  terms: number;
}

/**
 * Δχ² of a point under a set: the sum of ((x − mean)/σ)² over n_s, r (mean 0, r ≥ 0) and, when the
 * set has α_s and the point a finite α_s, α_s. Null when n_s or r is not a finite number (a failed
 * point has nothing to judge).
 */
export function deltaChi2(set: LikelihoodSet, point: SpectrumPoint): PointDeltaChi2 | null {
  const { ns, r, alphaS } = point;
  if (!Number.isFinite(ns) || !Number.isFinite(r)) return null;
  if (r < 0) return { deltaChi2: Infinity, terms: 2 };
  let sum = ((ns - set.ns.mean) / set.ns.sigma) ** 2 + (rAtSetPivot(set, ns, r) / rSigma(set)) ** 2;
  let terms = 2;
  if (set.alphaS && alphaS != null && Number.isFinite(alphaS)) {
    sum += ((alphaS - set.alphaS.mean) / set.alphaS.sigma) ** 2;
    terms = 3;
  }
  return { deltaChi2: sum, terms };
}

/**
 * The confidence level a Δχ² corresponds to for a joint region of k parameters: the χ² CDF with
 * k degrees of freedom (Wilks' theorem; Press et al., Numerical Recipes, §15.6). With k = 2,
 * Δχ² = 2.30 is 68.3%, 6.18 is 95.4%, 11.83 is 99.73%.
 */
export function confidenceOf(deltaChi2Value: number, k: number): number {
  if (!(deltaChi2Value >= 0)) return deltaChi2Value === -Infinity ? 0 : Number.NaN;
  return chisquareCdf(deltaChi2Value, k);
}

/** The Δχ² bounding the joint region of confidence `level` (0–1) in k parameters: the χ² quantile. */
export function deltaChi2Threshold(level: number, k: number): number {
  return chisquareQuantile(level, k);
}

/**
 * The "1σ, 2σ, 3σ" confidence levels of a Gaussian: erf(n/√2) = 68.27%, 95.45%, 99.73% (common
 * practice). Their thresholds assume a joint region of k parameters; in two parameters (the n_s–r
 * plane) they are Δχ² = 2.30, 6.18, 11.83.
 */
export const SIGMA_CONFIDENCE_LEVELS = [0.6826894921370859, 0.9544997361036416, 0.9973002039367398] as const;

/** Δχ² thresholds of the 68.3 / 95.4 / 99.73% regions, assuming a joint region of k parameters. */
export function sigmaThresholds(k: number): number[] {
  return SIGMA_CONFIDENCE_LEVELS.map((level) => deltaChi2Threshold(level, k));
}
