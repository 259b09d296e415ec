import { cornerMean, joinSegments, levelLine, type ContourQuad, type ScanGridSlice } from '@sixtyfold/shared';
import type { Data, Layout } from 'plotly.js';
import { PLOT_COLORS, PLOT_COLORSCALE } from '@/components/plots/plot';
import { formatNumber } from '@/lib/format-number';
import { failureColor, failureColorscale, failureSlot, FAILURE_SLOTS } from './failure-colors';
import { cellRows, cellSpan, cellStates, cellStatistic, isLogSpaced } from './grid-cells';
import { DRAWN_LEVELS } from './plane-figure';
import { LOG_OUTPUTS, outputLabel } from './output-labels';
import { inputLabel } from '@/lib/point-labels';

export interface HeatmapFigureInput {
  /** The output drawn, with each cell's counts of OK and failed points. */
  slice: ScanGridSlice;
  /** Colour range in the output's units, shared across panels or scans; from the data when absent. */
  zRange?: [number, number];
  /** Other outputs at the same cells (n_s and r, say), listed when hovering a cell. */
  hoverSlices?: ScanGridSlice[];
  /** Δχ² of likelihood sets at the same cells: each draws its 68 and 95 % boundary lines. */
  boundaries?: BoundarySlice[];
  /** Cells to mark with a dot, e.g. those whose point has comments. */
  marked?: boolean[][] | null;
}

/** One likelihood set's Δχ² slice (output `deltaChi2`) and the colour its lines take (SET_COLORS). */
export interface BoundarySlice {
  slice: ScanGridSlice;
  color: { rgb: string };
}

// Past this many cells a text label per cell costs more memory than a hover is worth.
const MAX_HOVER_CELLS = 62_500;
const OK_CELL_COLOR = '#d9dcea';
/** The background that shows through cells not stored yet. */
export const NOT_STORED_COLOR = '#e7e3da';

/** Tick labels are short: three significant digits say where a cell is; hovering gives all digits. */
const tickLabel = (value: number) => formatNumber(value, 3);

/** Up to `most` evenly spread tick positions along an axis of n cells, ends included. */
export function tickIndices(n: number, most = 7): number[] {
  if (n <= most) return Array.from({ length: n }, (_, i) => i);
  const step = (n - 1) / (most - 1);
  return [...new Set(Array.from({ length: most }, (_, i) => Math.round(i * step)))];
}

function axisLayout(axis: ScanGridSlice['x']): Partial<Layout['xaxis']> {
  const ticks = tickIndices(axis.values.length);
  const log = isLogSpaced(axis.values);
  return {
    title: { text: `${inputLabel(axis.parameter)}${log ? ' (log-spaced)' : ''}` },
    tickmode: 'array',
    tickvals: ticks,
    ticktext: ticks.map((i) => tickLabel(axis.values[i])),
    range: [-0.5, axis.values.length - 0.5],
    // Dragging zooms: the page then asks for that window at finer resolution.
    fixedrange: false,
    showgrid: false,
  };
}

/** Each value of a column as hovering shows it, worked out once per column however many panels list it. */
const formattedColumns = new WeakMap<readonly (number | null)[], string[]>();
function formatted(column: readonly (number | null)[]): string[] {
  let texts = formattedColumns.get(column);
  if (!texts) formattedColumns.set(column, (texts = column.map((value) => formatNumber(value))));
  return texts;
}

