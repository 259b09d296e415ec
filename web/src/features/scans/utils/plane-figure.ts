import {
  attractorPrediction, monomialPrediction, nsInterval, type ConstraintRegion, type ObservationalLimits, type ScanPlane,
} from '@sixtyfold/shared';
import type { Data, Layout } from 'plotly.js';
import { PLOT_COLORS, PLOT_COLORSCALE } from '@/components/plots/plot';
import { formatNumber } from '@/lib/format-number';
import { regionLabel } from '@/lib/region-labels';
import { isLogSpaced } from './grid-cells';
import { inputLabel } from './point-columns';

export interface PlaneSeries {
  label: string;
  plane: ScanPlane;
}

export interface PlaneFigureInput {
  series: PlaneSeries[];
  /** Colour a single series by this axis parameter or 'nStar'; several series get a colour each. */
  colorBy?: string | null;
  limits: ObservationalLimits;
  rScale: 'linear' | 'log';
  references: boolean;
  /** The group's uploaded constraint regions to outline beside the built-in limits. */
  regions?: ConstraintRegion[];
}

/** Colours of uploaded region outlines, in order. */
export const REGION_COLORS = ['#2a8c7a', '#b3261e', '#8c5aa8', '#686153'];

/** Colours of overlaid scans, in order. */
export const SERIES_COLORS = [PLOT_COLORS.ember, PLOT_COLORS.accent, '#2a8c7a', '#8c5aa8'];

/** Pivot e-folds of the reference curves. */
export const REFERENCE_EFOLDS = [50, 60] as const;

const range = (from: number, to: number, count: number, log = false) =>
  Array.from({ length: count }, (_, i) => {
    const t = i / (count - 1);
    return log ? from * (to / from) ** t : from + t * (to - from);
  });

/** The values a series is coloured by: an axis parameter's inputs, or N_*. */
export function colorValues(plane: ScanPlane, colorBy: string): number[] | undefined {
  return colorBy === 'nStar' ? plane.nStar : plane.inputs[colorBy];
}

/**
 * Reference curves at N_* = 50 and 60: V ∝ φ^p for p from 0.3 to 4 (monomialPrediction, first
 * order in slow roll) and the plateau line of α-attractors for α from 10⁻² to 10²
 * (attractorPrediction, Kallosh, Linde & Roest 2013, arXiv:1311.0472).
 */
export function referenceTraces(): Data[] {
  return REFERENCE_EFOLDS.flatMap((nStar, i) => {
    const dash = i === 0 ? 'dot' : 'dash';
    const powers = range(0.3, 4, 60);
    const mono = powers.map((p) => monomialPrediction(p, nStar));
    const alphas = range(1e-2, 1e2, 41, true);
    const plateau = alphas.map((alpha) => attractorPrediction(alpha, nStar));
    const marked = [2 / 3, 1, 2, 3, 4].map((p) => ({ p, ...monomialPrediction(p, nStar) }));
    return [
      {
        type: 'scatter', mode: 'lines', name: `φ^p, N_* = ${nStar} (p = 0.3 to 4)`, legendgroup: `mono-${nStar}`,
        x: mono.map((m) => m.ns), y: mono.map((m) => m.r),
        text: powers.map((p) => `φ^p, p = ${formatNumber(p)}, N_* = ${nStar}`), hovertemplate: '%{text}<br>n_s = %{x}<br>r = %{y}<extra></extra>',
        line: { color: PLOT_COLORS.muted, width: 1.5, dash },
      },
      {
        // Powers are written on one curve only, the other keeps the same marks unlabelled.
        type: 'scatter', mode: i === REFERENCE_EFOLDS.length - 1 ? 'markers+text' : 'markers', name: `φ^p markers, N_* = ${nStar}`,
        legendgroup: `mono-${nStar}`, showlegend: false,
        x: marked.map((m) => m.ns), y: marked.map((m) => m.r), text: marked.map((m) => (m.p === 2 / 3 ? 'p=2/3' : `p=${m.p}`)),
        textposition: 'middle left', textfont: { size: 10, color: PLOT_COLORS.muted }, hoverinfo: 'skip',
        marker: { color: PLOT_COLORS.muted, size: 5, symbol: 'circle-open' },
      },
      {
        type: 'scatter', mode: 'lines', name: `α-attractor, N_* = ${nStar} (α = 10⁻² to 10²)`,
        x: plateau.map((m) => m.ns), y: plateau.map((m) => m.r),
        text: alphas.map((alpha) => `α-attractor, α = ${formatNumber(alpha)}, N_* = ${nStar}`), hovertemplate: '%{text}<br>n_s = %{x}<br>r = %{y}<extra></extra>',
        line: { color: PLOT_COLORS.ink, width: 1.5, dash },
      },
    ] as Data[];
  });
}

/**
 * The observational regions as filled rectangles: n_s inside its 68% or 95% interval and r below
 * its 95% limit. This is the product of the two one-dimensional limits (see insideLimits), and
 * the legend says so rather than passing it off as the joint contour.
 */
