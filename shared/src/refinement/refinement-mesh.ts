import { nodeKey, type RefinementLattice } from './refinement-lattice.js';

/** A cell of the mesh: the box between 2^d neighbouring nodes of `level`, named by its lowest corner there. */
export interface MeshCell {
  level: number;
  corner: number[];
}

/** A node's signed distance from a boundary (value − level; Δχ² − threshold), or null when its point failed, was flagged or is not stored. */
export type BoundaryField = (finestKey: string) => number | null;

/** What the next level computes: the cells it splits (on the level before) and its new nodes. */
export interface NextLevel {
  level: number;
  cells: number[][];
  nodes: number[][];
}

/**
 * The multi-resolution mesh of a parent grid and its refinement levels: level 0's cells, of which
 * `refined[k]` (lowest corners on level k) were split into level k + 1's. The leaves — cells not
 * split — tile the parent's box exactly; a refined cell's neighbour may stay coarse (its corners
 * are still nodes, so each leaf is weighed on its own corners).
 */
export class RefinementMesh {
  private readonly refinedKeys: Set<string>[];

  constructor(
    readonly lattice: RefinementLattice,
    readonly refined: readonly (readonly (readonly number[])[])[],
  ) {
    if (refined.length > lattice.depth) throw new RangeError(`the mesh has ${refined.length} levels, more than its depth ${lattice.depth}`);
    this.refinedKeys = refined.map((cells) => new Set(cells.map((c) => nodeKey(c))));
  }

  /** Refinement levels present (0: the parent grid alone). */
  get levels(): number {
    return this.refined.length;
  }

  /** The leaves, coarse first: every level-0 cell, or its children where it was split, recursively. */
  leaves(): MeshCell[] {
    const out: MeshCell[] = [];
    const dims = this.lattice.dims;
    const visit = (level: number, corner: number[]) => {
      if (level < this.levels && this.refinedKeys[level].has(nodeKey(corner))) {
        forEachOffset(this.lattice.axes.map((axis) => axis.factor - 1), (offset) => visit(level + 1, corner.map((c, a) => c * this.lattice.axes[a].factor + offset[a])));
      } else out.push({ level, corner });
    };
    forEachOffset(
      this.lattice.lengths(0).map((n) => n - 2),
      (corner) => visit(0, corner.slice(0, dims)),
    );
    return out;
  }

  /** The finest-level keys of a cell's 2^d corners, in binary order (bit a set: the upper side on axis a). */
  cornerKeys(cell: MeshCell): string[] {
    const dims = this.lattice.dims;
    const keys: string[] = [];
    for (let bits = 0; bits < 1 << dims; bits++) {
      keys.push(nodeKey(this.lattice.toFinest(cell.level, cell.corner.map((c, a) => c + ((bits >> a) & 1)))));
    }
    return keys;
  }

  /**
   * The next level: the newest leaves that the boundary crosses are split by the factors, and their
   * nodes not yet computed (all but the 2^d corners, each once) make the level's points, in
   * coordinates of the new level. Empty at the depth or when no cell is crossed.
   */
  nextLevel(field: BoundaryField): NextLevel {
    const level = this.levels + 1;
    if (level > this.lattice.depth) return { level, cells: [], nodes: [] };
    const cells = this.leaves()
      .filter((leaf) => leaf.level === this.levels && isCrossed(this.cornerKeys(leaf).map(field)))
      .map((leaf) => leaf.corner);
    const factors = this.lattice.axes.map((axis) => axis.factor);
    const seen = new Set<string>();
    const nodes: number[][] = [];
    for (const corner of cells) {
      forEachOffset(factors, (offset) => {
        if (offset.every((o, a) => o === 0 || o === factors[a])) return;
        const node = corner.map((c, a) => c * factors[a] + offset[a]);
        const key = nodeKey(node);
        if (seen.has(key)) return;
        seen.add(key);
        nodes.push(node);
      });
    }
    return { level, cells, nodes };
  }
}

