import { describe, expect, it } from 'vitest';
import { inputSortedOrder } from './input-order.js';
import { ScanGrid } from './scan-grid.js';

const range = (parameter: string, min: number, max: number, count: number) => ({ kind: 'range' as const, parameter, min, max, count, spacing: 'linear' as const });

/** The order by sorting every point: by the axis value, ties by point index (what SQL's ORDER BY value, point_index gives). */
function sortedByValue(grid: ScanGrid, axis: number): number[] {
  const indices = Array.from({ length: grid.size }, (_, i) => i);
  const value = (i: number) => grid.values[axis][grid.indices(i)[axis]];
  return indices.sort((a, b) => value(a) - value(b) || a - b);
}

describe('a grid sorted by one input', () => {
  it('is the order of sorting every point by that input, ties by index, for each axis of a 3-axis grid', () => {
    const grid = new ScanGrid([range('p', 1, 3, 4), { kind: 'list', parameter: 'f', values: [7, 5, 9] }, range('nStar', 60, 50, 5)]);
    for (let axis = 0; axis < 3; axis++) {
      const pointAt = inputSortedOrder(grid, axis)!;
      expect(Array.from({ length: grid.size }, (_, k) => pointAt(k))).toEqual(sortedByValue(grid, axis));
    }
  });

  it('declines an axis that repeats a value', () => {
    const grid = new ScanGrid([{ kind: 'list', parameter: 'f', values: [5, 7, 5] }, range('nStar', 50, 60, 3)]);
    expect(inputSortedOrder(grid, 0)).toBeNull();
    expect(inputSortedOrder(grid, 1)).not.toBeNull();
  });
});
