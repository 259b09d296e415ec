import { axisCells, fromPriorVariable, gridSize, isJudged, type AxisCells, type AxisPrior, type GridLikelihood, type PosteriorAxis } from './grid-axes.js';

export interface Marginal1D {
  axis: string;
  prior: AxisPrior;
  /** The axis values, ascending. */
  values: number[];
  /** Posterior probability of each value's cell; sums to 1. */
  mass: number[];
  /** Posterior density per unit of the axis variable (mass over the cell's width in x). */
  density: number[];
}

/**
 * A credible interval from the 1-D marginal. `two-sided`: equal-tailed, cutting (1 − level)/2 from
 * each side. `upper-limit` / `lower-limit`: one-sided, used at every level when the widest level's
 * highest-density region holds the lowest / highest value of the axis (the data do not bound that
 * side), or when the marginal peaks at that end.
 */
export interface CredibleInterval {
  level: number;
  kind: 'two-sided' | 'upper-limit' | 'lower-limit';
  lower: number;
  upper: number;
}

export interface AxisConstraint {
  axis: string;
  intervals: CredibleInterval[];
  /**
   * Set when the widest level's highest-density region (in the prior variable) holds an end of the
   * axis: the prior range, not the data, bounds the posterior there.
   */
  edgeWarning: string | null;
}

export interface Marginal2D {
  x: string;
  y: string;
  xValues: number[];
  yValues: number[];
  /** Posterior mass per cell, row-major: index iy · xValues.length + ix (values ascending). */
  mass: Float64Array;
  /** Posterior density per unit prior area (mass over the cell's prior widths), same layout. */
  density: Float64Array;
  /** The density bounding the highest-density region of each level (for contour lines), by level. */
  contourDensity: { level: number; density: number }[];
}

export interface GridPosterior {
  marginals: Marginal1D[];
  constraints: AxisConstraint[];
  pair: Marginal2D | null;
  bestFit: { index: number; deltaChi2: number; point: Record<string, number> };
  /** Points left out (null Δχ²: failed or flagged), never counted as L = 0. */
  excluded: { count: number; priorFraction: number };
  included: number;
}

export interface GridPosteriorOptions {
  /** The two axes of the 2-D marginal, by position; default the first two. */
  pair?: [number, number];
  /** Credible levels, ascending; default 68% and 95%. */
  levels?: number[];
}

/**
 * The posterior over a grid scan: each point's weight is L · w, L = exp(−Δχ²/2) and w the product
 * of its cells' widths in each axis's prior variable (see `axisCells`). Points with a null Δχ² are
 * left out of numerator and denominator alike, and counted. Intervals come from the marginal CDF,
 * each cell's mass spread evenly over the cell in the prior variable.
 */
export function gridPosterior(input: GridLikelihood, options: GridPosteriorOptions = {}): GridPosterior {
  const size = gridSize(input);
  const axes = input.axes;
  const cells = axes.map((axis) => axisCells(axis));
  const lengths = axes.map((axis) => axis.values.length);
  const levels = options.levels ?? [0.68, 0.95];
  const pair = options.pair ?? (axes.length >= 2 ? [0, 1] : null);
  if (pair && (pair[0] === pair[1] || !axes[pair[0]] || !axes[pair[1]])) throw new RangeError('the 2-D marginal needs two different axes of the grid');

  // Pass 1: the best point, so that the weights below are scaled to it and cannot all underflow.
  const chi2 = input.deltaChi2;
  let best = -1;
  for (let p = 0; p < size; p++) {
    const d = chi2[p];
    if (isJudged(d) && (best < 0 || d < (chi2[best] as number))) best = p;
  }
  if (best < 0) throw new RangeError('no point of the scan has a Δχ²: every point failed or was flagged');
  const bestChi2 = chi2[best] as number;
  if (bestChi2 === Infinity) throw new RangeError('every judged point has zero likelihood under this set');

  const dims = axes.length;
  const marginalMass = lengths.map((n) => new Float64Array(n));
  const [px, py] = pair ?? [0, 0];
  const pairMass = pair ? new Float64Array(lengths[px] * lengths[py]) : null;
  const idx = new Int32Array(dims);
  let total = 0;
  let excludedWeight = 0;
  let allWeight = 0;
  let excludedCount = 0;
  for (let p = 0; p < size; p++) {
    let w = 1;
    for (let a = 0; a < dims; a++) w *= cells[a].widths[idx[a]];
    allWeight += w;
    const d = chi2[p];
    if (isJudged(d)) {
      const m = Math.exp(-(d - bestChi2) / 2) * w;
      total += m;
      for (let a = 0; a < dims; a++) marginalMass[a][idx[a]] += m;
      if (pairMass) pairMass[idx[py] * lengths[px] + idx[px]] += m;
    } else {
      excludedCount++;
      excludedWeight += w;
    }
    for (let a = dims - 1; a >= 0; a--) {
      if (++idx[a] < lengths[a]) break;
      idx[a] = 0;
    }
  }

  const bestIdx = indicesOf(best, lengths);
  const point: Record<string, number> = {};
  axes.forEach((axis, a) => (point[axis.name] = axis.values[bestIdx[a]]));
  return assemblePosterior({
    axes,
    cells,
    marginalMass,
    pair: pair && pairMass ? { axes: pair, mass: pairMass } : null,
    total,
    levels,
    bestFit: { index: best, deltaChi2: bestChi2, point },
    excluded: { count: excludedCount, priorFraction: allWeight > 0 ? excludedWeight / allWeight : 0 },
    included: size - excludedCount,
  });
}