/**
 * Whether a boundary passes through a cell, from its corners' signed distances. Crossed when the
 * known corners do not all share one sign. A corner without a value (failed, flagged) leaves the
 * cell crossed — we do not know its side — unless at least two corners are known, all on one side,
 * and each is farther from the boundary than the known corners differ among themselves: the field
 * would have to change across the cell by more than it does between its known corners.
 */
export function isCrossed(corners: readonly (number | null)[]): boolean {
  const known = corners.filter((v): v is number => v !== null && !Number.isNaN(v));
  if (known.length === 0) return true;
  const below = known.some((v) => v < 0);
  const above = known.some((v) => v >= 0);
  if (below && above) return true;
  if (known.length === corners.length) return false;
  if (known.length < 2) return true;
  const spread = Math.max(...known) - Math.min(...known);
  return !known.every((v) => Math.abs(v) > spread);
}

/** Calls `each` with every offset vector o, 0 ≤ o_a ≤ last[a], last axis fastest (nothing when some last[a] < 0). */
export function forEachOffset(last: readonly number[], each: (offset: number[]) => void): void {
  if (last.some((n) => n < 0)) return;
  const offset = last.map(() => 0);
  for (;;) {
    each([...offset]);
    let a = last.length - 1;
    for (; a >= 0; a--) {
      if (++offset[a] <= last[a]) break;
      offset[a] = 0;
    }
    if (a < 0) return;
  }
}

/** The outcome of `refineInProcess`: the mesh, each node's value, and the points each level added. */
export interface InProcessRefinement {
  mesh: RefinementMesh;
  /** Node values by finest-level key (`nodeKey`), parent grid and every level. */
  values: Map<string, number | null>;
  /** Points computed per level, the parent grid first. */
  pointsPerLevel: number[];
}

/**
 * Runs a whole refinement in one process: `evaluate` gives each node's value from its parameter
 * values (null for a failed point), `distance` turns a value into the signed distance from the
 * boundary. The same steps the API takes one scan per level; used by the bench and the tests.
 */
export function refineInProcess(
  lattice: RefinementLattice,
  evaluate: (values: number[]) => number | null,
  distance: (value: number | null) => number | null,
): InProcessRefinement {
  const values = new Map<string, number | null>();
  const pointsPerLevel: number[] = [];
  let parentPoints = 0;
  forEachOffset(
    lattice.lengths(0).map((n) => n - 1),
    (coords) => {
      values.set(nodeKey(lattice.toFinest(0, coords)), evaluate(lattice.values(0, coords)));
      parentPoints++;
    },
  );
  pointsPerLevel.push(parentPoints);
  let mesh = new RefinementMesh(lattice, []);
  for (;;) {
    const next = mesh.nextLevel((key) => distance(values.get(key) ?? null));
    if (next.cells.length === 0) break;
    for (const node of next.nodes) values.set(nodeKey(lattice.toFinest(next.level, node)), evaluate(lattice.values(next.level, node)));
    pointsPerLevel.push(next.nodes.length);
    mesh = new RefinementMesh(lattice, [...mesh.refined, next.cells]);
  }
  return { mesh, values, pointsPerLevel };
}

/**
 * Where a boundary crosses the line `axis 1 = y` of a 2-D mesh: in each leaf the line passes
 * through, the field is interpolated along it from the leaf's corners (bilinear), and a sign change
 * between the leaf's two sides gives a crossing, interpolated linearly in axis 0's spacing
 * variable (ln x on a log-spaced axis). Returns axis-0 values, ascending; leaves with an unknown
 * corner give none.
 */
