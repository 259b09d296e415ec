import type { StoredScanSpec } from '../schemas/scan.schema.js';
import { axisLength } from './scan-grid.js';

/**
 * The order in which a scan's points are computed and cut into chunks. Points that differ only
 * along the scan's `sharedBackgroundAxes` (N_*, the reheating history, a parameter that only
 * scales V) share one background, and the engine reuses the last one it integrated: so those
 * axes go fastest, and a chunk holds each background's points together, whatever order the
 * person gave the axes in. Positions 0 … size-1 in this order map to the scan's own point
 * indices (last axis fastest), which is what is stored; only the chunking follows positions.
 */
export class ComputeOrder {
  /** Per axis of the scan: its stride among point indices, its length, and its stride among positions. */
  readonly terms: readonly { indexStride: number; length: number; positionStride: number }[];
  /** True when positions are point indices (no shared axis before an unshared one, or a point list). */
  readonly identity: boolean;

  constructor(lengths: readonly number[], shared: readonly boolean[]) {
    const indexStrides = strides(lengths.map((_, a) => a), lengths);
    const order = [...lengths.keys()].filter((a) => !shared[a]).concat([...lengths.keys()].filter((a) => shared[a]));
    const positionStrides = strides(order, lengths);
    this.terms = lengths.map((length, a) => ({ indexStride: indexStrides[a], length, positionStride: positionStrides[a] }));
    this.identity = order.every((a, i) => a === i);
  }

  /** The point index computed at `position`. */
  pointAt(position: number): number {
    if (this.identity) return position;
    let index = 0;
    for (const t of this.terms) index += (Math.floor(position / t.positionStride) % t.length) * t.indexStride;
    return index;
  }

  /** The position of point `index`: the inverse of pointAt. */
  positionOf(index: number): number {
    if (this.identity) return index;
    let position = 0;
    for (const t of this.terms) position += (Math.floor(index / t.indexStride) % t.length) * t.positionStride;
    return position;
  }
}

/** Strides of the axes `order` (slowest first) over axis lengths `lengths`, indexed by axis. */
function strides(order: readonly number[], lengths: readonly number[]): number[] {
  const out = new Array<number>(lengths.length);
  let stride = 1;
  for (let i = order.length - 1; i >= 0; i--) {
    out[order[i]] = stride;
    stride *= lengths[order[i]];
  }
  return out;
}

/** The compute order of a stored scan. Scans stored before the order existed (no `sharedBackgroundAxes`) compute in index order. */
export function computeOrder(spec: Pick<StoredScanSpec, 'axes' | 'pointList' | 'sharedBackgroundAxes'>): ComputeOrder {
  if (spec.pointList || !spec.axes) return new ComputeOrder([spec.pointList?.rows.length ?? 1], [false]);
  const shared = new Set(spec.sharedBackgroundAxes ?? []);
  return new ComputeOrder(spec.axes.map(axisLength), spec.axes.map((axis) => shared.has(axis.parameter)));
}
