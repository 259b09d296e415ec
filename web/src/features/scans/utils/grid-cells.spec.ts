import { ScanGrid } from '@sixtyfold/shared';
import { naturalSpec, slice } from '@/testing/scan-fixtures';
import type { ScanGridSlice } from '@sixtyfold/shared';
import { cellCounts, cellPointIndex, cellStates, cellStatistic, failedByReason, failureGroups, isLogSpaced, markedCells, sameCells, zoomWindow, zRangeOf } from './grid-cells';

/** A whole axis at one point per cell, or in blocks of `block` values. */
const axis = (parameter: string, values: number[], block = 1) => ({
  parameter, length: values.length, from: 0, to: values.length - 1, block, values: values.filter((_, i) => i % block === 0),
});

describe('point index of a slice cell', () => {
  it('places a heatmap cell on every axis, the others at the slice’s cut', () => {
    const grid = new ScanGrid([
      { kind: 'list', parameter: 'a', values: [1, 2, 3] },
      { kind: 'range', parameter: 'b', min: 0, max: 1, count: 4, spacing: 'linear' },
      { kind: 'list', parameter: 'c', values: [7, 8] },
    ]);
    const cut = { x: axis('c', [7, 8]), y: axis('a', [1, 2, 3]), at: { b: { index: 3, value: 1 } } };
    // Cell (ix 1, iy 2) is a at index 2, b at 3, c at 1.
    expect(cellPointIndex(grid, cut, 1, 2)).toBe(2 * 8 + 3 * 2 + 1);
    const natural = new ScanGrid(naturalSpec.axes!);
    // x = N_* (fast axis), y = f: cell (ix 1, iy 2) is f = 10, N_* = 55.
    expect(natural.point(cellPointIndex(natural, slice('ns', [], []), 1, 2))).toEqual({ f: 10, nStar: 55 });
  });
});

describe('marked cells', () => {
  it('marks the cells whose point is listed, at the slice’s cut of a third axis', () => {
    const grid = new ScanGrid([
      { kind: 'list', parameter: 'a', values: [1, 2] },
      { kind: 'list', parameter: 'b', values: [5, 6, 7] },
      { kind: 'list', parameter: 'c', values: [8, 9] },
    ]);
    const cut = { x: axis('b', [5, 6, 7]), y: axis('a', [1, 2]), at: { c: { index: 1, value: 9 } } };
    // Point 9 is a = 2, b = 6, c = 9 (1·6 + 1·2 + 1); point 4 has c = 8, off this cut.
    expect(markedCells(grid, cut, { '9': 2, '4': 1 })).toEqual([
      [false, false, false],
      [false, true, false],
    ]);
    expect(markedCells(grid, cut, {})).toBeNull();
    // In blocks of 2 × 2 points, point 9 lies in the block of b 5–6 (first cell) and a 1–2.
    expect(markedCells(grid, { ...cut, x: axis('b', [5, 6, 7], 2), y: axis('a', [1, 2], 2) }, { '9': 1 })).toEqual([[true, false]]);
  });

  it('opens the first point of a block', () => {
    const grid = new ScanGrid([
      { kind: 'list', parameter: 'a', values: [1, 2, 3, 4] },
      { kind: 'list', parameter: 'b', values: [5, 6, 7, 8, 9] },
    ]);
    // Cell (ix 1, iy 1) in blocks of 2 × 3 starts at b index 3 and a index 2.
    expect(cellPointIndex(grid, { x: axis('b', [5, 6, 7, 8, 9], 3), y: axis('a', [1, 2, 3, 4], 2), at: {} }, 1, 1)).toBe(2 * 5 + 3);
  });
});