export function crossingsAlong(mesh: RefinementMesh, field: BoundaryField, y: number): number[] {
  const { lattice } = mesh;
  if (lattice.dims !== 2) throw new RangeError('crossings along a line need a mesh of two axes');
  const [xAxis, yAxis] = lattice.axes;
  const yLast = yAxis.base[yAxis.base.length - 1];
  const toSpacing = (x: number) => (xAxis.logSpaced ? Math.log(x) : x);
  const out: number[] = [];
  for (const leaf of mesh.leaves()) {
    const y0 = yAxis.valueAt(leaf.level, leaf.corner[1]);
    const y1 = yAxis.valueAt(leaf.level, leaf.corner[1] + 1);
    const [lo, hi] = y0 < y1 ? [y0, y1] : [y1, y0];
    // Each line once: a line on a shared edge belongs to the leaf above it (the last edge to the leaf below).
    if (y < lo || y > hi || (y === (y0 < y1 ? y1 : y0) && y !== yLast)) continue;
    const [f00, f10, f01, f11] = mesh.cornerKeys(leaf).map(field); // bit 0: axis 0 upper, bit 1: axis 1 upper
    if (f00 === null || f10 === null || f01 === null || f11 === null) continue;
    const t = (y - y0) / (y1 - y0);
    const left = f00 + t * (f01 - f00);
    const right = f10 + t * (f11 - f10);
    if (left < 0 === right < 0) continue;
    const u0 = toSpacing(xAxis.valueAt(leaf.level, leaf.corner[0]));
    const u1 = toSpacing(xAxis.valueAt(leaf.level, leaf.corner[0] + 1));
    const u = u0 + ((u1 - u0) * left) / (left - right);
    out.push(xAxis.logSpaced ? Math.exp(u) : u);
  }
  return out.sort((a, b) => a - b);
}

/**
 * A refined leaf of a 2-D mesh for a heatmap: its window on the finest lattice (inclusive corners),
 * level, its corners' values (QuadCorners order: bit 0 is axis 0 upper, bit 1 axis 1 upper; null
 * where unknown) and the failure code of a failed corner, if any.
 */
export interface RefinedCell {
  level: number;
  x: [number, number];
  y: [number, number];
  corners: [number | null, number | null, number | null, number | null];
  failure: string | null;
}

/**
 * The leaves of refinement levels (level ≥ 1) of a 2-D mesh whose window meets the parent-index
 * window [xFrom, xTo] × [yFrom, yTo], with their corners' values and failures: drawn over the
 * parent's cells, finer over coarser.
 */
export function refinedCells(
  mesh: RefinementMesh,
  values: ReadonlyMap<string, number | null>,
  window: { xFrom: number; xTo: number; yFrom: number; yTo: number },
  failures: ReadonlyMap<string, string> = new Map(),
): RefinedCell[] {
  const { lattice } = mesh;
  if (lattice.dims !== 2) throw new RangeError('refined cells are drawn for a mesh of two axes');
  const scale = lattice.axes.map((axis) => axis.factor ** lattice.depth);
  const out: RefinedCell[] = [];
  for (const leaf of mesh.leaves()) {
    if (leaf.level === 0) continue;
    const [x0, y0] = lattice.toFinest(leaf.level, leaf.corner);
    const [x1, y1] = lattice.toFinest(leaf.level, leaf.corner.map((c) => c + 1));
    if (x1 < window.xFrom * scale[0] || x0 > window.xTo * scale[0] || y1 < window.yFrom * scale[1] || y0 > window.yTo * scale[1]) continue;
    const keys = mesh.cornerKeys(leaf);
    const corners = keys.map((key) => {
      const v = values.get(key);
      return v != null && Number.isFinite(v) ? v : null;
    }) as RefinedCell['corners'];
    out.push({ level: leaf.level, x: [x0, x1], y: [y0, y1], corners, failure: keys.map((key) => failures.get(key)).find((code) => code !== undefined) ?? null });
  }
  return out.sort((a, b) => a.level - b.level);
}

/** The mean of a refined cell's known corner values; null when none is known. */
export function cornerMean(corners: readonly (number | null)[]): number | null {
  const known = corners.filter((v): v is number => v !== null);
  return known.length ? known.reduce((s, v) => s + v, 0) / known.length : null;
}
