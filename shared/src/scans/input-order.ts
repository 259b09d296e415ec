import type { ScanGrid } from './scan-grid.js';

/**
 * A grid's points sorted by one axis's value, ties by point index: the order of a points page
 * sorted by that input. It follows from the axes alone: the axis's values in increasing order,
 * and under each value the points of the other axes in their own order. `pointAt(k)` is the
 * point index at position k. Null when the axis repeats a value (a list may), since the points
 * of equal values then interleave by index.
 */
export function inputSortedOrder(grid: ScanGrid, axis: number): ((position: number) => number) | null {
  const values = grid.values[axis];
  const digits = [...values.keys()].sort((a, b) => values[a] - values[b] || a - b);
  for (let k = 1; k < digits.length; k++) if (values[digits[k]] === values[digits[k - 1]]) return null;
  const length = grid.lengths[axis];
  const stride = grid.lengths.slice(axis + 1).reduce((n, l) => n * l, 1);
  const perValue = grid.size / length;
  return (position) => {
    const digit = digits[Math.floor(position / perValue)];
    const rest = position % perValue;
    return Math.floor(rest / stride) * length * stride + digit * stride + (rest % stride);
  };
}