/** What hovering a cell shows: where it is (every axis value) and what came out there, per block when cells hold several points. */
function hoverTexts(slice: ScanGridSlice, states: (string | null)[], others: ScanGridSlice[]): string[][] {
  const fixed = Object.entries(slice.at).map(([name, { value }]) => `<br>${inputLabel(name)} = ${formatNumber(value)}`).join('');
  const shown = [...others, slice]
    .filter((s, i, all) => s.output !== 'status' && all.findIndex((o) => o.output === s.output) === i)
    .map((s) => ({ label: outputLabel(s.output), mean: formatted(s.mean ?? []), min: s.min && s.max ? formatted(s.min) : null, max: s.min && s.max ? formatted(s.max) : null }));
  const nx = slice.x.values.length;
  // Per column and per row rather than per cell: a 200 × 200 slice has 40,000 cells but 400 of these.
  const where = (axis: ScanGridSlice['x']) =>
    axis.values.map((value, i) => {
      const count = cellSpan(axis, i).count;
      return { text: `${inputLabel(axis.parameter)} = ${formatNumber(value)}${count > 1 ? ` (first of ${count} values)` : ''}`, count };
    });
  const columns = where(slice.x);
  const rows = where(slice.y);
  const reasons = Object.entries(slice.failed);
  const texts = states.map((state, c) => {
    const column = columns[c % nx];
    const row = rows[Math.floor(c / nx)];
    let text = `${column.text}<br>${row.text}${fixed}`;
    const points = column.count * row.count;
    if (points > 1) {
      const failed = reasons.filter(([, counts]) => counts[c] > 0).map(([reason, counts]) => `${counts[c]} ${reason}`);
      text += `<br>${slice.ok[c]} of ${points} points ok${failed.length ? `; failed: ${failed.join(', ')}` : ''}`;
      for (const s of shown) {
        if (s.mean[c] === undefined || s.mean[c] === '—') continue;
        text += `<br>${s.label} mean ${s.mean[c]}${s.min && s.max ? `, ${s.min[c]} to ${s.max[c]}` : ''}`;
      }
    } else if (state === null) text += '<br>not stored yet';
    else if (state !== 'ok') text += `<br>failed: ${state}`;
    else for (const s of shown) text += `<br>${s.label} = ${s.mean[c] ?? '—'}`;
    return text;
  });
  return cellRows(slice, texts);
}

/** The two strokes of every boundary line: a white one under the set's colour keeps it visible on every colour. */
const boundaryStrokes = (color: BoundarySlice['color']) => [{ color: '#ffffff', width: 3.5 }, { color: `rgb(${color.rgb})`, width: 1.8 }];

/**
 * The 68 and 95 % boundaries (Δχ² = 2.30 and 6.18, two parameters) of each set as contour lines of
 * its Δχ² over the cells, interpolated between cell centres by Plotly (a block's Δχ² is its mean).
 * Solid at 68 %, dashed at 95 %. A refined grid's lines are shapes instead (`refinedBoundaryShapes`).
 */
export function boundaryTraces(boundaries: BoundarySlice[], xs: number[], ys: number[]): Data[] {
  // A contour needs cells in two directions.
  if (xs.length < 2 || ys.length < 2) return [];
  return boundaries
    .filter(({ slice }) => !slice.refined?.cells.length)
    .flatMap(({ slice, color }) => {
      const z = cellRows(slice, slice.mean ?? []);
      return DRAWN_LEVELS.flatMap((drawn) =>
        boundaryStrokes(color).map(
          (line) =>
            ({
              type: 'contour', name: `Δχ² = ${drawn.deltaChi2.toFixed(2)}`, x: xs, y: ys, z,
              contours: { coloring: 'none', start: drawn.deltaChi2, end: drawn.deltaChi2, size: 1, showlabels: false },
              line: { ...line, dash: drawn.dash, smoothing: 0.6 }, showscale: false, hoverinfo: 'skip', connectgaps: false,
            }) as Data,
        ),
      );
    });
}

/**
 * A refined grid's 68 and 95 % lines, drawn through its finest cells (`refinedBoundaryLines`), as
 * path shapes: they come after the refined cells' rectangles, which as shapes lie above every trace.
 */
export function refinedBoundaryShapes(boundaries: BoundarySlice[]): NonNullable<Partial<Layout>['shapes']> {
  return boundaries
    .filter(({ slice }) => slice.refined?.cells.length)
    .flatMap(({ slice, color }) =>
      DRAWN_LEVELS.flatMap((drawn) => {
        const lines = refinedBoundaryLines(slice, drawn.deltaChi2);
        if (lines.length === 0) return [];
        const path = lines.map((line) => line.map(([x, y], k) => `${k === 0 ? 'M' : 'L'}${x},${y}`).join(' ')).join(' ');
        return boundaryStrokes(color).map((line) => ({
          type: 'path' as const, layer: 'above' as const, xref: 'x' as const, yref: 'y' as const, path, name: `Δχ² = ${drawn.deltaChi2.toFixed(2)}`,
          line: { ...line, dash: drawn.dash },
        }));
      }),
    );
}

