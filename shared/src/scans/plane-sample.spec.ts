import { describe, expect, it } from 'vitest';
import { planeSample } from './plane-sample.js';

describe('planeSample', () => {
  it('keeps every point when they fit', () => {
    expect(planeSample([3, 4], 12)).toEqual({ axisStrides: [1, 1], pointIndices: Array.from({ length: 12 }, (_, i) => i) });
  });

  it('samples a sub-grid, coarsening the axis with the most kept values first', () => {
    // 3 × 10 down to 4: N_* goes to a step of 5 (2 values), then p to a step of 2 (2 values).
    const sample = planeSample([3, 10], 4);
    expect(sample.axisStrides).toEqual([2, 5]);
    expect(sample.pointIndices).toEqual([0, 5, 20, 25]);
  });

  it('spreads a million-point grid evenly over both axes within the limit', () => {
    const { axisStrides, pointIndices } = planeSample([1000, 1000], 20_000);
    // 125 values of the first axis (every 8th) × 143 of the second (every 7th): 17,875 points.
    expect(axisStrides).toEqual([8, 7]);
    expect(pointIndices).toHaveLength(125 * 143);
    // Every kept value of the inner axis appears with every kept value of the outer one.
    expect(new Set(pointIndices.map((i) => i % 1000)).size).toBe(143);
    expect(new Set(pointIndices.map((i) => Math.floor(i / 1000))).size).toBe(125);
    expect(pointIndices.every((i, k) => k === 0 || i > pointIndices[k - 1])).toBe(true);
  });

  it('samples a point list by its order, down to a single point', () => {
    expect(planeSample([10], 3)).toEqual({ axisStrides: [4], pointIndices: [0, 4, 8] });
    expect(planeSample([7, 9], 1)).toEqual({ axisStrides: [7, 9], pointIndices: [0] });
  });
});
