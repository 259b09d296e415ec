/**
 * Published limits on the primordial spectrum that scans are judged against. Each set names its
 * source, so a plot or a table can say where its lines come from. New data sets are added here as
 * new entries, never by editing the numbers of an old one. The versioned likelihood sets and their
 * joint regions in `statistics/` will replace these boxes once the plane and heatmaps draw them.
 */
export interface ObservationalLimits {
  key: string;
  /** Short name for legends. */
  label: string;
  /** Full citation, shown under plots. */
  source: string;
  /** Gaussian n_s: mean and 68% half-width, at k_* = 0.05 Mpc⁻¹. */
  ns: { mean: number; sigma: number };
  /** 95% upper limit on r, and the pivot scale it is quoted at (Mpc⁻¹). */
  r: { max95: number; pivotPerMpc: number };
}

export const OBSERVATIONAL_LIMITS: ObservationalLimits[] = [
  {
    key: 'planck18-bk18',
    label: 'Planck 2018 + BICEP/Keck 2018',
    // n_s: Planck 2018 X abstract / Planck 2018 VI Table 2 (TT,TE,EE+lowE+lensing).
    // r: BICEP/Keck XIII, r_0.05 < 0.036 at 95%.
    source:
      'n_s = 0.9649 ± 0.0042 (68%): Planck Collaboration 2020, A&A 641, A10, arXiv:1807.06211; ' +
      'r_0.05 < 0.036 (95%): BICEP/Keck Collaboration 2021, PRL 127, 151301, arXiv:2110.00483',
    ns: { mean: 0.9649, sigma: 0.0042 },
    r: { max95: 0.036, pivotPerMpc: 0.05 },
  },
  {
    key: 'planck18',
    label: 'Planck 2018 alone',
    source:
      'n_s = 0.9649 ± 0.0042 (68%), r_0.002 < 0.10 (95%): Planck Collaboration 2020, A&A 641, A10, arXiv:1807.06211',
    ns: { mean: 0.9649, sigma: 0.0042 },
    r: { max95: 0.1, pivotPerMpc: 0.002 },
  },
];

export const DEFAULT_LIMITS_KEY = 'planck18-bk18';

export function findLimits(key: string = DEFAULT_LIMITS_KEY): ObservationalLimits {
  return OBSERVATIONAL_LIMITS.find((limits) => limits.key === key) ?? OBSERVATIONAL_LIMITS[0];
}

/** How many standard deviations the 68% and 95% two-sided intervals of a Gaussian span. */
export const SIGMAS = { 68: 1, 95: 1.959964 } as const;
export type ConfidenceLevel = keyof typeof SIGMAS;

/**
 * The region drawn on plots: n_s within the Gaussian interval and r below the 95% limit. This is
 * the product of the two one-dimensional limits, a rectangle, not the published joint contour
 * (whose shape is only given as a figure); labels say so.
 */
export function insideLimits(ns: number, r: number, limits: ObservationalLimits, level: ConfidenceLevel = 95): boolean {
  const halfWidth = SIGMAS[level] * limits.ns.sigma;
  return Math.abs(ns - limits.ns.mean) <= halfWidth && r >= 0 && r <= limits.r.max95;
}

/** The n_s interval of a level, for drawing bands. */
export function nsInterval(limits: ObservationalLimits, level: ConfidenceLevel): [number, number] {
  const halfWidth = SIGMAS[level] * limits.ns.sigma;
  return [limits.ns.mean - halfWidth, limits.ns.mean + halfWidth];
}

/**
 * First-order slow-roll predictions of V ∝ φ^p at N e-folds, for reference curves on the n_s–r
 * plane: n_s = 1 − 2(p+2)/(4N+p), r = 16p/(4N+p) (Liddle & Lyth 2000, from ε_V and η_V of φ^p).
 */
export function monomialPrediction(p: number, nStar: number): { ns: number; r: number } {
  return { ns: 1 - (2 * (p + 2)) / (4 * nStar + p), r: (16 * p) / (4 * nStar + p) };
}

/**
 * Leading-order plateau (Starobinsky / α-attractor) predictions: n_s = 1 − 2/N, r = 12α/N²
 * (Kallosh, Linde & Roest 2013, arXiv:1311.0472).
 */
export function attractorPrediction(alpha: number, nStar: number): { ns: number; r: number } {
  return { ns: 1 - 2 / nStar, r: (12 * alpha) / (nStar * nStar) };
}