/** Where a refined cell lies in the panel's cell coordinates: parent index i is finest coordinate i · scale. */
function refinedBox(slice: ScanGridSlice, cell: NonNullable<ScanGridSlice['refined']>['cells'][number]) {
  const { scale } = slice.refined!;
  const at = (axis: ScanGridSlice['x'], s: number, fine: number) => (fine / s - axis.from) / axis.block;
  return { x: [at(slice.x, scale[0], cell.x[0]), at(slice.x, scale[0], cell.x[1])] as const, y: [at(slice.y, scale[1], cell.y[0]), at(slice.y, scale[1], cell.y[1])] as const };
}

/**
 * The level line `Δχ² = level` of a refined grid as polylines in cell coordinates: marching squares
 * (`levelLine`) through the refined cells, and through the panel's own cells between neighbouring
 * centres where no refined cell covers them, joined where they meet.
 */
export function refinedBoundaryLines(slice: ScanGridSlice, level: number): [number, number][][] {
  const nx = slice.x.values.length;
  const ny = slice.y.values.length;
  const mean = slice.mean ?? [];
  const quads: ContourQuad[] = [];
  const covered = new Set<number>();
  for (const cell of slice.refined?.cells ?? []) {
    const box = refinedBox(slice, cell);
    quads.push({ ...box, corners: cell.corners });
    for (let ix = Math.floor(box.x[0]); ix < Math.ceil(box.x[1]); ix++) for (let iy = Math.floor(box.y[0]); iy < Math.ceil(box.y[1]); iy++) covered.add(iy * nx + ix);
  }
  for (let iy = 0; iy + 1 < ny; iy++) {
    for (let ix = 0; ix + 1 < nx; ix++) {
      if (covered.has(iy * nx + ix)) continue;
      const c = iy * nx + ix;
      quads.push({ x: [ix, ix + 1], y: [iy, iy + 1], corners: [mean[c] ?? null, mean[c + 1] ?? null, mean[c + nx] ?? null, mean[c + nx + 1] ?? null] });
    }
  }
  return joinSegments(levelLine(quads, level));
}

// Past this many refined cells the shapes would slow every redraw; the coarse cells stay.
const MAX_REFINED_SHAPES = 5_000;

/** A colour of the plot's colorscale at t ∈ [0, 1], interpolated between its stops. */
export function colorscaleAt(t: number): string {
  const clamped = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0));
  const stops = PLOT_COLORSCALE;
  let k = 1;
  while (k < stops.length - 1 && stops[k][0] < clamped) k++;
  const [t0, c0] = stops[k - 1];
  const [t1, c1] = stops[k];
  const f = t1 > t0 ? (clamped - t0) / (t1 - t0) : 0;
  const channel = (hex: string, i: number) => parseInt(hex.slice(1 + 2 * i, 3 + 2 * i), 16);
  const mixed = [0, 1, 2].map((i) => Math.round(channel(c0, i) + f * (channel(c1, i) - channel(c0, i))));
  return `rgb(${mixed.join(', ')})`;
}

/**
 * A refined grid's finer cells (`slice.refined`) as filled rectangles over the panel, finer over
 * coarser: coloured on the panel's scale by their corners' mean, or on the status panel by whether
 * a corner failed (and why). A refined cell spans from node to node (`refinedBox`).
 */
export function refinedCellShapes(slice: ScanGridSlice, zRange?: [number, number]): Partial<Layout>['shapes'] {
  const refined = slice.refined;
  if (!refined || refined.cells.length === 0 || refined.cells.length > MAX_REFINED_SHAPES) return [];
  const rect = (cell: (typeof refined.cells)[number], fillcolor: string) => {
    const { x, y } = refinedBox(slice, cell);
    return { type: 'rect' as const, layer: 'above' as const, xref: 'x' as const, yref: 'y' as const, line: { width: 0 }, x0: x[0], x1: x[1], y0: y[0], y1: y[1], fillcolor };
  };
  if (slice.output === 'status') return refined.cells.map((cell) => rect(cell, cell.failure === null ? OK_CELL_COLOR : failureColor(cell.failure)));
  const log = LOG_OUTPUTS.has(slice.output);
  const scale = (v: number | null) => (v === null ? null : log ? (v > 0 ? Math.log10(v) : null) : v);
  // The panel's own range: the shared one, or (as Plotly takes it) its cells' least and greatest.
  const known = (zRange ?? slice.mean ?? []).map(scale).filter((v): v is number => v !== null);
  if (known.length === 0) return [];
  const [lo, hi] = [Math.min(...known), Math.max(...known)];
  return refined.cells.flatMap((cell) => {
    const z = scale(cornerMean(cell.corners));
    return z === null ? [] : [rect(cell, colorscaleAt(hi > lo ? (z - lo) / (hi - lo) : 0.5))];
  });
}