describe('failed and missing cells', () => {
  const status = [
    ['ok', 'insufficient_efolds', null],
    ['no_end', 'insufficient_efolds', 'ok'],
    ['insufficient_efolds', null, 'ok'],
  ];

  it('groups failures by reason, most frequent first, leaving ok and missing cells out', () => {
    const cells = slice('status', [], status);
    expect(failureGroups(failedByReason(cells))).toEqual([
      { reason: 'insufficient_efolds', count: 3 },
      { reason: 'no_end', count: 1 },
    ]);
    expect(cellCounts(cells)).toEqual({ ok: 3, failed: 4, missing: 2 });
  });

  it('colours a block by its OK points, else by its most frequent failure, and counts its missing points', () => {
    // Two blocks of 2 × 2 points over a 3 × 2 window (the second block holds 1 × 2 points).
    const blocks: ScanGridSlice = {
      x: axis('b', [5, 6, 7], 2), y: axis('a', [1, 2], 2), output: 'ns', at: {},
      mean: [null, 0.96], min: [null, 0.95], max: [null, 0.97],
      ok: [0, 2],
      failed: { no_end: [1, 0], insufficient_efolds: [2, 0] },
    };
    expect(cellStates(blocks)).toEqual(['insufficient_efolds', 'ok']);
    expect(cellCounts(blocks)).toEqual({ ok: 2, failed: 3, missing: 1 });
    expect(cellStatistic(blocks)).toBe('blocks of 2 × 2 points: mean');
    expect(cellStatistic(slice('ns', [[0.96]], [['ok']]))).toBe('one point per cell');
    expect(zRangeOf([blocks])).toEqual([0.95, 0.97]);
  });
});

describe('axis spacing, colour ranges and matching slices', () => {
  it('tells log-spaced values from linear ones and lists', () => {
    expect(isLogSpaced([1e-3, 1e-2, 1e-1, 1])).toBe(true);
    expect(isLogSpaced([50, 55, 60])).toBe(false);
    expect(isLogSpaced([5, 7, 10])).toBe(false);
    expect(isLogSpaced([0, 1, 10])).toBe(false);
  });

  it('takes one colour range over several slices, ignoring empty cells', () => {
    expect(zRangeOf([slice('ns', [[0.95, null]], [['ok', null]]), slice('ns', [[0.97, 0.96]], [['ok', 'ok']])])).toEqual([0.95, 0.97]);
    expect(zRangeOf([slice('ns', [[null]], [[null]])])).toBeUndefined();
  });

  it('combines slices only when they cut the other axes at the same place', () => {
    const at3 = { x: axis('a', [1]), y: axis('b', [1]), at: { c: { index: 3, value: 0.3 } } };
    expect(sameCells(at3, { ...at3 })).toBe(true);
    expect(sameCells(at3, { ...at3, x: { ...at3.x, block: 2 } })).toBe(false);
    expect(sameCells(at3, { ...at3, at: { c: { index: 4, value: 0.4 } } })).toBe(false);
    expect(sameCells(at3, { ...at3, x: at3.y, y: at3.x })).toBe(false);
  });
});

describe('zooming by dragging', () => {
  it('takes every cell a drag touches, in axis indices, whole blocks included', () => {
    const full = { x: axis('b', [5, 6, 7, 8, 9]), y: axis('a', [1, 2, 3, 4]), at: {} };
    // Cell i spans i ± ½: a drag from 0.7 to 2.2 touches cells 1 and 2.
    expect(zoomWindow(full, [0.7, 2.2], [3.4, 1.6])).toEqual({ xFrom: 1, xTo: 2, yFrom: 2, yTo: 3 });
    // Blocks of 2: cell 1 of x is indices 2–3, the last cell of 5 values index 4 alone.
    const blocks = { x: axis('b', [5, 6, 7, 8, 9], 2), y: axis('a', [1, 2, 3, 4], 2), at: {} };
    expect(zoomWindow(blocks, [0.6, 9], [-Infinity, Infinity])).toEqual({ xFrom: 2, xTo: 4, yFrom: 0, yTo: 3 });
    expect(zoomWindow(full, [7, 9], [0, 1])).toBeNull();
  });
});
