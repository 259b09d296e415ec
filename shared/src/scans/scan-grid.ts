import type { CreateScan, PointList, ScanAxis } from '../schemas/scan.schema.js';

/** The values along one axis, in order. */
export function axisValues(axis: ScanAxis): number[] {
  if (axis.kind === 'list') return [...axis.values];
  const { min, max, count, spacing } = axis;
  if (count === 1) return [min];
  const values: number[] = [];
  for (let i = 0; i < count; i++) {
    const t = i / (count - 1);
    values.push(spacing === 'log' ? min * (max / min) ** t : min + t * (max - min));
  }
  // Land exactly on the ends the user typed, whatever the rounding of the steps.
  values[count - 1] = max;
  return values;
}

export function axisLength(axis: ScanAxis): number {
  return axis.kind === 'list' ? axis.values.length : axis.count;
}

/** Number of points of a scan: the product of its axis lengths, or the rows of its point list. */
export function pointCount(spec: Pick<CreateScan, 'axes' | 'pointList'>): number {
  return scanPoints(spec).size;
}

/** The inputs a scan varies, in order: its axes' parameters or its point list's columns. */
export function variedInputs(spec: Pick<CreateScan, 'axes' | 'pointList'>): string[] {
  return spec.pointList ? [...spec.pointList.columns] : (spec.axes ?? []).map((axis) => axis.parameter);
}

/** The message for a scan over its limit, saying by how much; null when it fits. */
export function pointLimitProblem(count: number, limit: number, whose: string): string | null {
  if (count <= limit) return null;
  const f = (n: number) => n.toLocaleString('en-US');
  return `This scan has ${f(count)} points, ${f(count - limit)} more than ${whose} limit of ${f(limit)}`;
}

/**
 * Expands scan points by index: point i takes, for each axis, the value at its digit of i in
 * the mixed radix of the axis lengths (last axis fastest). Nothing is materialised, so a
 * million-point scan costs nothing until a chunk asks for its points.
 */
export class ScanGrid {
  readonly values: number[][];
  readonly lengths: number[];
  readonly size: number;

  constructor(readonly axes: ScanAxis[]) {
    this.values = axes.map(axisValues);
    this.lengths = this.values.map((v) => v.length);
    this.size = this.lengths.reduce((n, l) => n * l, 1);
  }

  /** Axis indices of point `index`. */
  indices(index: number): number[] {
    const out = new Array<number>(this.lengths.length);
    let rest = index;
    for (let a = this.lengths.length - 1; a >= 0; a--) {
      out[a] = rest % this.lengths[a];
      rest = Math.floor(rest / this.lengths[a]);
    }
    return out;
  }

  /** The point index of the cell at axis indices `cell` (one per axis): the inverse of indices(). */
  indexOf(cell: readonly number[]): number {
    if (cell.length !== this.lengths.length) throw new RangeError(`a cell of this grid has ${this.lengths.length} axis indices, not ${cell.length}`);
    return cell.reduce((index, i, a) => {
      if (!(Number.isInteger(i) && i >= 0 && i < this.lengths[a])) throw new RangeError(`axis ${a} has ${this.lengths[a]} values, so index ${i} is outside it`);
      return index * this.lengths[a] + i;
    }, 0);
  }

  /**
   * The point indices of a 2-D slice, as [iy][ix]: axis `x` and axis `y` run over all their
   * values, every other axis a stays at `cell[a]` (the entries for x and y are ignored).
   */
  sliceIndices(x: number, y: number, cell: readonly number[]): number[][] {
    if (x === y) throw new RangeError('x and y must be different axes');
    const at = [...cell];
    return Array.from({ length: this.lengths[y] }, (_, iy) =>
      Array.from({ length: this.lengths[x] }, (_, ix) => {
        at[x] = ix;
        at[y] = iy;
        return this.indexOf(at);
      }),
    );
  }

  /** The axis values of point `index`, by axis parameter name. */
  point(index: number): Record<string, number> {
    if (!(index >= 0 && index < this.size && Number.isInteger(index))) throw new RangeError(`point ${index} is outside the grid of ${this.size}`);
    const idx = this.indices(index);
    const point: Record<string, number> = {};
    this.axes.forEach((axis, a) => {
      point[axis.parameter] = this.values[a][idx[a]];
    });
    return point;
  }
}

/** A scan's points given one by one: point i is row i of the list, by column name. */
export class ScanPointList {
  readonly size: number;

  constructor(readonly list: PointList) {
    this.size = list.rows.length;
  }

  /** The values of point `index`, by column name. */
  point(index: number): Record<string, number> {
    if (!(index >= 0 && index < this.size && Number.isInteger(index))) throw new RangeError(`point ${index} is outside the list of ${this.size}`);
    const row = this.list.rows[index];
    const point: Record<string, number> = {};
    this.list.columns.forEach((name, c) => {
      point[name] = row[c];
    });
    return point;
  }
}

/** What a scan's points are, grid or list: the varied values of point i, and how many there are. */
export type ScanPoints = ScanGrid | ScanPointList;

/** The points of a scan, from its axes or its point list; callers need not know which. */
export function scanPoints(spec: Pick<CreateScan, 'axes' | 'pointList'>): ScanPoints {
  return spec.pointList ? new ScanPointList(spec.pointList) : new ScanGrid(spec.axes ?? []);
}
