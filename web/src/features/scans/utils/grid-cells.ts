import type { ScanGrid, ScanGridSlice } from '@sixtyfold/shared';

type SliceCut = Pick<ScanGridSlice, 'x' | 'y' | 'at'>;
type SliceAxis = ScanGridSlice['x'];

/** The axis indices cell i of a slice axis covers: from its first index for `count` values. */
export function cellSpan(axis: Pick<SliceAxis, 'from' | 'to' | 'block'>, i: number): { first: number; count: number } {
  const first = axis.from + i * axis.block;
  return { first, count: Math.min(axis.block, axis.to - first + 1) };
}

/** Axis indices of the first point of cell (ix, iy), in the scan's axis order; other axes at the slice's cut. */
function sliceCell(grid: ScanGrid, slice: SliceCut, ix: number, iy: number): number[] {
  return grid.axes.map(({ parameter }) =>
    parameter === slice.x.parameter ? cellSpan(slice.x, ix).first : parameter === slice.y.parameter ? cellSpan(slice.y, iy).first : (slice.at[parameter]?.index ?? 0),
  );
}

/** The point index of cell (ix, iy) of a slice: its point, or the first point of its block. */
export function cellPointIndex(grid: ScanGrid, slice: SliceCut, ix: number, iy: number): number {
  return grid.indexOf(sliceCell(grid, slice, ix, iy));
}

/** A row-major column of a slice as rows [iy][ix], as Plotly draws a heatmap. */
export function cellRows<T>(slice: Pick<ScanGridSlice, 'x' | 'y'>, column: readonly T[]): T[][] {
  const nx = slice.x.values.length;
  return Array.from({ length: slice.y.values.length }, (_, iy) => column.slice(iy * nx, (iy + 1) * nx));
}

/** How a slice's cells are drawn, stated on the plot: single points, or which statistic of which blocks. */
export function cellStatistic(slice: Pick<ScanGridSlice, 'x' | 'y' | 'output'>): string {
  if (slice.x.block * slice.y.block === 1) return 'one point per cell';
  const blocks = `blocks of ${slice.x.block} × ${slice.y.block} points`;
  return slice.output === 'status' ? `${blocks}: any OK point` : `${blocks}: mean`;
}

/**
 * What colours each cell: `ok` when it has an OK point, else its most frequent failure code,
 * null when none of its points is stored yet. A block with some OK points shows their value.
 */
export function cellStates(slice: Pick<ScanGridSlice, 'x' | 'y' | 'ok' | 'failed'>): (string | null)[] {
  const reasons = Object.entries(slice.failed);
  return slice.ok.map((ok, c) => {
    if (ok > 0) return 'ok';
    let state: string | null = null;
    let most = 0;
    for (const [reason, counts] of reasons) if (counts[c] > most) [state, most] = [reason, counts[c]];
    return state;
  });
}

/** Which cells of a slice hold a point listed in `byPoint` (comment counts by point index, say). */
export function markedCells(grid: ScanGrid, slice: SliceCut, byPoint: Record<string, number>): boolean[][] | null {
  if (Object.keys(byPoint).length === 0) return null;
  const names = grid.axes.map((axis) => axis.parameter);
  const xa = names.indexOf(slice.x.parameter);
  const ya = names.indexOf(slice.y.parameter);
  const marks = Array.from({ length: slice.y.values.length }, () => new Array<boolean>(slice.x.values.length).fill(false));
  for (const [key, count] of Object.entries(byPoint)) {
    const index = Number(key);
    if (!(count > 0) || !(Number.isInteger(index) && index >= 0 && index < grid.size)) continue;
    const cell = grid.indices(index);
    const onCut = names.every((name, a) => a === xa || a === ya || cell[a] === (slice.at[name]?.index ?? 0));
    const inside = (axis: SliceAxis, i: number) => i >= axis.from && i <= axis.to;
    if (onCut && inside(slice.x, cell[xa]) && inside(slice.y, cell[ya])) {
      marks[Math.floor((cell[ya] - slice.y.from) / slice.y.block)][Math.floor((cell[xa] - slice.x.from) / slice.x.block)] = true;
    }
  }
  return marks;
}

export interface FailureGroup {
  reason: string;
  count: number;
}

