import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { confidenceOf, deltaChi2, deltaChi2Threshold, rAtSetPivot, rSigma, SIGMA_CONFIDENCE_LEVELS, sigmaThresholds } from './delta-chi2.js';
import { findLikelihoodSet } from './likelihood-sets.js';

const planck = findLikelihoodSet('planck18')!;
const planckBk = findLikelihoodSet('planck18-bk18')!;

describe('Δχ² of a point', () => {
  it('is 0 at the set maximum (mean n_s, r = 0) and sums the Gaussian terms', () => {
    expect(deltaChi2(planckBk, { ns: 0.9649, r: 0 })).toEqual({ deltaChi2: 0, terms: 2 });
    // One σ in n_s and r at its 95% limit: 1 + 1.96² (half-Gaussian with σ_r = r95/1.96, derived).
    const oneEach = deltaChi2(planckBk, { ns: 0.9649 + 0.0042, r: 0.036 })!;
    expect(oneEach.deltaChi2).toBeCloseTo(1 + 1.959964 ** 2, 9);
    expect(rSigma(planckBk)).toBeCloseTo(0.036 / 1.959964, 12);
  });

  it('adds the α_s term only when the set has α_s and the point a finite α_s', () => {
    const point = { ns: 0.9649, r: 0, alphaS: -0.0045 + 0.0067 };
    expect(deltaChi2(planck, point)).toEqual({ deltaChi2: expect.closeTo(1, 12), terms: 3 });
    expect(deltaChi2(planck, { ...point, alphaS: null })).toEqual({ deltaChi2: 0, terms: 2 });
    expect(deltaChi2(planck, { ...point, alphaS: Number.NaN })).toEqual({ deltaChi2: 0, terms: 2 });
    expect(deltaChi2(planckBk, point)).toEqual({ deltaChi2: 0, terms: 2 });
  });

  it('gives nothing for a point without n_s or r, and zero likelihood for r < 0', () => {
    expect(deltaChi2(planck, { ns: Number.NaN, r: 0.01 })).toBeNull();
    expect(deltaChi2(planck, { ns: 0.96, r: Number.POSITIVE_INFINITY })).toBeNull();
    expect(deltaChi2(planck, { ns: 0.96, r: -1e-3 })!.deltaChi2).toBe(Infinity);
  });

  it('Starobinsky at N = 55 lies inside the 68% joint region of Planck 2018 + BK18 (fixture (0.96498, 0.00350), derived)', () => {
    // Check value only; the published verdict (Planck 2018 X §5, from memory) is tested with the API.
    const { deltaChi2: d } = deltaChi2(planckBk, { ns: 0.96498, r: 0.0035 })!;
    expect(confidenceOf(d, 2)).toBeLessThan(0.6827);
  });
});

describe('confidence levels of Δχ²', () => {
  it('k = 2 thresholds are 2.30 / 6.18 / 11.83 (Numerical Recipes §15.6, from memory), and closed form 1 − e^(−x/2)', () => {
    const [t68, t95, t997] = sigmaThresholds(2);
    expect(t68).toBeCloseTo(2.3, 2);
    expect(t95).toBeCloseTo(6.18, 2);
    expect(t997).toBeCloseTo(11.83, 2);
    SIGMA_CONFIDENCE_LEVELS.forEach((level, i) => {
      const t = sigmaThresholds(2)[i];
      expect(-2 * Math.log(1 - level)).toBeCloseTo(t, 10);
      expect(confidenceOf(t, 2)).toBeCloseTo(1 - Math.exp(-t / 2), 12);
      expect(confidenceOf(t, 2)).toBeCloseTo(level, 10);
    });
  });

  it('k = 1 thresholds are 1, 4, 9: the CDF is erf(√(x/2)) (closed form)', () => {
    expect(sigmaThresholds(1).map((t) => Number(t.toFixed(6)))).toEqual([1, 4, 9]);
    for (const x of [0.3, 1, 2.7, 4, 9, 16]) expect(confidenceOf(x, 1)).toBeCloseTo(jStat.erf(Math.sqrt(x / 2)), 10);
  });

  it('agrees with jstat, an independent implementation, for k = 1…4', () => {
    for (const k of [1, 2, 3, 4]) {
      for (const x of [0.1, 1, 2.3, 6.18, 11.83, 25]) expect(confidenceOf(x, k)).toBeCloseTo(jStat.chisquare.cdf(x, k), 9);
      for (const p of [0.5, 0.95, 0.9973]) expect(deltaChi2Threshold(p, k)).toBeCloseTo(jStat.chisquare.inv(p, k), 6);
    }
    // The usual "exactly 95%" values: 3.84 (k = 1), 5.99 (k = 2).
    expect(deltaChi2Threshold(0.95, 1)).toBeCloseTo(3.84, 2);
    expect(deltaChi2Threshold(0.95, 2)).toBeCloseTo(5.99, 2);
  });

  it('is 0 at Δχ² = 0 and 1 at infinity', () => {
    expect(confidenceOf(0, 2)).toBe(0);
    expect(confidenceOf(Infinity, 2)).toBe(1);
  });
});

describe('r at the set\'s pivot', () => {
  it('moves r from 0.05 to 0.002 Mpc⁻¹ by the tensor and scalar tilts: r_0.002 ≈ 0.91 r_0.05 for n_s = 0.965, r = 0.04 (check-values §1, derived)', () => {
    const planck = findLikelihoodSet('planck18')!;
    expect(rAtSetPivot(planck, 0.965, 0.04) / 0.04).toBeCloseTo(0.04 ** 0.03, 12);
    expect(rAtSetPivot(planck, 0.965, 0.04) / 0.04).toBeCloseTo(0.91, 2);
    // A set quoted at the engine's pivot leaves r as it is.
    expect(rAtSetPivot(findLikelihoodSet('planck18-bk18')!, 0.965, 0.04)).toBe(0.04);
  });
});
