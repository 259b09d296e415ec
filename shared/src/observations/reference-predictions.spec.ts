import { describe, expect, it } from 'vitest';
import { attractorPrediction, monomialPrediction } from './reference-predictions.js';

describe('reference predictions', () => {
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