/** Failures by status code, the most frequent first. */
export function failureGroups(counts: Record<string, number>): FailureGroup[] {
  return Object.entries(counts).filter(([, count]) => count > 0).map(([reason, count]) => ({ reason, count })).sort((a, b) => b.count - a.count || a.reason.localeCompare(b.reason));
}

/** A slice's failed points by status code, over all its cells. */
export function failedByReason(slice: Pick<ScanGridSlice, 'failed'>): Record<string, number> {
  return Object.fromEntries(Object.entries(slice.failed).map(([reason, column]) => [reason, column.reduce((n, c) => n + c, 0)]));
}

export interface CellCounts {
  ok: number;
  failed: number;
  missing: number;
}

/** Points of the slice's window that are OK, failed and not stored yet. */
export function cellCounts(slice: Pick<ScanGridSlice, 'x' | 'y' | 'ok' | 'failed'>): CellCounts {
  const sum = (column: readonly number[]) => column.reduce((n, c) => n + c, 0);
  const ok = sum(slice.ok);
  const failed = Object.values(slice.failed).reduce((n, column) => n + sum(column), 0);
  const points = (slice.x.to - slice.x.from + 1) * (slice.y.to - slice.y.from + 1);
  return { ok, failed, missing: points - ok - failed };
}

/** True when the values are positive with one ratio between neighbours: a log-spaced axis. */
export function isLogSpaced(values: number[]): boolean {
  if (values.length < 3 || values.some((v) => !(v > 0))) return false;
  const ratio = values[1] / values[0];
  if (Math.abs(ratio - 1) < 1e-9) return false;
  const linear = values.every((v, i) => i === 0 || Math.abs(v - values[i - 1] - (values[1] - values[0])) <= 1e-9 * Math.abs(values[values.length - 1]));
  return !linear && values.every((v, i) => i === 0 || Math.abs(v / values[i - 1] / ratio - 1) < 1e-6);
}

/** The [min, max] of the finite numbers of several slices (their blocks' extremes), for one colour scale across panels or scans. */
export function zRangeOf(slices: Pick<ScanGridSlice, 'mean' | 'min' | 'max'>[]): [number, number] | undefined {
  let min = Infinity;
  let max = -Infinity;
  for (const slice of slices)
    for (const column of [slice.min ?? slice.mean ?? [], slice.max ?? slice.mean ?? []])
      for (const value of column) {
        if (value === null || !Number.isFinite(value)) continue;
        if (value < min) min = value;
        if (value > max) max = value;
      }
  return min <= max ? [min, max] : undefined;
}

/** True when two slices cover the same cells (while a slider moves or a zoom loads, one may still be the old slice). */
export function sameCells(a: SliceCut, b: SliceCut): boolean {
  const sameAxis = (p: SliceAxis, q: SliceAxis) => p.parameter === q.parameter && p.from === q.from && p.to === q.to && p.block === q.block;
  if (!sameAxis(a.x, b.x) || !sameAxis(a.y, b.y)) return false;
  const names = Object.keys(a.at);
  return names.length === Object.keys(b.at).length && names.every((name) => a.at[name].index === b.at[name]?.index);
}

/** A zoom window in axis indices, inclusive; null is the whole slice. */
export interface SliceWindow {
  xFrom: number;
  xTo: number;
  yFrom: number;
  yTo: number;
}

/**
 * The axis-index window of a drag over a heatmap, from the x and y ranges Plotly reports in cell
 * coordinates (cell i spans i ± ½): every cell the ranges touch, in full. Null when the ranges
 * miss the slice.
 */
export function zoomWindow(slice: SliceCut, xRange: [number, number], yRange: [number, number]): SliceWindow | null {
  const span = (axis: SliceAxis, [a, b]: [number, number]) => {
    const cells = axis.values.length;
    const low = Math.max(0, Math.round(Math.min(a, b)));
    const high = Math.min(cells - 1, Math.round(Math.max(a, b)));
    if (low > high) return null;
    const first = cellSpan(axis, low).first;
    const last = cellSpan(axis, high);
    return [first, last.first + last.count - 1] as const;
  };
  const x = span(slice.x, xRange);
  const y = span(slice.y, yRange);
  return x && y ? { xFrom: x[0], xTo: x[1], yFrom: y[0], yTo: y[1] } : null;
}