/** Unnormalised posterior masses on the values of some axes, with what else a `GridPosterior` states. */
export interface PosteriorMasses extends Pick<GridPosterior, 'bestFit' | 'excluded' | 'included'> {
  axes: readonly PosteriorAxis[];
  cells: AxisCells[];
  /** Per axis, the mass of each value's cell, by grid position. */
  marginalMass: Float64Array[];
  /** The pair's mass, row-major by grid position: iy · (x values) + ix. */
  pair: { axes: [number, number]; mass: Float64Array } | null;
  total: number;
  levels: number[];
}

/**
 * Marginals, intervals and the 2-D marginal from masses on axis values: shared by the uniform grid
 * and the multi-resolution mesh (`meshPosterior`), so both are read and summarised alike.
 */
export function assemblePosterior(input: PosteriorMasses): GridPosterior {
  const { axes, cells, marginalMass, pair, total, levels } = input;
  const marginals = axes.map((axis, a) => marginal1D(axis.name, cells[a], axis.values, marginalMass[a], total));
  const constraints = axes.map((axis, a) => axisConstraint(axis.name, cells[a], axis.values, marginalMass[a], total, levels));
  const [px, py] = pair?.axes ?? [0, 0];
  return {
    marginals,
    constraints,
    pair: pair ? marginal2D(axes[px].name, axes[py].name, cells[px], cells[py], axes[px].values, axes[py].values, pair.mass, total, levels) : null,
    bestFit: input.bestFit,
    excluded: input.excluded,
    included: input.included,
  };
}

function indicesOf(index: number, lengths: readonly number[]): number[] {
  const out = new Array<number>(lengths.length);
  let rest = index;
  for (let a = lengths.length - 1; a >= 0; a--) {
    out[a] = rest % lengths[a];
    rest = Math.floor(rest / lengths[a]);
  }
  return out;
}

function marginal1D(name: string, cells: AxisCells, values: readonly number[], mass: Float64Array, total: number): Marginal1D {
  const order = [...cells.order];
  return {
    axis: name,
    prior: cells.prior,
    values: order.map((i) => values[i]),
    mass: order.map((i) => mass[i] / total),
    density: order.map((i, k) => {
      const width = fromPriorVariable(cells.prior, cells.edges[k + 1]) - fromPriorVariable(cells.prior, cells.edges[k]);
      return width > 0 ? mass[i] / total / width : Number.NaN;
    }),
  };
}

function axisConstraint(name: string, cells: AxisCells, values: readonly number[], mass: Float64Array, total: number, levels: number[]): AxisConstraint {
  const n = cells.order.length;
  if (n === 1) {
    const x = values[cells.order[0]];
    return { axis: name, intervals: levels.map((level) => ({ level, kind: 'two-sided', lower: x, upper: x })), edgeWarning: null };
  }
  // Cumulative mass at each cell edge, ascending.
  const cumulative = new Float64Array(n + 1);
  let mode = 0;
  let modeDensity = -1;
  for (let k = 0; k < n; k++) {
    const i = cells.order[k];
    cumulative[k + 1] = cumulative[k] + mass[i] / total;
    const density = mass[i] / cells.widths[i];
    if (density > modeDensity) {
      modeDensity = density;
      mode = k;
    }
  }
  cumulative[n] = 1;
  const quantile = (q: number) => fromPriorVariable(cells.prior, inverseCdf(cells.edges, cumulative, q));
  // The highest-density region of a level (density per unit prior variable): cells by density until
  // they hold the level; `bound` is the lowest density inside.
  const densities = Array.from(cells.order, (i) => mass[i] / cells.widths[i]);
  const byDensity = densities.map((_, k) => k).sort((x, y) => densities[y] - densities[x]);
  const hpdBound = (level: number) => {
    let held = 0;
    for (const k of byDensity) {
      held += mass[cells.order[k]] / total;
      if (held >= level) return densities[k];
    }
    return 0;
  };
  // One-sided where the data do not bound that side (common practice): when the widest level's
  // highest-density region holds one end of the axis, the prior range, not the data, cuts the
  // posterior there, so every level quotes the other side's limit (one kind per axis, as results
  // are quoted: "α < 2.3 (68 %), < 5.7 (95 %)"). With both ends or neither inside, the mode decides
  // (a flat posterior peaks at its first cell).
  const widestLevel = Math.max(...levels);
  const widestBound = hpdBound(widestLevel);
  const lowIn = densities[0] >= widestBound;
  const highIn = densities[n - 1] >= widestBound;
  const kind: CredibleInterval['kind'] =
    lowIn && !highIn ? 'upper-limit' : highIn && !lowIn ? 'lower-limit' : mode === 0 ? 'upper-limit' : mode === n - 1 ? 'lower-limit' : 'two-sided';
  const intervals = levels.map((level): CredibleInterval => {
    if (kind === 'upper-limit') return { level, kind, lower: values[cells.order[0]], upper: quantile(level) };
    if (kind === 'lower-limit') return { level, kind, lower: quantile(1 - level), upper: values[cells.order[n - 1]] };
    return { level, kind, lower: quantile((1 - level) / 2), upper: quantile((1 + level) / 2) };
  });
  // The widest region reaches an end when that end lies inside its highest-density region.
  const ends = [...(lowIn ? [values[cells.order[0]]] : []), ...(highIn ? [values[cells.order[n - 1]]] : [])];
  const percent = `${Math.round(widestLevel * 100)}%`;
  const edgeWarning =
    ends.length === 0
      ? null
      : `the ${percent} region reaches ${ends.map((x) => `${name} = ${formatValue(x)}`).join(' and ')}, the end of the axis: widen it`;
  return { axis: name, intervals, edgeWarning };
}

