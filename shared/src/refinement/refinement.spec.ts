import { describe, expect, it } from 'vitest';
import type { ScanAxis } from '../schemas/scan.schema.js';
import { gridEvidence } from '../statistics/evidence.js';
import { posteriorAxes } from '../statistics/grid-axes.js';
import { gridPosterior } from '../statistics/grid-posterior.js';
import { boundaryDistance, boundaryLevel } from './refinement-boundary.js';
import { nodeKey, RefinementLattice } from './refinement-lattice.js';
import { cornerMean, isCrossed, refinedCells, refineInProcess, RefinementMesh } from './refinement-mesh.js';
import { meshEvidence, meshPosterior } from './mesh-posterior.js';

const range = (parameter: string, min: number, max: number, count: number, spacing: 'linear' | 'log' = 'linear'): ScanAxis => ({ kind: 'range', parameter, min, max, count, spacing });

describe('refinement lattice', () => {
  it('places level-k nodes by interpolating in ln x on a log axis and in x on a linear one (closed form)', () => {
    const lattice = new RefinementLattice([range('alpha', 1, 100, 3, 'log'), range('nStar', 0, 1, 3)], [2, 3], 2);
    expect(lattice.lengths(2)).toEqual([(3 - 1) * 4 + 1, (3 - 1) * 9 + 1]);
    const [alpha, nStar] = lattice.axes;
    for (let j = 0; j <= 8; j++) expect(alpha.valueAt(2, j)).toBeCloseTo(10 ** (j / 4), 12);
    for (let j = 0; j <= 18; j++) expect(nStar.valueAt(2, j)).toBeCloseTo(j / 18, 14);
    // The parent's nodes are its own values exactly, on every level.
    expect(alpha.valueAt(2, 4)).toBe(10);
    expect(lattice.toFinest(1, [1, 2])).toEqual([2, 6]);
  });

  it('interpolates a monotone list axis in the value and refuses one that turns back', () => {
    const list: ScanAxis = { kind: 'list', parameter: 'p', values: [4, 2, 1] };
    const axis = new RefinementLattice([list], [2], 1).axes[0];
    expect([0, 1, 2, 3, 4].map((j) => axis.valueAt(1, j))).toEqual([4, 3, 2, 1.5, 1]);
    expect(() => new RefinementLattice([{ kind: 'list', parameter: 'p', values: [1, 3, 2] }], [2], 1)).toThrow(/strictly rise or fall/);
    expect(() => new RefinementLattice([range('x', 0, 1, 1)], [2], 1)).toThrow(/one value/);
    expect(() => new RefinementLattice([range('x', 0, 1, 3)], [1], 1)).toThrow(/split at least one axis/);
  });
});

