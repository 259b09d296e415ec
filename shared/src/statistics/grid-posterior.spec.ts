import { describe, expect, it } from 'vitest';
import { SIGMA_CONFIDENCE_LEVELS } from './delta-chi2.js';
import { axisCells, posteriorAxes, type PosteriorAxis } from './grid-axes.js';
import { gridPosterior } from './grid-posterior.js';

const linear = (name: string, min: number, max: number, count: number): PosteriorAxis => ({
  name,
  values: Array.from({ length: count }, (_, i) => min + ((max - min) * i) / (count - 1)),
  spacing: 'linear',
});
const logSpaced = (name: string, min: number, max: number, count: number): PosteriorAxis => ({
  name,
  values: Array.from({ length: count }, (_, i) => min * (max / min) ** (i / (count - 1))),
  spacing: 'log',
});
/** Δχ² over a grid (last axis fastest), from a function of the point's values. */
function gridOf(axes: PosteriorAxis[], f: (...x: number[]) => number | null) {
  const size = axes.reduce((n, a) => n * a.values.length, 1);
  const out: (number | null)[] = [];
  for (let p = 0; p < size; p++) {
    let rest = p;
    const x = new Array<number>(axes.length);
    for (let a = axes.length - 1; a >= 0; a--) {
      x[a] = axes[a].values[rest % axes[a].values.length];
      rest = Math.floor(rest / axes[a].values.length);
    }
    out.push(f(...x));
  }
  return out;
}

describe('prior weights', () => {
  it('are cell widths in the prior variable, half cells at the ends', () => {
    expect([...axisCells({ name: 'x', values: [0, 1, 3, 4] }).widths]).toEqual([0.5, 1.5, 1.5, 0.5]);
    const log = axisCells({ name: 'x', values: [1, 10, 100], spacing: 'log' });
    expect(log.prior).toBe('log');
    [Math.LN10 / 2, Math.LN10, Math.LN10 / 2].forEach((w, i) => expect(log.widths[i]).toBeCloseTo(w, 12));
    // A list axis in any order: widths follow the values, not the positions.
    expect([...axisCells({ name: 'x', values: [3, 0, 1] }).widths]).toEqual([1, 0.5, 1.5]);
  });

  it('default to log for log-spaced axes, uniform otherwise, and can be changed', () => {
    const axes = posteriorAxes([
      { kind: 'range', parameter: 'alpha', min: 0.01, max: 100, count: 5, spacing: 'log' },
      { kind: 'list', parameter: 'nStar', values: [50, 55, 60] },
    ]);
    expect(axes.map((a) => axisCells(a).prior)).toEqual(['log', 'uniform']);
    expect(axisCells({ ...axes[0], prior: 'uniform' }).prior).toBe('uniform');
  });

  it('refuse a log prior over values that are not positive, naming the axis', () => {
    expect(() => axisCells({ name: 'p', values: [0, 1, 2], prior: 'log' })).toThrow('axis p needs values above 0 for a log prior');
  });
});

