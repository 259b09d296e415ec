import { describe, expect, it } from 'vitest';
import { attractorPrediction, findLimits, insideLimits, monomialPrediction, nsInterval } from './observational-limits.js';

describe('observational limits', () => {
  const limits = findLimits();

  it('default set is Planck 2018 n_s with the BICEP/Keck 2018 bound on r', () => {
    // Planck 2018 X (arXiv:1807.06211) abstract: n_s = 0.9649 ± 0.0042; BK18 (arXiv:2110.00483): r_0.05 < 0.036.
    expect(limits.ns).toEqual({ mean: 0.9649, sigma: 0.0042 });
    expect(limits.r.max95).toBe(0.036);
    expect(limits.source).toContain('arXiv:1807.06211');
    expect(limits.source).toContain('arXiv:2110.00483');
  });

  it('95% band is ±1.96σ about the mean', () => {
    const [low, high] = nsInterval(limits, 95);
    expect(low).toBeCloseTo(0.9649 - 1.96 * 0.0042, 4);
    expect(high).toBeCloseTo(0.9649 + 1.96 * 0.0042, 4);
  });

  it('Starobinsky at N = 55 lies inside, φ² at N = 60 outside (r too large)', () => {
    // Fixtures of ../shared/notes/check-values.md §3: Starobinsky N = 55 (0.96498, 0.00350); φ² N = 60 (0.96694, 0.13223).
    expect(insideLimits(0.96498, 0.0035, limits)).toBe(true);
    expect(insideLimits(0.96694, 0.13223, limits)).toBe(false);
    // n_s = 0.975 is 2.4σ above the mean: outside at 95%, as is a red tilt of 0.955.
    expect(insideLimits(0.975, 0.001, limits)).toBe(false);
    expect(insideLimits(0.955, 0.001, limits)).toBe(false);
    expect(insideLimits(0.968, 0.001, limits, 68)).toBe(true);
    expect(insideLimits(0.970, 0.001, limits, 68)).toBe(false);
  });

  it('reference curves reproduce the published closed forms', () => {
    // φ²: N = 60 gives (0.96694, 0.13223); φ⁴ at N = 50 gives (0.94118, 0.31373) (check-values §3, derived).
    const quadratic = monomialPrediction(2, 60);
    expect(quadratic.ns).toBeCloseTo(0.96694, 5);
    expect(quadratic.r).toBeCloseTo(0.13223, 5);
    const quartic = monomialPrediction(4, 50);
    expect(quartic.ns).toBeCloseTo(0.94118, 5);
    expect(quartic.r).toBeCloseTo(0.31373, 5);
    // Leading-order plateau: n_s = 1 − 2/N, r = 12/N² at α = 1 (arXiv:1311.0472).
    const plateau = attractorPrediction(1, 60);
    expect(plateau.ns).toBeCloseTo(1 - 2 / 60, 12);
    expect(plateau.r).toBeCloseTo(12 / 3600, 12);
  });
});
