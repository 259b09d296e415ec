import { axisCells, axisPrior, isJudged, type AxisPrior, type PosteriorAxis } from '../statistics/grid-axes.js';
import { assemblePosterior, type GridPosterior, type GridPosteriorOptions } from '../statistics/grid-posterior.js';
import { gridEvidence, type GridEvidence } from '../statistics/evidence.js';
import { nodeKey } from './refinement-lattice.js';
import { forEachOffset, RefinementMesh } from './refinement-mesh.js';

/** Δχ² of the mesh's nodes by finest-level key (`nodeKey`); a missing or null entry is a failed, flagged or unstored point. */
export type MeshDeltaChi2 = ReadonlyMap<string, number | null>;

export interface MeshPosteriorOptions extends GridPosteriorOptions {
  /** Prior per axis (default as `axisPrior`: log on log-spaced axes). */
  priors?: readonly (AxisPrior | undefined)[];
  /** The marginals are stated on this level's nodes (default: the finest level present, coarser while an axis would pass `MESH_MARGINAL_MAX_NODES`). */
  marginalLevel?: number;
}

/** At most this many marginal values per axis (a 2-D marginal of 1025 × 1025 cells). */
export const MESH_MARGINAL_MAX_NODES = 1025;

/**
 * One corner's share of a leaf: the box between the corner and the leaf's middle (in each axis's
 * prior variable), weighing 1/2^d of the leaf's prior volume. Summing L·w over shares is the
 * trapezoid rule on every leaf (its likelihood the mean of its corners' L); on a grid without
 * refinement each node's shares add up to exactly its `axisCells` weight, so the sums are today's.
 */
interface Share {
  key: string;
  /** Per axis, the share's extent in the prior variable, lo < hi. */
  lo: number[];
  hi: number[];
  weight: number;
}

function* shares(mesh: RefinementMesh, priors: AxisPrior[]): Generator<Share> {
  const { lattice } = mesh;
  const dims = lattice.dims;
  const u = (a: number, level: number, coord: number) => {
    const x = lattice.axes[a].valueAt(level, coord);
    return priors[a] === 'log' ? Math.log(x) : x;
  };
  for (const leaf of mesh.leaves()) {
    const low = leaf.corner.map((c, a) => u(a, leaf.level, c));
    const high = leaf.corner.map((c, a) => u(a, leaf.level, c + 1));
    const keys = mesh.cornerKeys(leaf);
    for (let bits = 0; bits < 1 << dims; bits++) {
      const lo: number[] = [];
      const hi: number[] = [];
      let weight = 1;
      for (let a = 0; a < dims; a++) {
        const end = (bits >> a) & 1 ? high[a] : low[a];
        const middle = (low[a] + high[a]) / 2;
        lo.push(Math.min(end, middle));
        hi.push(Math.max(end, middle));
        weight *= Math.abs(middle - end);
      }
      yield { key: keys[bits], lo, hi, weight };
    }
  }
}

function meshPriors(mesh: RefinementMesh, priors?: readonly (AxisPrior | undefined)[]): AxisPrior[] {
  return mesh.lattice.axes.map((axis, a) => {
    const prior = priors?.[a] ?? axisPrior({ name: axis.axis.parameter, values: axis.base, spacing: axis.logSpaced ? 'log' : 'linear' });
    if (prior === 'log' && !axis.base.every((x) => x > 0)) throw new RangeError(`axis ${axis.axis.parameter} needs values above 0 for a log prior`);
    return prior;
  });
}

/** The level the marginals are stated on: the finest present, coarser while some axis would have too many nodes. */
function marginalLevel(mesh: RefinementMesh, asked?: number): number {
  if (asked !== undefined) return Math.min(Math.max(asked, 0), mesh.levels);
  let level = mesh.levels;
  while (level > 0 && mesh.lattice.lengths(level).some((n) => n > MESH_MARGINAL_MAX_NODES)) level--;
  return level;
}

/**
 * The posterior over a multi-resolution mesh: each leaf weighed by its prior volume with the mean
 * of its corners' L = exp(−Δχ²/2) (trapezoid rule), a failed corner's share left out of numerator
 * and denominator alike (as `gridPosterior` leaves out a failed point). The marginals are stated on
 * one level's nodes: each share's mass is spread uniformly over its box in the prior variable and
 * falls into the nodes' cells (midpoint to midpoint) by overlap, so a coarse leaf spreads over the
 * fine values it spans. Without refinement this is `gridPosterior` exactly (up to rounding).
 */
