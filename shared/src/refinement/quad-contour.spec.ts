import { describe, expect, it } from 'vitest';
import type { ScanAxis } from '../schemas/scan.schema.js';
import { RefinementLattice } from './refinement-lattice.js';
import { RefinementMesh } from './refinement-mesh.js';
import { joinSegments, levelLine, quadContour, type ContourQuad } from './quad-contour.js';

const range = (parameter: string, min: number, max: number, count: number): ScanAxis => ({ kind: 'range', parameter, min, max, count, spacing: 'linear' });

/** The cells of a regular n × n grid over [−2, 2]², with corner values of f. */
function gridQuads(n: number, f: (x: number, y: number) => number): ContourQuad[] {
  const at = (i: number) => -2 + (4 * i) / n;
  const quads: ContourQuad[] = [];
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const x = [at(i), at(i + 1)] as const;
      const y = [at(j), at(j + 1)] as const;
      quads.push({ x, y, corners: [f(x[0], y[0]), f(x[1], y[0]), f(x[0], y[1]), f(x[1], y[1])] });
    }
  }
  return quads;
}

describe('quadContour', () => {
  it('follows a linear field exactly: every end lies on a·x + b·y = level (closed form, interpolation of a plane is exact)', () => {
    const f = (x: number, y: number) => 0.7 * x - 1.3 * y;
    const segments = levelLine(gridQuads(17, f), 0.4);
    expect(segments.length).toBeGreaterThan(10);
    for (const [x0, y0, x1, y1] of segments) {
      expect(f(x0, y0)).toBeCloseTo(0.4, 12);
      expect(f(x1, y1)).toBeCloseTo(0.4, 12);
    }
  });

  it('draws the unit circle of x² + y² to second order in the cell size, closed and of length 2π (closed form)', () => {
    const errors = [16, 32].map((n) => {
      const segments = levelLine(gridQuads(n, (x, y) => x * x + y * y), 1);
      const radiusError = Math.max(...segments.flatMap(([x0, y0, x1, y1]) => [Math.abs(Math.hypot(x0, y0) - 1), Math.abs(Math.hypot(x1, y1) - 1)]));
      const length = segments.reduce((sum, [x0, y0, x1, y1]) => sum + Math.hypot(x1 - x0, y1 - y0), 0);
      // Closed: each end is shared by exactly two segments.
      const ends = new Map<string, number>();
      for (const [x0, y0, x1, y1] of segments) for (const key of [`${x0.toFixed(12)},${y0.toFixed(12)}`, `${x1.toFixed(12)},${y1.toFixed(12)}`]) ends.set(key, (ends.get(key) ?? 0) + 1);
      expect([...ends.values()].every((count) => count === 2)).toBe(true);
      expect(length).toBeCloseTo(2 * Math.PI, 1);
      return radiusError;
    });
    // Halving the cells quarters the error, give or take (second order).
    expect(errors[1]).toBeLessThan(errors[0] / 3);
    expect(errors[0]).toBeLessThan(0.02);
  });

  it('resolves a saddle by the centre: a positive centre joins corners 0 and 3 and cuts off 1 and 2', () => {
    const quad = (corners: ContourQuad['corners']): ContourQuad => ({ x: [0, 1], y: [0, 1], corners });
    const expectSegments = (got: number[][], want: number[][]) => {
      expect(got).toHaveLength(want.length);
      got.forEach((segment, k) => segment.forEach((v, i) => expect(v).toBeCloseTo(want[k][i], 14)));
    };
    // Centre mean 0.25 ≥ 0, the side of corner 0: the lines cut off corner 1 (bottom–right) and corner 2 (top–left).
    expectSegments(quadContour(quad([1, -1, -1, 2]), 0), [[0.5, 0, 1, 1 / 3], [1 / 3, 1, 0, 0.5]]);
    // Centre mean −0.25 < 0, the side of corners 1 and 2: the lines cut off corner 0 and corner 3.
    expectSegments(quadContour(quad([1, -2, -1, 1]), 0), [[0, 0.5, 1 / 3, 0], [1, 2 / 3, 0.5, 1]]);
  });

  it('draws nothing through a cell with an unknown corner, or one the line misses', () => {
    expect(quadContour({ x: [0, 1], y: [0, 1], corners: [1, null, -1, -1] }, 0)).toEqual([]);
    expect(quadContour({ x: [0, 1], y: [0, 1], corners: [1, 2, 3, Number.NaN] }, 0)).toEqual([]);
    expect(quadContour({ x: [0, 1], y: [0, 1], corners: [1, 2, 3, 4] }, 0)).toEqual([]);
  });

  it('through the leaves of a refined mesh, locates the circle as closely as its finest cells wherever it was refined', () => {
    // A 9 × 9 grid over [−2, 2]², refined twice by 2 where x² + y² = 1 crosses.
    const lattice = new RefinementLattice([range('x', -2, 2, 9), range('y', -2, 2, 9)], [2, 2], 2);
    const value = (key: string) => {
      const [i, j] = key.split(',').map(Number);
      const [x, y] = [lattice.axes[0].valueAt(2, i), lattice.axes[1].valueAt(2, j)];
      return x * x + y * y - 1;
    };
    let mesh = new RefinementMesh(lattice, []);
    for (let k = 0; k < 2; k++) mesh = new RefinementMesh(lattice, [...mesh.refined, mesh.nextLevel(value).cells]);
    const quads = [...mesh.leaves()].map((leaf): ContourQuad => {
      const [x0, y0] = lattice.toFinest(leaf.level, leaf.corner);
      const [x1, y1] = lattice.toFinest(leaf.level, leaf.corner.map((c) => c + 1));
      const corners = mesh.cornerKeys(leaf).map((key) => value(key) + 1) as unknown as ContourQuad['corners'];
      return { x: [lattice.axes[0].valueAt(2, x0), lattice.axes[0].valueAt(2, x1)], y: [lattice.axes[1].valueAt(2, y0), lattice.axes[1].valueAt(2, y1)], corners };
    });
    const worst = (segments: number[][]) => Math.max(...segments.flatMap(([x0, y0, x1, y1]) => [Math.abs(Math.hypot(x0, y0) - 1), Math.abs(Math.hypot(x1, y1) - 1)]));
    const refined = worst(levelLine(quads, 1));
    const coarse = worst(levelLine(gridQuads(8, (x, y) => x * x + y * y), 1));
    const fine = worst(levelLine(gridQuads(32, (x, y) => x * x + y * y), 1));
    // The line runs only through leaves of the finest level, so it is as good as the uniform 32 × 32 grid's.
    expect(refined).toBeLessThan(coarse / 8);
    expect(refined).toBeCloseTo(fine, 10);
  });

  it('joins the pieces of a closed line into one closed polyline, and of two lines into two', () => {
    const circle = levelLine(gridQuads(16, (x, y) => x * x + y * y), 1);
    const [line, ...others] = joinSegments(circle);
    expect(others).toEqual([]);
    expect(line).toHaveLength(circle.length + 1);
    expect(line[0][0]).toBeCloseTo(line.at(-1)![0], 9);
    expect(line[0][1]).toBeCloseTo(line.at(-1)![1], 9);
    // Two separate circles (a field with two minima) stay two lines.
    const twoMinima = levelLine(gridQuads(32, (x, y) => Math.min((x - 1) ** 2 + y * y, (x + 1) ** 2 + y * y)), 0.25);
    expect(joinSegments(twoMinima)).toHaveLength(2);
  });
});
