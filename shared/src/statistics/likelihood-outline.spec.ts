import { describe, expect, it } from 'vitest';
import { deltaChi2, deltaChi2Threshold } from './delta-chi2.js';
import { confidenceOutline, likelihoodOutline } from './likelihood-outline.js';
import { findLikelihoodSet } from './likelihood-sets.js';
import { BUILT_IN_LIKELIHOOD_SETS } from './likelihood-sets.js';

describe('a set outline in the (n_s, r) plane', () => {
  it('has Δχ² = t at every vertex (half ellipse, derived)', () => {
    for (const set of BUILT_IN_LIKELIHOOD_SETS) {
      for (const t of [2.3, 6.18]) {
        const vertices = likelihoodOutline(set, t, 50);
        expect(vertices).toHaveLength(51);
        for (const v of vertices) expect(deltaChi2(set, v)!.deltaChi2).toBeCloseTo(t, 9);
      }
    }
  });

  it('spans μ ± σ√t in n_s on r = 0 and reaches σ_r √t at the top', () => {
    const set = findLikelihoodSet('planck18-bk18')!;
    const t = deltaChi2Threshold(0.95, 2);
    const vertices = confidenceOutline(set, 0.95, 4);
    expect(vertices[0]).toEqual({ ns: expect.closeTo(0.9649 + 0.0042 * Math.sqrt(t), 12), r: 0 });
    expect(vertices[2].r).toBeCloseTo((0.036 / 1.959964) * Math.sqrt(t), 12);
    expect(vertices[4].ns).toBeCloseTo(0.9649 - 0.0042 * Math.sqrt(t), 12);
    expect(vertices[4].r).toBeCloseTo(0, 12);
  });

  it('refuses a level that is not positive', () => {
    expect(() => likelihoodOutline(findLikelihoodSet('planck18')!, 0)).toThrow('positive');
  });
});
