import { describe, expect, it } from 'vitest';
import type { PosteriorAxis } from './grid-axes.js';
import { bayesFactor, evidenceStrength, gridEvidence } from './evidence.js';

const linear = (name: string, min: number, max: number, count: number): PosteriorAxis => ({
  name,
  values: Array.from({ length: count }, (_, i) => min + ((max - min) * i) / (count - 1)),
});

function gaussian2D(count: number, sx: number, sy: number) {
  const x = linear('x', -0.1, 0.1, count);
  const y = linear('y', -0.15, 0.15, count);
  const chi2 = new Float64Array(count * count);
  x.values.forEach((xv, i) => y.values.forEach((yv, j) => (chi2[i * count + j] = (xv / sx) ** 2 + (yv / sy) ** 2)));
  return { axes: [x, y], deltaChi2: chi2 };
}

describe('grid evidence', () => {
  it('a 2-D Gaussian inside a uniform box has Z = 2πσ_xσ_y / A (derived analytic fixture)', () => {
    const sx = 0.01;
    const sy = 0.02;
    const exact = (2 * Math.PI * sx * sy) / (0.2 * 0.3);
    const evidence = gridEvidence(gaussian2D(200, sx, sy));
    const relativeError = Math.abs(evidence.z / exact - 1);
    // At 200 × 200 (σ_x spans 10 cells) the sum is exact to round-off: a Gaussian well inside the box
    // is summed by the trapezoid-like cell weights with an error ~ exp(−2π²σ²/h²).
    expect(relativeError).toBeLessThan(1e-9);
    expect(evidence.lnZError).toBeLessThan(1e-9);
  });

  it('on a coarse grid the half-resolution estimate bounds the real error', () => {
    // Spacing 2σ: a visible error; at half resolution (4σ) a larger one.
    const x = linear('x', -20, 20, 21);
    const evidence = gridEvidence({ axes: [x], deltaChi2: x.values.map((v) => v * v) });
    const exact = Math.sqrt(2 * Math.PI) / 40;
    const realError = Math.abs(evidence.lnZ - Math.log(exact));
    expect(realError).toBeGreaterThan(1e-3);
    expect(evidence.lnZError).toBeGreaterThan(realError);
  });

  it('a flat likelihood gives Z = 1 and ln B = 0 between two scans, whatever their grids', () => {
    const a = gridEvidence({ axes: [linear('x', 0, 1, 11)], deltaChi2: Array(11).fill(0) });
    const b = gridEvidence({ axes: [linear('p', 1, 6, 7), linear('n', 50, 60, 3)], deltaChi2: Array(21).fill(0) });
    expect(a.lnZ).toBeCloseTo(0, 12);
    expect(bayesFactor(a.lnZ, b.lnZ)).toEqual({ lnB: expect.closeTo(0, 12), twoLnB: expect.closeTo(0, 12), favoured: expect.any(String), strength: 'not worth more than a bare mention', words: expect.any(String) });
  });

  it('leaves failed points out of the mean instead of counting them as L = 0', () => {
    const evidence = gridEvidence({ axes: [linear('x', 0, 1, 5)], deltaChi2: [0, null, 0, Number.NaN, 0] });
    expect(evidence.z).toBeCloseTo(1, 12);
    expect([evidence.included, evidence.excluded]).toEqual([3, 2]);
  });

  it('does not underflow when every point is far from the set maximum', () => {
    const evidence = gridEvidence({ axes: [linear('x', 0, 1, 3)], deltaChi2: [3000, 3000, 3000] });
    expect(evidence.lnZ).toBeCloseTo(-1500, 9);
  });

  it('widening the prior range of a contained likelihood lowers ln Z by ln(area ratio) (prior dependence)', () => {
    const narrow = gridEvidence({ axes: [linear('x', -10, 10, 401)], deltaChi2: linear('x', -10, 10, 401).values.map((x) => x * x) });
    const wide = gridEvidence({ axes: [linear('x', -20, 20, 801)], deltaChi2: linear('x', -20, 20, 801).values.map((x) => x * x) });
    expect(narrow.lnZ - wide.lnZ).toBeCloseTo(Math.log(2), 9);
  });
});

describe('Kass & Raftery (1995) words on 2 ln B (from memory)', () => {
  it('0–2 bare mention, 2–6 positive, 6–10 strong, > 10 very strong', () => {
    expect([1, 2.5, 7, 12].map(evidenceStrength)).toEqual(['not worth more than a bare mention', 'positive', 'strong', 'very strong']);
  });

  it('say which model is favoured, both ways', () => {
    expect(bayesFactor(-1, -4)).toMatchObject({ lnB: 3, twoLnB: 6, favoured: 'model', strength: 'strong', words: 'strong evidence for the model over the reference' });
    expect(bayesFactor(-4, -1)).toMatchObject({ lnB: -3, favoured: 'reference', words: 'strong evidence for the reference over the model' });
    expect(bayesFactor(0, 0).words).toBe('no preference between the model and the reference');
  });
});