/** The prior variable where the piecewise-linear CDF (values at `edges`) reaches q. */
function inverseCdf(edges: Float64Array, cumulative: Float64Array, q: number): number {
  const n = edges.length - 1;
  for (let k = 0; k < n; k++) {
    if (cumulative[k + 1] >= q) {
      const cellMass = cumulative[k + 1] - cumulative[k];
      const t = cellMass > 0 ? (q - cumulative[k]) / cellMass : 0;
      return edges[k] + Math.min(1, Math.max(0, t)) * (edges[k + 1] - edges[k]);
    }
  }
  return edges[n];
}

function marginal2D(
  xName: string,
  yName: string,
  xCells: AxisCells,
  yCells: AxisCells,
  xAxisValues: readonly number[],
  yAxisValues: readonly number[],
  pairMass: Float64Array,
  total: number,
  levels: number[],
): Marginal2D {
  const nx = xCells.order.length;
  const ny = yCells.order.length;
  const width = xAxisValues.length;
  const mass = new Float64Array(nx * ny);
  const density = new Float64Array(nx * ny);
  for (let ky = 0; ky < ny; ky++) {
    const iy = yCells.order[ky];
    for (let kx = 0; kx < nx; kx++) {
      const ix = xCells.order[kx];
      const m = pairMass[iy * width + ix] / total;
      mass[ky * nx + kx] = m;
      density[ky * nx + kx] = m / (xCells.widths[ix] * yCells.widths[iy]);
    }
  }
  const bounds = highestDensityBounds(mass, density, levels);
  const contourDensity = levels.map((level, k) => ({ level, density: bounds[k] }));
  return {
    x: xName,
    y: yName,
    xValues: [...xCells.order].map((i) => xAxisValues[i]),
    yValues: [...yCells.order].map((i) => yAxisValues[i]),
    mass,
    density,
    contourDensity,
  };
}

/**
 * For each level, the density d such that the cells denser than d hold that much of the mass (the
 * edge of the highest-density region). One pass bins the cells by ln(density / peak); only the
 * cells of the bin where a level is crossed are sorted, so a million cells need no full sort.
 */
function highestDensityBounds(mass: Float64Array, density: Float64Array, levels: number[]): number[] {
  const bins = 4096;
  const depth = 80; // ln units below the peak; deeper cells share the last bin
  let peak = 0;
  for (let c = 0; c < density.length; c++) if (density[c] > peak) peak = density[c];
  if (!(peak > 0)) return levels.map(() => 0);
  const binOf = (d: number) => (d > 0 ? Math.min(bins - 1, Math.floor((-Math.log(d / peak) / depth) * bins)) : bins - 1);
  const binMass = new Float64Array(bins);
  for (let c = 0; c < density.length; c++) binMass[binOf(density[c])] += mass[c];
  return levels.map((level) => {
    let before = 0;
    let bin = 0;
    while (bin < bins - 1 && before + binMass[bin] < level) before += binMass[bin++];
    const cells: number[] = [];
    for (let c = 0; c < density.length; c++) if (binOf(density[c]) === bin) cells.push(c);
    cells.sort((x, y) => density[y] - density[x]);
    let sum = before;
    for (const c of cells) {
      sum += mass[c];
      if (sum >= level) return density[c];
    }
    return cells.length > 0 ? density[cells[cells.length - 1]] : 0;
  });
}

function formatValue(x: number): string {
  return Number(x.toPrecision(6)).toString();
}
