import type { ScanAxis } from '../schemas/scan.schema.js';
import { axisValues } from '../scans/scan-grid.js';

/** A prior on one axis: uniform in the axis variable, or uniform in its logarithm. */
export type AxisPrior = 'uniform' | 'log';

/** One axis of a grid to weigh: its values in grid order, how they were spaced, and the prior chosen. */
export interface PosteriorAxis {
  name: string;
  values: readonly number[];
  spacing?: 'linear' | 'log';
  /** Default: 'log' for a log-spaced axis, 'uniform' otherwise. */
  prior?: AxisPrior;
}

/** A grid scan judged by one likelihood: per point (last axis fastest, as `ScanGrid`) its Δχ², or null for a failed or flagged point. */
export interface GridLikelihood {
  axes: readonly PosteriorAxis[];
  deltaChi2: ArrayLike<number | null>;
}

/** A scan's axes as posterior axes, each with its default prior. */
export function posteriorAxes(axes: readonly ScanAxis[]): PosteriorAxis[] {
  return axes.map((axis) => ({ name: axis.parameter, values: axisValues(axis), spacing: axis.kind === 'range' ? axis.spacing : 'linear' }));
}

export function axisPrior(axis: PosteriorAxis): AxisPrior {
  return axis.prior ?? (axis.spacing === 'log' ? 'log' : 'uniform');
}

/** An axis's values as cells of prior volume, in ascending order of value. */
export interface AxisCells {
  prior: AxisPrior;
  /** Grid positions of the values, ascending by value. */
  order: Int32Array;
  /** The prior variable (x, or ln x) of each value, by grid position. */
  u: Float64Array;
  /**
   * Each value's prior weight, by grid position: its cell's width in the prior variable, the cell
   * running between the midpoints to its neighbours (half cells at the ends). 1 for a lone value.
   */
  widths: Float64Array;
  /** Cell edges in the prior variable, ascending: cell k (of `order[k]`) spans edges[k]..edges[k+1]. */
  edges: Float64Array;
}

export function axisCells(axis: PosteriorAxis, positions?: readonly number[]): AxisCells {
  const prior = axisPrior(axis);
  const values = axis.values;
  if (values.length === 0) throw new RangeError(`axis ${axis.name} has no values`);
  const u = new Float64Array(values.length);
  values.forEach((x, i) => {
    if (!Number.isFinite(x)) throw new RangeError(`axis ${axis.name} has a value that is not a number`);
    if (prior === 'log' && !(x > 0)) throw new RangeError(`axis ${axis.name} needs values above 0 for a log prior (found ${x})`);
    u[i] = prior === 'log' ? Math.log(x) : x;
  });
  const chosen = positions ?? values.map((_, i) => i);
  const order = Int32Array.from([...chosen].sort((a, b) => u[a] - u[b]));
  const widths = new Float64Array(values.length);
  const edges = new Float64Array(order.length + 1);
  if (order.length === 1) {
    widths[order[0]] = 1;
    edges[0] = u[order[0]];
    edges[1] = u[order[0]];
  } else {
    edges[0] = u[order[0]];
    for (let k = 1; k < order.length; k++) edges[k] = (u[order[k - 1]] + u[order[k]]) / 2;
    edges[order.length] = u[order[order.length - 1]];
    for (let k = 0; k < order.length; k++) widths[order[k]] = edges[k + 1] - edges[k];
  }
  return { prior, order, u, widths, edges };
}

/** The axis variable at prior variable u. */
export function fromPriorVariable(prior: AxisPrior, u: number): number {
  return prior === 'log' ? Math.exp(u) : u;
}

/** The number of grid points, checked against the Δχ² list. */
export function gridSize(input: GridLikelihood): number {
  if (input.axes.length === 0) throw new RangeError('a grid needs at least one axis');
  const size = input.axes.reduce((n, axis) => n * axis.values.length, 1);
  if (size !== input.deltaChi2.length) throw new RangeError(`the grid has ${size} points but ${input.deltaChi2.length} Δχ² values were given`);
  return size;
}

/** Whether a point's Δχ² takes part: null, undefined and NaN mark failed or flagged points. */
export function isJudged(value: number | null | undefined): value is number {
  return value != null && !Number.isNaN(value);
}
