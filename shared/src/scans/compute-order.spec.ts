import { describe, expect, it } from 'vitest';
import { ComputeOrder, computeOrder } from './compute-order.js';
import { ScanGrid } from './scan-grid.js';

const range = (parameter: string, count: number) => ({ kind: 'range' as const, parameter, min: 1, max: 2, count, spacing: 'linear' as const });

describe('the compute order of a scan', () => {
  it('is the index order when the shared axes are already last, or there are none', () => {
    expect(new ComputeOrder([3, 4], [false, true]).identity).toBe(true);
    expect(new ComputeOrder([3, 4], [false, false]).identity).toBe(true);
    expect(new ComputeOrder([3, 4], [true, true]).identity).toBe(true);
    expect(new ComputeOrder([3, 4], [true, false]).identity).toBe(false);
  });

  it('visits every point once, and positionOf inverts pointAt', () => {
    const order = new ComputeOrder([3, 5, 4], [true, false, true]);
    const seen = new Set<number>();
    for (let position = 0; position < 60; position++) {
      const index = order.pointAt(position);
      expect(order.positionOf(index)).toBe(position);
      seen.add(index);
    }
    expect(seen.size).toBe(60);
    expect(Math.min(...seen)).toBe(0);
    expect(Math.max(...seen)).toBe(59);
  });

  it('runs an N_* axis given first fastest, so consecutive positions differ only in N_*', () => {
    const spec = { axes: [range('nStar', 4), range('p', 3)], sharedBackgroundAxes: ['nStar'] };
    const order = computeOrder(spec);
    const grid = new ScanGrid(spec.axes);
    const visited = Array.from({ length: 12 }, (_, position) => grid.point(order.pointAt(position)));
    // Positions 0–3 are the four N_* values at the first p, 4–7 at the second, …
    for (let position = 0; position < 12; position++) {
      expect(visited[position].p).toBe(grid.values[1][Math.floor(position / 4)]);
      expect(visited[position].nStar).toBe(grid.values[0][position % 4]);
    }
  });

  it('keeps the index order for scans stored without the field, and for point lists', () => {
    expect(computeOrder({ axes: [range('nStar', 4), range('p', 3)] }).identity).toBe(true);
    const list = { columns: ['nStar', 'p'], rows: [[50, 1], [60, 2]] };
    const order = computeOrder({ pointList: list, sharedBackgroundAxes: ['nStar'] });
    expect([order.pointAt(0), order.pointAt(1)]).toEqual([0, 1]);
  });
});
