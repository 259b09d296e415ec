import type { ScanGrid } from '@sixtyfold/shared';

/**
 * A grid scan's axis inputs in SQL from the point index alone: axis a's index of point i is
 * (i DIV stride_a) MOD L_a (last axis fastest, as `ScanGrid`). Every secondary index of
 * `scan_points` carries the point index (InnoDB appends the primary key), so a filter or sort on an
 * input beside a sort or filter on an output walks one index without reading a row; through the
 * `axis_k` columns each candidate costs a row read.
 */
export class GridIndexSql {
  constructor(
    private readonly grid: ScanGrid,
    private readonly table = 'p',
  ) {}

  /** Axis a's index of the row's point. */
  private digit(a: number): string {
    const stride = this.grid.lengths.slice(a + 1).reduce((n, l) => n * l, 1);
    return `((${this.table}.point_index DIV ${stride}) MOD ${this.grid.lengths[a]})`;
  }

  /**
   * An expression that orders rows as axis a's values do, ties by nothing else: the index itself
   * on a rising axis, reversed on a falling one. Null when the values are not strictly monotone
   * (a list may repeat or turn back), where only the value orders them.
   */
  sortKey(a: number): string | null {
    const values = this.grid.values[a];
    const rising = values.every((v, k) => k === 0 || v > values[k - 1]);
    const falling = values.every((v, k) => k === 0 || v < values[k - 1]);
    if (rising) return this.digit(a);
    if (falling) return `(${this.grid.lengths[a] - 1} - ${this.digit(a)})`;
    return null;
  }

  /** The condition min ≤ axis a's value ≤ max (either end optional), as the indices whose values lie inside. */
  range(a: number, min: number | undefined, max: number | undefined): string {
    const inside = this.grid.values[a].flatMap((v, k) => ((min === undefined || v >= min) && (max === undefined || v <= max) ? [k] : []));
    if (inside.length === 0) return '0 = 1';
    if (inside.length === this.grid.lengths[a]) return '1 = 1';
    const contiguous = inside.every((k, j) => j === 0 || k === inside[j - 1] + 1);
    return contiguous ? `${this.digit(a)} BETWEEN ${inside[0]} AND ${inside.at(-1)}` : `${this.digit(a)} IN (${inside.join(', ')})`;
  }
}