describe('grid posterior', () => {
  it('a 1-D Gaussian posterior has its 68.3% interval at ±1σ and its 95.4% at ±2σ, to the grid resolution', () => {
    // Analytic fixture: L = exp(−x²/2) on a uniform prior that contains it; the interval is ±1σ (±2σ).
    const axis = linear('x', -10, 10, 201);
    const posterior = gridPosterior({ axes: [axis], deltaChi2: gridOf([axis], (x) => x * x) }, { levels: [...SIGMA_CONFIDENCE_LEVELS.slice(0, 2)] });
    const [one, two] = posterior.constraints[0].intervals;
    expect(one.kind).toBe('two-sided');
    expect(Math.abs(one.lower + 1)).toBeLessThan(0.1);
    expect(Math.abs(one.upper - 1)).toBeLessThan(0.1);
    expect(Math.abs(two.lower + 2)).toBeLessThan(0.1);
    expect(Math.abs(two.upper - 2)).toBeLessThan(0.1);
    expect(posterior.constraints[0].edgeWarning).toBeNull();
    expect(posterior.bestFit).toEqual({ index: 100, deltaChi2: 0, point: { x: 0 } });
    // Mass sums to 1; the density integrates to 1 and peaks at 1/√(2π).
    expect(posterior.marginals[0].mass.reduce((s, m) => s + m, 0)).toBeCloseTo(1, 12);
    expect(posterior.marginals[0].density[100]).toBeCloseTo(1 / Math.sqrt(2 * Math.PI), 3);
  });

  it('a flat likelihood: a uniform prior gives a flat marginal, a log prior one ∝ 1/x (closed forms)', () => {
    const axis = logSpaced('x', 1, 100, 401);
    const flat = gridOf([axis], () => 0);
    const logPrior = gridPosterior({ axes: [axis], deltaChi2: flat });
    const uniformPrior = gridPosterior({ axes: [{ ...axis, prior: 'uniform' }], deltaChi2: flat });
    const middle = 200; // x = 10
    expect(logPrior.marginals[0].prior).toBe('log');
    expect(logPrior.marginals[0].density[middle]).toBeCloseTo(1 / (10 * Math.log(100)), 4);
    expect(logPrior.marginals[0].density[100] / logPrior.marginals[0].density[300]).toBeCloseTo(10, 2);
    expect(uniformPrior.marginals[0].density[middle]).toBeCloseTo(1 / 99, 6);
    expect(uniformPrior.marginals[0].density[100]).toBeCloseTo(1 / 99, 6);
    // Flat posteriors peak at the lower end: upper limits, at x₆₈ = 100^0.68 (log) and 1 + 0.68·99 (uniform).
    const [log68] = logPrior.constraints[0].intervals;
    const [uniform68] = uniformPrior.constraints[0].intervals;
    expect(log68).toEqual({ level: 0.68, kind: 'upper-limit', lower: 1, upper: expect.closeTo(100 ** 0.68, 9) });
    expect(uniform68.upper).toBeCloseTo(1 + 0.68 * 99, 9);
  });

  it('leaves out failed and flagged points, counting them, never as zero likelihood', () => {
    const x = linear('x', 0, 4, 5);
    const y = linear('y', 0, 1, 3);
    // A flat likelihood with x = 1 failed at every y and one more point flagged.
    const chi2 = gridOf([x, y], (xv, yv) => (xv === 1 || (xv === 3 && yv === 0.5) ? null : 0));
    const posterior = gridPosterior({ axes: [x, y], deltaChi2: chi2 });
    expect(posterior.excluded.count).toBe(4);
    expect(posterior.included).toBe(11);
    // Prior volume: x widths 0.5,1,1,1,0.5 (total 4), y widths 0.25,0.5,0.25 (total 1): (1·1 + 1·0.5)/4.
    expect(posterior.excluded.priorFraction).toBeCloseTo(1.5 / 4, 12);
    // Marginal of x: nothing at x = 1, and the others in proportion to their included prior volume.
    const mass = posterior.marginals[0].mass;
    expect(mass[1]).toBe(0);
    const total = 0.5 + 0.5 + 1 + 0.5; // x = 0, 2, 3 (half its y cells), 4; sum of included w
    expect(mass[0]).toBeCloseTo(0.5 / total, 12);
    expect(mass[2]).toBeCloseTo(1 / total, 12);
    expect(mass[3]).toBeCloseTo(0.5 / total, 12);
    // y = 0.5 keeps x = 0, 2, 4 (x widths 0.5 + 1 + 0.5) times its y width 0.5. (Within the posterior, leaving a
    // point out and L = 0 agree; they differ in the evidence's prior volume, see evidence.spec.ts.)
    expect(posterior.marginals[1].mass[1]).toBeCloseTo((2 * 0.5) / total, 12);
  });

  it('warns when the 95% region reaches the end of an axis', () => {
    const alpha = linear('α', 1, 30, 30);
    const cut = gridPosterior({ axes: [alpha], deltaChi2: gridOf([alpha], (a) => (a - 29) ** 2) });
    expect(cut.constraints[0].edgeWarning).toBe('the 95% region reaches α = 30, the end of the axis: widen it');
    const inside = gridPosterior({ axes: [alpha], deltaChi2: gridOf([alpha], (a) => (a - 15) ** 2) });
    expect(inside.constraints[0].edgeWarning).toBeNull();
    // A plateau running into the low end (peak inside): the 95% highest-density region holds α = 1, so
    // the data bound α only from above there: an upper limit at 95% (common practice), and the warning.
    const plateau = gridPosterior({ axes: [alpha], deltaChi2: gridOf([alpha], (a) => (a < 5 ? 0.5 : a <= 10 ? 0 : ((a - 10) / 2) ** 2)) });
    expect(plateau.constraints[0].intervals[1]).toMatchObject({ kind: 'upper-limit', lower: 1 });
    expect(plateau.constraints[0].edgeWarning).toBe('the 95% region reaches α = 1, the end of the axis: widen it');
    // The 68% region of that plateau: still one-sided, its mass sits on the plateau from the end.
    expect(plateau.constraints[0].intervals[0].kind).toBe('upper-limit');
    // A lower shelf (Δχ² = 1.2 below α = 5) that the 68% highest-density region leaves out but the 95% one
    // holds: one kind per axis, decided by the widest level, so both are upper limits, the 68% one the tighter.
    const shelf = gridPosterior({ axes: [alpha], deltaChi2: gridOf([alpha], (a) => (a < 5 ? 1.2 : a <= 10 ? 0 : ((a - 10) / 2) ** 2)) });
    const [shelf68, shelf95] = shelf.constraints[0].intervals;
    expect([shelf68.kind, shelf95.kind]).toEqual(['upper-limit', 'upper-limit']);
    expect(shelf68.upper).toBeLessThan(shelf95.upper);
    // A posterior piled at the low end gives an upper limit and warns about that end.
    const low = gridPosterior({ axes: [alpha], deltaChi2: gridOf([alpha], (a) => ((a - 1) / 5) ** 2) });
    expect(low.constraints[0].intervals[1].kind).toBe('upper-limit');
    expect(low.constraints[0].edgeWarning).toBe('the 95% region reaches α = 1, the end of the axis: widen it');
  });

  it('the 2-D marginal of a 2-D Gaussian: its 68% and 95% highest-density regions bound density (1 − level) × peak', () => {
    // For a 2-D Gaussian the region of mass p is Δχ² ≤ −2 ln(1 − p), where the density is (1 − p) of the peak (derived).
    const x = linear('x', -6, 6, 241);
    const y = linear('y', -12, 12, 241);
    const nuisance = linear('z', 0, 1, 3);
    const posterior = gridPosterior({ axes: [nuisance, x, y], deltaChi2: gridOf([nuisance, x, y], (_z, xv, yv) => xv * xv + (yv / 2) ** 2) }, { pair: [1, 2] });
    const pair = posterior.pair!;
    expect([pair.x, pair.y]).toEqual(['x', 'y']);
    expect(pair.mass.reduce((s, m) => s + m, 0)).toBeCloseTo(1, 12);
    const peak = Math.max(...pair.density);
    for (const { level, density } of pair.contourDensity) expect(density / peak).toBeCloseTo(1 - level, 2);
    // Best fit and intervals of y: σ_y = 2.
    expect(posterior.bestFit.point).toMatchObject({ x: 0, y: 0 });
    const [y68] = posterior.constraints[2].intervals;
    expect(y68.upper).toBeCloseTo(2 * 0.994458, 1);
  });

  it('refuses grids it cannot weigh, with a message', () => {
    const x = linear('x', 0, 1, 3);
    expect(() => gridPosterior({ axes: [x], deltaChi2: [0, 0] })).toThrow('the grid has 3 points but 2 Δχ² values were given');
    expect(() => gridPosterior({ axes: [x], deltaChi2: [null, null, Number.NaN] })).toThrow('every point failed or was flagged');
    expect(() => gridPosterior({ axes: [x, x], deltaChi2: Array(9).fill(0) }, { pair: [0, 0] })).toThrow('two different axes');
  });
});
