import { insideLimits, type ConfidenceLevel, type ObservationalLimits, type ScanGrid, type ScanGridSlice } from '@sixtyfold/shared';

/** Axis indices of the cell (ix, iy) of a slice, in the scan's axis order; other axes at the slice's cut. */
function sliceCell(grid: ScanGrid, slice: Pick<ScanGridSlice, 'x' | 'y' | 'at'>, ix: number, iy: number): number[] {
  return grid.axes.map(({ parameter }) => (parameter === slice.x.parameter ? ix : parameter === slice.y.parameter ? iy : (slice.at[parameter]?.index ?? 0)));
}

/** The point index of the cell (ix, iy) of a slice. */
export function cellPointIndex(grid: ScanGrid, slice: Pick<ScanGridSlice, 'x' | 'y' | 'at'>, ix: number, iy: number): number {
  return grid.indexOf(sliceCell(grid, slice, ix, iy));
}

/** Which cells of a slice stand for a point listed in `byPoint` (comment counts by point index, say). */
export function markedCells(grid: ScanGrid, slice: Pick<ScanGridSlice, 'x' | 'y' | 'at'>, byPoint: Record<string, number>): boolean[][] | null {
  if (Object.keys(byPoint).length === 0) return null;
  const names = grid.axes.map((axis) => axis.parameter);
  const points = grid.sliceIndices(names.indexOf(slice.x.parameter), names.indexOf(slice.y.parameter), sliceCell(grid, slice, 0, 0));
  return points.map((row) => row.map((pointIndex) => (byPoint[String(pointIndex)] ?? 0) > 0));
}

export interface FailureGroup {
  reason: string;
  count: number;
}

/** Failed cells grouped by status code, the most frequent first; ok and missing cells are not failures. */
export function failureGroups(status: (string | null)[][]): FailureGroup[] {
  const counts = new Map<string, number>();
  for (const row of status) for (const s of row) if (s !== null && s !== 'ok') counts.set(s, (counts.get(s) ?? 0) + 1);
  return [...counts].map(([reason, count]) => ({ reason, count })).sort((a, b) => b.count - a.count || a.reason.localeCompare(b.reason));
}

export interface CellCounts {
  ok: number;
  failed: number;
  missing: number;
}

export function cellCounts(status: (string | null)[][]): CellCounts {
  const counts = { ok: 0, failed: 0, missing: 0 };
  for (const row of status) for (const s of row) counts[s === null ? 'missing' : s === 'ok' ? 'ok' : 'failed']++;
  return counts;
}

/**
 * Cells whose n_s and r both lie inside the limits (n_s interval × r bound, see insideLimits).
 * The two slices must cover the same cells; failed and missing cells are never inside.
 */
export function insideLimitsMask(ns: ScanGridSlice, r: ScanGridSlice, limits: ObservationalLimits, level: ConfidenceLevel = 95): boolean[][] {
  return ns.z.map((row, iy) =>
    row.map((value, ix) => {
      const rValue = r.z[iy]?.[ix] ?? null;
      return value !== null && rValue !== null && insideLimits(value, rValue, limits, level);
    }),
  );
}

/**
 * The outline of the true cells of a mask as line segments in cell coordinates (cell (ix, iy)
 * spans ix ± ½, iy ± ½), separated by nulls as Plotly draws broken lines. Only edges between an
 * inside cell and an outside one (or the border) are drawn, so regions get one clean outline.
 */
export function outlineSegments(mask: boolean[][]): { x: (number | null)[]; y: (number | null)[] } {
  const x: (number | null)[] = [];
  const y: (number | null)[] = [];
  const inside = (ix: number, iy: number) => mask[iy]?.[ix] === true;
  const edge = (x0: number, y0: number, x1: number, y1: number) => {
    x.push(x0, x1, null);
    y.push(y0, y1, null);
  };
  mask.forEach((row, iy) =>
    row.forEach((cell, ix) => {
      if (!cell) return;
      if (!inside(ix - 1, iy)) edge(ix - 0.5, iy - 0.5, ix - 0.5, iy + 0.5);
      if (!inside(ix + 1, iy)) edge(ix + 0.5, iy - 0.5, ix + 0.5, iy + 0.5);
      if (!inside(ix, iy - 1)) edge(ix - 0.5, iy - 0.5, ix + 0.5, iy - 0.5);
      if (!inside(ix, iy + 1)) edge(ix - 0.5, iy + 0.5, ix + 0.5, iy + 0.5);
    }),
  );
  return { x, y };
}

/** True when the values are positive with one ratio between neighbours: a log-spaced axis. */
export function isLogSpaced(values: number[]): boolean {
  if (values.length < 3 || values.some((v) => !(v > 0))) return false;
  const ratio = values[1] / values[0];
  if (Math.abs(ratio - 1) < 1e-9) return false;
  const linear = values.every((v, i) => i === 0 || Math.abs(v - values[i - 1] - (values[1] - values[0])) <= 1e-9 * Math.abs(values[values.length - 1]));
  return !linear && values.every((v, i) => i === 0 || Math.abs(v / values[i - 1] / ratio - 1) < 1e-6);
}

/** The [min, max] of the finite numbers of several slices, for one colour scale across panels or scans. */
export function zRangeOf(slices: Pick<ScanGridSlice, 'z'>[]): [number, number] | undefined {
  let min = Infinity;
  let max = -Infinity;
  for (const slice of slices)
    for (const row of slice.z)
      for (const value of row) {
        if (value === null || !Number.isFinite(value)) continue;
        if (value < min) min = value;
        if (value > max) max = value;
      }
  return min <= max ? [min, max] : undefined;
}

/** True when two slices cover the same cells (while a slider moves, one may still be the old slice). */
export function sameCells(a: Pick<ScanGridSlice, 'x' | 'y' | 'at'>, b: Pick<ScanGridSlice, 'x' | 'y' | 'at'>): boolean {
  if (a.x.parameter !== b.x.parameter || a.y.parameter !== b.y.parameter) return false;
  if (a.x.values.length !== b.x.values.length || a.y.values.length !== b.y.values.length) return false;
  const names = Object.keys(a.at);
  return names.length === Object.keys(b.at).length && names.every((name) => a.at[name].index === b.at[name]?.index);
}
