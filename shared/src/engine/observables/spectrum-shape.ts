/**
 * How far the scalar spectrum departs from a power law with running across the stencil: the
 * largest residual of the least-squares fit ln P = a + b x + c x² over the stencil's points
 * (x = ln k/k_*). A smooth spectrum leaves only its third derivative (β_s d³/6 ~ 1e-9) and the
 * integration's noise (~1e-8 in ln P); a step or an oscillation across the stencil leaves its
 * own size. The residual is in ln P, i.e. a fraction of P.
 */
export function powerLawResidual(lnK: readonly number[], lnP: readonly number[]): number {
  const n = lnK.length;
  // Normal equations of the quadratic fit, solved by Cramer's rule (3 × 3).
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0, s4 = 0, t0 = 0, t1 = 0, t2 = 0;
  for (let i = 0; i < n; i++) {
    const x = lnK[i];
    const x2 = x * x;
    s0 += 1; s1 += x; s2 += x2; s3 += x2 * x; s4 += x2 * x2;
    t0 += lnP[i]; t1 += x * lnP[i]; t2 += x2 * lnP[i];
  }
  const det = (a: number, b: number, c: number, d: number, e: number, f: number, g: number, h: number, k: number) =>
    a * (e * k - f * h) - b * (d * k - f * g) + c * (d * h - e * g);
  const D = det(s0, s1, s2, s1, s2, s3, s2, s3, s4);
  const a = det(t0, s1, s2, t1, s2, s3, t2, s3, s4) / D;
  const b = det(s0, t0, s2, s1, t1, s3, s2, t2, s4) / D;
  const c = det(s0, s1, t0, s1, s2, t1, s2, s3, t2) / D;
  let worst = 0;
  for (let i = 0; i < n; i++) {
    const x = lnK[i];
    worst = Math.max(worst, Math.abs(lnP[i] - (a + b * x + c * x * x)));
  }
  return worst;
}

/**
 * Residuals above this are a feature, not a power law. Every smooth built-in family over its
 * parameter corners at N_* = 50–60 stays below 3e-8; a residual ε biases n_s by ~ε/0.1, so 1e-5
 * keeps that bias below 1e-4.
 */
export const FEATURE_RESIDUAL = 1e-5;