/**
 * The Plotly traces of one heatmap panel, in cell coordinates (cell ix spans ix ± ½) with the
 * axis values as tick labels, so list and log-spaced axes get equal cells. Failed cells are
 * never drawn as numbers: their z is null in the data and a second trace colours them by reason.
 */
export function heatmapFigure({ slice, zRange, hoverSlices = [], boundaries = [], marked }: HeatmapFigureInput): { data: Data[]; layout: Partial<Layout> } {
  const xs = slice.x.values.map((_, i) => i);
  const ys = slice.y.values.map((_, i) => i);
  const cells = xs.length * ys.length;
  const states = cellStates(slice);
  const text = cells <= MAX_HOVER_CELLS ? hoverTexts(slice, states, hoverSlices) : undefined;
  const hover = text ? { text, hovertemplate: '%{text}<extra></extra>' } : { hoverinfo: 'z' as const };
  const label = outputLabel(slice.output);
  const logScale = LOG_OUTPUTS.has(slice.output);
  const data: Data[] = [];

  if (slice.output === 'status') {
    data.push({
      type: 'heatmap', name: 'ok', x: xs, y: ys, hoverongaps: false, showscale: false, ...hover,
      z: cellRows(slice, states.map((s) => (s === 'ok' ? 1 : null))),
      colorscale: [[0, OK_CELL_COLOR], [1, OK_CELL_COLOR]],
    } as Data);
  } else {
    const log = logScale;
    const scale = (v: number | null) => (v === null ? null : log ? (v > 0 ? Math.log10(v) : null) : v);
    const range = zRange ? zRange.map((v) => scale(v)) : [];
    data.push({
      type: 'heatmap', name: label, x: xs, y: ys, hoverongaps: false, ...hover,
      z: cellRows(slice, (slice.mean ?? states.map(() => null)).map(scale)),
      colorscale: PLOT_COLORSCALE,
      ...(range[0] !== null && range[0] !== undefined && range[1] !== null && range[1] !== undefined ? { zmin: range[0], zmax: range[1] } : {}),
      colorbar: { title: { text: log ? `log₁₀ ${label}` : label, side: 'right' }, thickness: 12, outlinewidth: 0, exponentformat: 'power' },
    } as Data);
  }

  const failed = cellRows(slice, states.map((s) => (s !== null && s !== 'ok' ? failureSlot(s) : null)));
  if (failed.some((row) => row.some((v) => v !== null))) {
    data.push({
      type: 'heatmap', name: 'failed', x: xs, y: ys, z: failed, hoverongaps: false, showscale: false, ...hover,
      colorscale: failureColorscale(), zmin: -0.5, zmax: FAILURE_SLOTS - 0.5,
    } as Data);
  }

  data.push(...boundaryTraces(boundaries, xs, ys));

  const dots = { x: [] as number[], y: [] as number[] };
  marked?.forEach((row, iy) => row.forEach((on, ix) => on && (dots.x.push(ix), dots.y.push(iy))));
  if (dots.x.length) {
    // A light dot in a dark ring, like the outline, reads on every colour; clicks on it reach the cell.
    data.push({
      type: 'scatter', mode: 'markers', name: 'has comments', ...dots, hoverinfo: 'skip', showlegend: false,
      marker: { size: 7, color: '#ffffff', line: { color: PLOT_COLORS.ink, width: 1.5 } },
    } as Data);
  }

  return {
    data,
    layout: {
      xaxis: axisLayout(slice.x),
      yaxis: axisLayout(slice.y),
      margin: { l: 72, r: 16, t: 22, b: 60 },
      // Cells not stored yet show this through the gaps, apart from the light end of the scale.
      plot_bgcolor: NOT_STORED_COLOR,
      showlegend: false,
      hovermode: 'closest',
      dragmode: 'zoom',
      // Lines after cells: shapes are drawn in order.
      shapes: [...(refinedCellShapes(slice, zRange) ?? []), ...refinedBoundaryShapes(boundaries)],
      // What a cell stands for, on the plot itself (and in saved images).
      annotations: [{ text: cellStatistic(slice), xref: 'paper', yref: 'paper', x: 1, y: 1, xanchor: 'right', yanchor: 'bottom', showarrow: false, font: { size: 11, color: PLOT_COLORS.muted } }],
    },
  };
}
