import type { ScanAxis } from '../schemas/scan.schema.js';
import { axisValues } from '../scans/scan-grid.js';

/**
 * One axis of a refinement lattice. Level 0 is the parent grid's axis (L values); level k splits
 * every interval into f^k, so it has (L − 1)·f^k + 1 nodes. Node j of level k sits at base position
 * t = j / f^k, interpolated between the base values around it: in ln x on a log-spaced range axis,
 * in x otherwise (a linear range or a strictly monotone list). So a node of level k is also node
 * j·f of level k + 1, and every point of every level has integer coordinates on the finest level.
 */
export class LatticeAxis {
  readonly base: readonly number[];
  readonly logSpaced: boolean;

  constructor(
    readonly axis: ScanAxis,
    readonly factor: number,
  ) {
    if (!(Number.isInteger(factor) && factor >= 1 && factor <= 4)) throw new RangeError(`${axis.parameter}: the factor must be 1, 2, 3 or 4`);
    this.base = axisValues(axis);
    this.logSpaced = axis.kind === 'range' && axis.spacing === 'log';
    if (this.base.length < 2) throw new RangeError(`${axis.parameter}: an axis with one value has no cells to refine`);
    if (axis.kind === 'list') {
      const rising = this.base[1] > this.base[0];
      for (let i = 1; i < this.base.length; i++) {
        const step = this.base[i] - this.base[i - 1];
        if (rising ? !(step > 0) : !(step < 0)) throw new RangeError(`${axis.parameter}: a list axis can be refined only when its values strictly rise or fall`);
      }
    }
  }

  /** Nodes along this axis at `level`. */
  length(level: number): number {
    return (this.base.length - 1) * this.factor ** level + 1;
  }

  /** The value at coordinate `coord` (may be fractional) of `level`; exactly the parent's value on its nodes. */
  valueAt(level: number, coord: number): number {
    const t = coord / this.factor ** level;
    const i = Math.floor(t);
    if (i === t && i >= 0 && i < this.base.length) return this.base[i];
    const lo = Math.min(Math.max(i, 0), this.base.length - 2);
    const s = t - lo;
    const a = this.base[lo];
    const b = this.base[lo + 1];
    return this.logSpaced ? a * (b / a) ** s : a + s * (b - a);
  }
}

/** The lattice of a refinement: the parent's axes with a factor each, up to `depth` levels. */
export class RefinementLattice {
  readonly axes: LatticeAxis[];

  constructor(
    parentAxes: readonly ScanAxis[],
    readonly factors: readonly number[],
    readonly depth: number,
  ) {
    if (factors.length !== parentAxes.length) throw new RangeError(`give one factor per axis (${parentAxes.length}), not ${factors.length}`);
    if (!(Number.isInteger(depth) && depth >= 1 && depth <= 4)) throw new RangeError('the depth must be 1 to 4 levels');
    if (factors.every((f) => f === 1)) throw new RangeError('split at least one axis (a factor of 2 to 4)');
    this.axes = parentAxes.map((axis, a) => new LatticeAxis(axis, factors[a]));
  }

  get dims(): number {
    return this.axes.length;
  }

  /** Coordinates of `level` on the finest level (`depth`): integer arithmetic only. */
  toFinest(level: number, coords: readonly number[]): number[] {
    return coords.map((c, a) => c * this.axes[a].factor ** (this.depth - level));
  }

  /** Parameter values of the node at integer coordinates of `level`. */
  values(level: number, coords: readonly number[]): number[] {
    return coords.map((c, a) => this.axes[a].valueAt(level, c));
  }

  /** Nodes per axis at `level`. */
  lengths(level: number): number[] {
    return this.axes.map((axis) => axis.length(level));
  }
}

/** A node's key on the finest level: its coordinates joined, the one way mesh maps are keyed. */
export function nodeKey(finestCoords: readonly number[]): string {
  return finestCoords.join(',');
}