describe('crossed cells', () => {
  it('of the linear field x − 0.35 on an 11 × 6 grid are the one column of cells holding x = 0.35, split into the right new nodes', () => {
    const lattice = new RefinementLattice([range('x', 0, 1, 11), range('y', 0, 1, 6)], [2, 3], 1);
    const mesh = new RefinementMesh(lattice, []);
    const x = (key: string) => (Number(key.split(',')[0]) / 2) * 0.1;
    const next = mesh.nextLevel((key) => x(key) - 0.35);
    // Cells [0.3, 0.4] × every y interval: 5 cells with lowest corner x index 3.
    expect(next.cells).toEqual([0, 1, 2, 3, 4].map((j) => [3, j]));
    // Level 1 has 21 × 16 nodes; the column of 5 cells spans x 6..8 (3 values) and y 0..15 (16 values):
    // 48 nodes, less the parent's nodes among them (x 6 and 8 at y 0, 3, …, 15: 2 × 6 = 12).
    expect(next.nodes).toHaveLength(48 - 12);
    expect(new Set(next.nodes.map((n) => nodeKey(n))).size).toBe(next.nodes.length);
    expect(next.nodes.every(([i, j]) => !(i % 2 === 0 && j % 3 === 0))).toBe(true);

    // Merged, the split column is 5 × 2 × 3 leaves of level 1 for a heatmap, each with its corners' mean of x.
    const merged = new RefinementMesh(lattice, [next.cells]);
    const values = new Map<string, number | null>();
    for (const leaf of merged.leaves()) for (const key of merged.cornerKeys(leaf)) values.set(key, x(key));
    const cells = refinedCells(merged, values, { xFrom: 0, xTo: 10, yFrom: 0, yTo: 5 });
    expect(cells).toHaveLength(30);
    expect(cells[0]).toMatchObject({ level: 1, x: [6, 7], y: [0, 1] });
    expect(cells[0].corners.map((v) => v!.toFixed(12))).toEqual(['0.300000000000', '0.350000000000', '0.300000000000', '0.350000000000']);
    expect(cornerMean(cells[0].corners)).toBeCloseTo(0.325, 12);
    expect(cells[0].failure).toBeNull();
    // A failed corner is unknown and names its reason; the mean is of the known corners.
    values.delete('7,1');
    const withFailure = refinedCells(merged, values, { xFrom: 0, xTo: 10, yFrom: 0, yTo: 5 }, new Map([['7,1', 'no_end']]));
    expect(withFailure[0]).toMatchObject({ corners: [expect.any(Number), expect.any(Number), expect.any(Number), null], failure: 'no_end' });
    expect(cornerMean(withFailure[0].corners)).toBeCloseTo((0.3 + 0.35 + 0.3) / 3, 12);
    expect(refinedCells(merged, values, { xFrom: 0, xTo: 2, yFrom: 0, yTo: 5 })).toEqual([]);
  });

  it('counts a cell with a failed corner as crossed unless its known corners lie far on one side', () => {
    expect(isCrossed([1, 2, -1, 3])).toBe(true);
    expect(isCrossed([1, 2, 1.5, 3])).toBe(false);
    // Known corners 1, 1.1, 1.2: each farther from 0 than their spread (0.2), so the failed corner is taken to be on their side.
    expect(isCrossed([1, null, 1.1, 1.2])).toBe(false);
    // 0.1 is nearer the boundary than the known corners differ (0.4): we cannot tell.
    expect(isCrossed([0.1, null, 0.5, 0.3])).toBe(true);
    expect(isCrossed([null, null, null, 5])).toBe(true);
    expect(isCrossed([null, null, null, null])).toBe(true);
  });

  it('puts a likelihood boundary at Δχ² = 2.30 or 6.18 (two parameters, χ² quantiles) and an output boundary at its value', () => {
    expect(boundaryLevel({ kind: 'likelihood', likelihood: 'planck18', level: 68 })).toBeCloseTo(2.2957, 3);
    expect(boundaryLevel({ kind: 'likelihood', likelihood: 'planck18', level: 95 })).toBeCloseTo(6.1801, 3);
    expect(boundaryDistance({ kind: 'output', output: 'ns', value: 0.965 }, 0.96)).toBeCloseTo(-0.005, 12);
    expect(boundaryDistance({ kind: 'output', output: 'ns', value: 0.965 }, null)).toBeNull();
  });
});

/** A 2-D Gaussian Δχ² = ((x − x0)/σx)² + ((y − y0)/σy)², with point failures where `fails` says. */
function gaussian(sx: number, sy: number, x0 = 0, y0 = 0) {
  return ([x, y]: number[]) => ((x - x0) / sx) ** 2 + ((y - y0) / sy) ** 2;
}

