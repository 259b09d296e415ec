import { describe, expect, it } from 'vitest';
import { deltaChi2Threshold, SIGMA_CONFIDENCE_LEVELS } from './delta-chi2.js';
import { insidePolygon, polygonCentroid, RegionLikelihood } from './region-likelihood.js';

const square = (half: number, ns0 = 0.965, r0 = 0.02) => [
  { ns: ns0 - half, r: r0 - half },
  { ns: ns0 + half, r: r0 - half },
  { ns: ns0 + half, r: r0 + half },
  { ns: ns0 - half, r: r0 + half },
];

// Concentric squares, half-sides 0.01 (68.27%) and 0.02 (95.45%), centred at (0.965, 0.02).
const [level68, level95] = SIGMA_CONFIDENCE_LEVELS;
const t1 = deltaChi2Threshold(level68, 2);
const t2 = deltaChi2Threshold(level95, 2);
const likelihood = new RegionLikelihood([
  { confidenceLevel: level95, vertices: square(0.02) },
  { confidenceLevel: level68, vertices: square(0.01) },
]);

describe('uploaded contours as a likelihood', () => {
  it('the thresholds of the two levels are 2.30 and 6.18 (k = 2)', () => {
    expect(t1).toBeCloseTo(2.2957, 4);
    expect(t2).toBeCloseTo(6.1801, 4);
  });

  it('is 0 at the centre and t₁ on the inner outline', () => {
    expect(likelihood.at({ ns: 0.965, r: 0.02 })).toEqual({ deltaChi2: expect.closeTo(0, 12), insideLevel: level68, outside: false });
    expect(likelihood.at({ ns: 0.975, r: 0.02 }).deltaChi2).toBeCloseTo(t1, 9);
  });

  it('inside the inner square, halfway out: √Δχ² = √t₁ / 2 (by hand)', () => {
    expect(likelihood.at({ ns: 0.97, r: 0.02 }).deltaChi2).toBeCloseTo(t1 / 4, 9);
  });

  it('halfway between the squares: √Δχ² = (√t₁ + √t₂) / 2 (by hand)', () => {
    const between = likelihood.at({ ns: 0.965, r: 0.035 });
    expect(between.deltaChi2).toBeCloseTo(((Math.sqrt(t1) + Math.sqrt(t2)) / 2) ** 2, 9);
    expect(between.insideLevel).toBe(level95);
  });

  it('on the outer outline t₂, and outside it the same slope carried on and flagged', () => {
    expect(likelihood.at({ ns: 0.985, r: 0.02 }).deltaChi2).toBeCloseTo(t2, 9);
    // 0.03 from the centre, 0.01 beyond the outer square: √Δχ² = √t₂ · 0.03 / (0.03 − 0.01).
    const outside = likelihood.at({ ns: 0.995, r: 0.02 });
    expect(outside.deltaChi2).toBeCloseTo(t2 * 1.5 ** 2, 9);
    expect(outside).toMatchObject({ insideLevel: null, outside: true });
  });

  it('a single contour also works: √Δχ² grows linearly with distance from its centroid', () => {
    const single = new RegionLikelihood([{ confidenceLevel: 0.95, vertices: square(0.01) }]);
    const t = deltaChi2Threshold(0.95, 2);
    expect(single.at({ ns: 0.97, r: 0.02 }).deltaChi2).toBeCloseTo(t / 4, 9);
    expect(single.at({ ns: 0.985, r: 0.02 }).deltaChi2).toBeCloseTo(4 * t, 9);
  });

  it('refuses contours it cannot interpolate', () => {
    expect(() => new RegionLikelihood([])).toThrow('at least one contour');
    expect(() => new RegionLikelihood([{ confidenceLevel: 0.95, vertices: square(0.01) }, { confidenceLevel: 0.95, vertices: square(0.02) }])).toThrow('share the level');
    // The 68% square sticks out of the 95% one.
    expect(() => new RegionLikelihood([{ confidenceLevel: 0.68, vertices: square(0.01, 0.975) }, { confidenceLevel: 0.95, vertices: square(0.012) }])).toThrow(
      'the 68% contour is not inside the 95% contour; the contours must be nested',
    );
    // A thin C shape whose centroid falls in its gap.
    const cShape = [
      { ns: 0, r: 0 }, { ns: 3, r: 0 }, { ns: 3, r: 0.2 }, { ns: 0.2, r: 0.2 }, { ns: 0.2, r: 2.8 },
      { ns: 3, r: 2.8 }, { ns: 3, r: 3 }, { ns: 0, r: 3 },
    ];
    expect(() => new RegionLikelihood([{ confidenceLevel: 0.68, vertices: cShape }])).toThrow('centroid lies outside');
  });

  it('polygon helpers: centroid of a square, inside test', () => {
    expect(polygonCentroid(square(0.01))).toEqual({ ns: expect.closeTo(0.965, 12), r: expect.closeTo(0.02, 12) });
    expect(insidePolygon({ ns: 0.97, r: 0.02 }, square(0.01))).toBe(true);
    expect(insidePolygon({ ns: 0.98, r: 0.02 }, square(0.01))).toBe(false);
  });
});