export function meshPosterior(mesh: RefinementMesh, chi2: MeshDeltaChi2, options: MeshPosteriorOptions = {}): GridPosterior {
  const { lattice } = mesh;
  const dims = lattice.dims;
  const priors = meshPriors(mesh, options.priors);
  const levels = options.levels ?? [0.68, 0.95];
  const pair = options.pair ?? (dims >= 2 ? ([0, 1] as [number, number]) : null);
  if (pair && (pair[0] === pair[1] || !lattice.axes[pair[0]] || !lattice.axes[pair[1]])) throw new RangeError('the 2-D marginal needs two different axes of the grid');

  let bestKey: string | null = null;
  let bestChi2 = Infinity;
  for (const [key, d] of chi2) {
    if (isJudged(d) && (bestKey === null || d < bestChi2)) {
      bestKey = key;
      bestChi2 = d;
    }
  }
  if (bestKey === null) throw new RangeError('no point of the scan has a Δχ²: every point failed or was flagged');
  if (bestChi2 === Infinity) throw new RangeError('every judged point has zero likelihood under this set');

  const level = marginalLevel(mesh, options.marginalLevel);
  const axes: PosteriorAxis[] = lattice.axes.map((axis, a) => ({
    name: axis.axis.parameter,
    values: Array.from({ length: axis.length(level) }, (_, j) => axis.valueAt(level, j)),
    spacing: axis.logSpaced ? 'log' : 'linear',
    prior: priors[a],
  }));
  const cells = axes.map((axis) => axisCells(axis));
  const marginalMass = axes.map((axis) => new Float64Array(axis.values.length));
  const [px, py] = pair ?? [0, 0];
  const pairMass = pair ? new Float64Array(axes[px].values.length * axes[py].values.length) : null;

  let total = 0;
  let allWeight = 0;
  let excludedWeight = 0;
  const excludedNodes = new Set<string>();
  const includedNodes = new Set<string>();
  for (const share of shares(mesh, priors)) {
    allWeight += share.weight;
    const d = chi2.get(share.key);
    if (!isJudged(d)) {
      excludedWeight += share.weight;
      excludedNodes.add(share.key);
      continue;
    }
    includedNodes.add(share.key);
    const m = Math.exp(-(d - bestChi2) / 2) * share.weight;
    if (m === 0) continue;
    total += m;
    const spread = share.lo.map((lo, a) => overlaps(cells[a].edges, cells[a].order, lo, share.hi[a]));
    for (let a = 0; a < dims; a++) for (const [i, f] of spread[a]) marginalMass[a][i] += m * f;
    if (pairMass) {
      const width = axes[px].values.length;
      for (const [iy, fy] of spread[py]) for (const [ix, fx] of spread[px]) pairMass[iy * width + ix] += m * fx * fy;
    }
  }

  const bestCoords = bestKey.split(',').map(Number);
  const point: Record<string, number> = {};
  lattice.axes.forEach((axis, a) => (point[axis.axis.parameter] = axis.valueAt(lattice.depth, bestCoords[a])));
  return assemblePosterior({
    axes,
    cells,
    marginalMass,
    pair: pair && pairMass ? { axes: pair, mass: pairMass } : null,
    total,
    levels,
    bestFit: { index: parentIndex(mesh, bestCoords), deltaChi2: bestChi2, point },
    excluded: { count: excludedNodes.size, priorFraction: allWeight > 0 ? excludedWeight / allWeight : 0 },
    included: includedNodes.size,
  });
}

/** The parent scan's point index of a node on level 0's lattice, or −1 for a node a refinement level added. */
export function parentIndex(mesh: RefinementMesh, finestCoords: readonly number[]): number {
  const { lattice } = mesh;
  let index = 0;
  for (let a = 0; a < lattice.dims; a++) {
    const scale = lattice.axes[a].factor ** lattice.depth;
    if (finestCoords[a] % scale !== 0) return -1;
    index = index * lattice.axes[a].base.length + finestCoords[a] / scale;
  }
  return index;
}