describe('multi-resolution posterior', () => {
  it('equals the uniform-grid posterior and evidence when nothing is refined (same trapezoid weights)', () => {
    const axes = [range('alpha', 0.1, 10, 17, 'log'), range('nStar', 45, 65, 13)];
    const chi2 = ([a, n]: number[]) => ((Math.log(a) - 0.4) / 0.7) ** 2 + ((n - 57) / 4) ** 2;
    const lattice = new RefinementLattice(axes, [2, 2], 2);
    const mesh = new RefinementMesh(lattice, []);
    const map = new Map<string, number | null>();
    const flat: (number | null)[] = [];
    for (let i = 0; i < 17; i++) {
      for (let j = 0; j < 13; j++) {
        // A few failed points: left out of both sums, on the grid and on the mesh alike.
        const value = (i * 13 + j) % 29 === 5 ? null : chi2(lattice.values(0, [i, j]));
        map.set(nodeKey(lattice.toFinest(0, [i, j])), value);
        flat.push(value);
      }
    }
    const uniform = gridPosterior({ axes: posteriorAxes(axes), deltaChi2: flat });
    const merged = meshPosterior(mesh, map);
    expect(merged.bestFit).toEqual(uniform.bestFit);
    expect(merged.included).toBe(uniform.included);
    expect(merged.excluded.count).toBe(uniform.excluded.count);
    expect(merged.excluded.priorFraction).toBeCloseTo(uniform.excluded.priorFraction, 12);
    merged.marginals.forEach((m, a) => {
      expect(m.values).toEqual(uniform.marginals[a].values);
      m.mass.forEach((x, i) => expect(x).toBeCloseTo(uniform.marginals[a].mass[i], 12));
    });
    merged.constraints.forEach((c, a) =>
      c.intervals.forEach((interval, k) => {
        expect(interval.kind).toBe(uniform.constraints[a].intervals[k].kind);
        expect(interval.lower).toBeCloseTo(uniform.constraints[a].intervals[k].lower, 10);
        expect(interval.upper).toBeCloseTo(uniform.constraints[a].intervals[k].upper, 10);
      }),
    );
    merged.pair!.mass.forEach((x, c) => expect(x).toBeCloseTo(uniform.pair!.mass[c], 12));
    const evidence = meshEvidence(mesh, map);
    const gridZ = gridEvidence({ axes: posteriorAxes(axes), deltaChi2: flat });
    expect(evidence.lnZ).toBeCloseTo(gridZ.lnZ, 12);
    expect(evidence.lnZHalf).toBeCloseTo(gridZ.lnZHalf, 12);
  });

  it('locates a Gaussian\'s ±1σ interval within 0.005σ with the 68 % region refined, closer as the parent grid is made finer (closed form)', () => {
    // A partly refined mesh is a second-order rule: the interior cells keep their spacing, so the
    // interval converges with the parent's spacing h (refinement alone does not remove the interior's error).
    const level = 0.6826894921370859;
    const boundary = { kind: 'likelihood', likelihood: 'test', level: 68 } as const;
    const intervalError = [13, 25, 49].map((count) => {
      const lattice = new RefinementLattice([range('x', -6, 6, count), range('y', -9, 9, count)], [2, 2], 2);
      const { mesh, values } = refineInProcess(lattice, gaussian(1, 1.5, 0.3, -0.2), (d) => boundaryDistance(boundary, d));
      expect(mesh.levels).toBe(2);
      const [interval] = meshPosterior(mesh, values, { levels: [level] }).constraints[0].intervals;
      expect(interval.kind).toBe('two-sided');
      return Math.max(Math.abs(interval.lower - (0.3 - 1)), Math.abs(interval.upper - (0.3 + 1)));
    });
    // Measured: 0.062σ, 0.010σ, 0.0043σ at parent spacings σ, σ/2, σ/4.
    expect(intervalError[1]).toBeLessThan(0.015);
    expect(intervalError[2]).toBeLessThan(0.005);
    expect(intervalError[2]).toBeLessThan(intervalError[0] / 10);
  });

  it('gives the evidence of a Gaussian inside a box, Z = 2πσxσy / A, to second order in the parent spacing, and says how far off it may be (derived)', () => {
    const sx = 0.01;
    const sy = 0.02;
    const boundary = { kind: 'likelihood', likelihood: 'test', level: 95 } as const;
    const exact = (2 * Math.PI * sx * sy) / (0.2 * 0.3);
    const results = [21, 41].map((count) => {
      const lattice = new RefinementLattice([range('x', -0.1, 0.1, count), range('y', -0.15, 0.15, count)], [2, 2], 3);
      const { mesh, values, pointsPerLevel } = refineInProcess(lattice, gaussian(sx, sy), (d) => boundaryDistance(boundary, d));
      const evidence = meshEvidence(mesh, values);
      return { error: Math.abs(evidence.lnZ - Math.log(exact)), stated: evidence.lnZError, points: pointsPerLevel.reduce((s, n) => s + n, 0), count };
    });
    // Spacing σx: within 3 %; spacing σx/2: within 0.5 %, a factor > 4 (second order).
    expect(results[0].error).toBeLessThan(0.03);
    expect(results[1].error).toBeLessThan(0.005);
    expect(results[1].error).toBeLessThan(results[0].error / 4);
    // The stated error (against the parent grid alone) covers the real one.
    for (const r of results) expect(r.stated).toBeGreaterThanOrEqual(r.error * 0.9);
    // Refinement adds points near the boundary only: far fewer than a uniform grid at the finest spacing.
    for (const r of results) expect(r.points).toBeLessThan(((r.count - 1) * 8 + 1) ** 2 * 0.2);
  });
});