export function limitTraces(limits: ObservationalLimits, rFloor: number): Data[] {
  return ([95, 68] as const).map((level) => {
    const [low, high] = nsInterval(limits, level);
    return {
      type: 'scatter', mode: 'lines', fill: 'toself', name: `n_s ${level}% interval × r < ${formatNumber(limits.r.max95)} (95%)`,
      x: [low, high, high, low, low], y: [rFloor, rFloor, limits.r.max95, limits.r.max95, rFloor],
      fillcolor: level === 68 ? PLOT_COLORS.limit68 : PLOT_COLORS.limit95, line: { width: 0 }, hoverinfo: 'skip',
    } as Data;
  });
}

/** Each uploaded region as a closed outline (its first vertex repeated at the end), not filled. */
export function regionTraces(regions: ConstraintRegion[]): Data[] {
  return regions.map((region, i) => {
    const closed = [...region.vertices, region.vertices[0]];
    return {
      type: 'scatter', mode: 'lines', name: regionLabel(region),
      x: closed.map((v) => v.ns), y: closed.map((v) => v.r),
      line: { color: REGION_COLORS[i % REGION_COLORS.length], width: 2 },
      hovertemplate: `${regionLabel(region)}<br>n_s = %{x}<br>r = %{y}<extra></extra>`,
    } as Data;
  });
}

/** Where the r axis starts: zero when linear; on a log axis a decade below the smallest r shown. */
export function rFloorOf(series: PlaneSeries[], rScale: 'linear' | 'log'): number {
  if (rScale === 'linear') return 0;
  let min = Infinity;
  for (const { plane } of series) for (const r of plane.r) if (r > 0 && r < min) min = r;
  const smallest = Math.min(min, 1e-3);
  return 10 ** Math.floor(Math.log10(smallest) - 0.5);
}

function hoverText(plane: ScanPlane, i: number, label: string | null): string {
  const inputs = plane.parameters.map((name) => `${inputLabel(name)} = ${formatNumber(plane.inputs[name]?.[i])}`);
  const lines = [
    ...(label ? [label] : []),
    `point ${plane.pointIndex[i]}`,
    `n_s = ${formatNumber(plane.ns[i])}, r = ${formatNumber(plane.r[i])}`,
    `α_s = ${formatNumber(plane.alphaS[i])}, N_* = ${formatNumber(plane.nStar[i])}`,
    ...inputs,
  ];
  return lines.join('<br>');
}

/** The n_s–r plane: limit regions underneath, then reference curves, then the scans' points on top. */
export function planeFigure({ series, colorBy, limits, rScale, references, regions = [] }: PlaneFigureInput): { data: Data[]; layout: Partial<Layout> } {
  const data: Data[] = [...limitTraces(limits, rFloorOf(series, rScale)), ...regionTraces(regions), ...(references ? referenceTraces() : [])];

  const single = series.length === 1;
  series.forEach(({ label, plane }, s) => {
    const values = single && colorBy ? colorValues(plane, colorBy) : undefined;
    const log = values ? isLogSpaced([...new Set(values)].sort((a, b) => a - b)) : false;
    const many = plane.ns.length > 2000;
    data.push({
      type: 'scatter', mode: 'markers', name: label,
      x: plane.ns, y: plane.r,
      customdata: plane.pointIndex.map((index) => [s, index]),
      text: plane.ns.map((_, i) => hoverText(plane, i, single ? null : label)), hovertemplate: '%{text}<extra></extra>',
      marker: values
        ? {
            size: many ? 4 : 7,
            color: log ? values.map((v) => Math.log10(v)) : values,
            colorscale: PLOT_COLORSCALE,
            colorbar: { title: { text: `${log ? 'log₁₀ ' : ''}${inputLabel(colorBy!)}`, side: 'right' }, thickness: 12, outlinewidth: 0 },
            line: { width: 0 },
          }
        : { size: many ? 4 : 7, color: SERIES_COLORS[s % SERIES_COLORS.length], opacity: 0.85, line: { width: 0 } },
    } as Data);
  });
  // Framed on the points and the 95% region; reference curves run on past the edges.
  const [low, high] = nsInterval(limits, 95);
  let nsMin = low;
  let nsMax = high;
  let rMax = limits.r.max95;
  for (const { plane } of series) {
    for (const ns of plane.ns) if (Number.isFinite(ns)) [nsMin, nsMax] = [Math.min(nsMin, ns), Math.max(nsMax, ns)];
    for (const r of plane.r) if (Number.isFinite(r)) rMax = Math.max(rMax, r);
  }
  const pad = (nsMax - nsMin) * 0.08;
  const rFloor = rFloorOf(series, rScale);
  return {
    data,
    layout: {
      xaxis: { title: { text: 'n_s' }, range: [nsMin - pad, nsMax + pad] },
      yaxis: {
        title: { text: 'r' }, type: rScale, exponentformat: 'power',
        range: rScale === 'linear' ? [0, rMax * 1.2] : [Math.log10(rFloor), Math.log10(rMax * 2)],
      },
      legend: { orientation: 'h', y: -0.2, x: 0, font: { size: 11 } },
      hovermode: 'closest',
      margin: { l: 64, r: 16, t: 12, b: 40 },
    },
  };
}