/** The fractions of [lo, hi] (prior variable) in each value's cell (`edges`, ascending; cell k is grid position order[k]). */
function overlaps(edges: Float64Array, order: Int32Array, lo: number, hi: number): [number, number][] {
  const width = hi - lo;
  const out: [number, number][] = [];
  if (!(width > 0)) return out;
  // The first cell whose upper edge lies above lo (binary search).
  let left = 0;
  let right = order.length - 1;
  while (left < right) {
    const mid = (left + right) >> 1;
    if (edges[mid + 1] <= lo) left = mid + 1;
    else right = mid;
  }
  for (let k = left; k < order.length && edges[k] < hi; k++) {
    const part = Math.min(hi, edges[k + 1]) - Math.max(lo, edges[k]);
    if (part > 0) out.push([order[k], part / width]);
  }
  // Round-off at the outer edges must not lose mass: scale the parts to sum to 1.
  const sum = out.reduce((s, [, f]) => s + f, 0);
  if (sum > 0 && sum !== 1) for (const part of out) part[1] /= sum;
  return out;
}

/**
 * The evidence on the mesh: Σ L·w / Σ w over the judged corners' shares (the mean of L over the
 * prior volume). `lnZHalf` is a coarser estimate of the same integral: the parent grid alone when
 * the mesh is refined, else the parent at every second value per axis (as `gridEvidence`). The
 * parent alone, not the mesh less its last level: a partly refined mesh is a second-order rule
 * (the trapezoid errors of neighbouring cells cancel only on a uniform grid), and only the
 * comparison with the parent shows that error (see the tests: 2.8 % at a coarse spacing of σ).
 */
export function meshEvidence(mesh: RefinementMesh, chi2: MeshDeltaChi2, priors?: readonly (AxisPrior | undefined)[]): GridEvidence {
  const chosen = meshPriors(mesh, priors);
  const full = shareMean(mesh, chi2, chosen);
  const parent = parentGridEvidence(mesh, chi2, chosen);
  const lnZHalf = mesh.levels > 0 ? parent.lnZ : parent.lnZHalf;
  return {
    z: Math.exp(full.lnMean),
    lnZ: full.lnMean,
    lnZHalf,
    lnZError: Math.abs(full.lnMean - lnZHalf),
    included: full.included,
    excluded: full.excluded,
  };
}

function parentGridEvidence(mesh: RefinementMesh, chi2: MeshDeltaChi2, priors: AxisPrior[]): GridEvidence {
  const { lattice } = mesh;
  const axes: PosteriorAxis[] = lattice.axes.map((axis, a) => ({ name: axis.axis.parameter, values: axis.base, prior: priors[a] }));
  const lengths = lattice.lengths(0);
  const values: (number | null)[] = [];
  forEachOffset(
    lengths.map((n) => n - 1),
    (coords) => values.push(chi2.get(nodeKey(lattice.toFinest(0, coords))) ?? null),
  );
  return gridEvidence({ axes, deltaChi2: values });
}

function shareMean(
  mesh: RefinementMesh,
  chi2: MeshDeltaChi2,
  priors: AxisPrior[],
): { lnMean: number; included: number; excluded: number } {
  let least = Infinity;
  const included = new Set<string>();
  const excluded = new Set<string>();
  const list: { d: number | null; w: number }[] = [];
  for (const share of shares(mesh, priors)) {
    const key = share.key;
    const d = chi2.get(key);
    if (isJudged(d)) {
      included.add(key);
      if (d < least) least = d;
      list.push({ d, w: share.weight });
    } else {
      excluded.add(key);
      list.push({ d: null, w: share.weight });
    }
  }
  if (included.size === 0) throw new RangeError('no point of the scan has a Δχ²: every point failed or was flagged');
  let likelihoodSum = 0;
  let weightSum = 0;
  for (const { d, w } of list) {
    if (d === null) continue;
    likelihoodSum += least === Infinity ? 0 : Math.exp(-(d - least) / 2) * w;
    weightSum += w;
  }
  return { lnMean: -least / 2 + Math.log(likelihoodSum / weightSum), included: included.size, excluded: excluded.size };
}
