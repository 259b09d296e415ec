import { describe, expect, it } from 'vitest';
import { deltaChi2, deltaChi2Threshold, findLikelihoodSet, RequestEvaluator } from '../src/index.js';

// Published verdicts on models, reproduced by the engine and the built-in likelihood sets. The
// wording is from memory of Planck 2018 X §5 (Planck Collaboration 2020, A&A 641, A10,
// arXiv:1807.06211), which judged against Planck + BK15; the sets here use BICEP/Keck 2018
// (r_0.05 < 0.036), tighter than BK15, so the verdicts hold at least as strongly.

const engine = new RequestEvaluator();
const judge = (set: string, potential: string, nStar: number, params: Record<string, number> = {}) => {
  const point = engine.evaluate({ potential, params, nStar, method: 'exact' });
  expect(point.status).toBe('ok');
  return deltaChi2(findLikelihoodSet(set)!, { ns: point.ns!, r: point.r! })!;
};
// Joint regions of the two parameters (n_s, r): Δχ² thresholds 2.30 (68.3 %) and 6.18 (95.4 %), Wilks / Numerical Recipes §15.6.
const in2 = (level: number) => deltaChi2Threshold(level, 2);

describe('published verdicts under the built-in sets', () => {
  it('φ² with 50 ≤ N_* ≤ 60 lies outside the 95 % region of Planck 2018 + BICEP/Keck (from memory: Planck 2018 X §5)', () => {
    for (const nStar of [50, 55, 60]) expect(judge('planck18-bk18', 'monomial', nStar, { p: 2 }).deltaChi2).toBeGreaterThan(in2(0.954));
  });

  it('Starobinsky R² at N_* = 55 lies inside the 68 % region of Planck 2018 + BICEP/Keck (from memory: Planck 2018 X §5)', () => {
    expect(judge('planck18-bk18', 'starobinsky', 55).deltaChi2).toBeLessThan(in2(0.683));
  });

  it('under P-ACT-LB (n_s = 0.974 ± 0.003), Starobinsky at N_* = 55 falls outside 95 %, and comes inside 68 % only near N_* = 65', () => {
    // n_s ≈ 1 − 2/N for R² (Starobinsky 1980; Mukhanov, Chibisov 1981): 0.9649 at N = 55 is 3σ below 0.974,
    // and 1 − 2/65 = 0.969 is within 1.7σ (closed form; the engine's exact values differ in the fourth digit).
    expect(judge('pact-lb-bk18', 'starobinsky', 55).deltaChi2).toBeGreaterThan(in2(0.954));
    expect(judge('pact-lb-bk18', 'starobinsky', 65).deltaChi2).toBeLessThan(in2(0.683));
  });
});
