import {
  attractorPrediction, confidenceOf, confidenceOutline, deltaChi2, deltaChi2Threshold, monomialPrediction, SIGMA_CONFIDENCE_LEVELS, sigmaThresholds,
  type ConstraintRegion, type LikelihoodSet, type RegionVertex, type ScanPlane,
} from '@sixtyfold/shared';
import type { Data, Layout } from 'plotly.js';
import { PLOT_COLORS, PLOT_COLORSCALE } from '@/components/plots/plot';
import { formatNumber } from '@/lib/format-number';
import { regionLabel } from '@/lib/region-labels';
import { isLogSpaced } from './grid-cells';
import { inputLabel } from '@/lib/point-labels';

export interface PlaneSeries {
  label: string;
  plane: ScanPlane;
}

export interface PlaneFigureInput {
  series: PlaneSeries[];
  /** Colour a single series by this axis parameter, 'nStar' or 'deltaChi2' (under the first set); several series get a colour each. */
  colorBy?: string | null;
  /** The likelihood sets whose 68 and 95 % regions are drawn under the points (none while they load). */
  likelihoods: LikelihoodSet[];
  rScale: 'linear' | 'log';
  references: boolean;
  /** The group's uploaded constraint regions to outline beside the built-in limits. */
  regions?: ConstraintRegion[];
}

/** Colours of the likelihood sets' regions and lines, in order: RGB so that fills can be lighter, and a name for the text. */
export const SET_COLORS = [
  { rgb: '67, 82, 158', name: 'blue' },
  { rgb: '192, 113, 31', name: 'amber' },
  { rgb: '42, 140, 122', name: 'teal' },
  { rgb: '140, 90, 168', name: 'purple' },
] as const;

/** The two regions drawn per set: 1σ and 2σ of a Gaussian, in two parameters (n_s, r): Δχ² ≤ 2.30 and ≤ 6.18. */
export const DRAWN_LEVELS = [
  { level: SIGMA_CONFIDENCE_LEVELS[0], percent: '68.3 %', deltaChi2: deltaChi2Threshold(SIGMA_CONFIDENCE_LEVELS[0], 2), fill: 0.22, dash: 'solid' },
  { level: SIGMA_CONFIDENCE_LEVELS[1], percent: '95.4 %', deltaChi2: deltaChi2Threshold(SIGMA_CONFIDENCE_LEVELS[1], 2), fill: 0.1, dash: 'dash' },
] as const;

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

/** Colouring by Δχ² saturates at the 99.73 % (3σ) level of two parameters, so the allowed points keep the scale. */
export const DELTA_CHI2_COLOR_MAX = sigmaThresholds(2)[2];

/** Each point's Δχ² under a set, from its stored n_s, r and α_s (the set's own terms), and its confidence level. */
export function judgedPoints(plane: ScanPlane, set: LikelihoodSet): { deltaChi2: number; confidence: number }[] {
  return plane.ns.map((ns, i) => {
    const judged = deltaChi2(set, { ns, r: plane.r[i], alphaS: plane.alphaS[i] });
    return judged ? { deltaChi2: judged.deltaChi2, confidence: confidenceOf(judged.deltaChi2, judged.terms) } : { deltaChi2: Number.NaN, confidence: Number.NaN };
  });
}

/** The values a series is coloured by: an axis parameter's inputs, N_*, or Δχ² under a set. */
export function colorValues(plane: ScanPlane, colorBy: string, set?: LikelihoodSet): number[] | undefined {
  if (colorBy === 'deltaChi2') return set && judgedPoints(plane, set).map((j) => j.deltaChi2);
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

/** Each set's outline at each drawn level, closed along r = 0 (or the floor of a log axis). */
export function likelihoodOutlines(sets: LikelihoodSet[], rFloor: number): { set: LikelihoodSet; index: number; drawn: (typeof DRAWN_LEVELS)[number]; outline: RegionVertex[] }[] {
  return sets.flatMap((set, index) =>
    DRAWN_LEVELS.map((drawn) => ({
      set, index, drawn,
      outline: confidenceOutline(set, drawn.level).map((v) => ({ ns: v.ns, r: Math.max(v.r, rFloor) })),
    })),
  );
}

/**
 * Each likelihood set's joint (n_s, r) regions, Δχ² ≤ 2.30 and ≤ 6.18 (confidenceOutline), filled
 * in the set's colour, 95 % under 68 % so both show; the outline is dashed at 95 %.
 */
export function likelihoodTraces(sets: LikelihoodSet[], rFloor: number): Data[] {
  // Widest first, so the narrower regions lie on top.
  return likelihoodOutlines(sets, rFloor)
    .sort((a, b) => b.drawn.level - a.drawn.level)
    .map(({ set, index, drawn, outline }) => {
      const { rgb } = SET_COLORS[index % SET_COLORS.length];
      const closed = [...outline, outline[0]];
      return {
        type: 'scatter', mode: 'lines', fill: 'toself', name: `${set.name}: ${drawn.percent} (Δχ² ≤ ${drawn.deltaChi2.toFixed(2)})`,
        x: closed.map((v) => v.ns), y: closed.map((v) => v.r),
        fillcolor: `rgba(${rgb}, ${drawn.fill})`, line: { color: `rgb(${rgb})`, width: 1.2, dash: drawn.dash }, hoverinfo: 'skip',
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

function hoverText(plane: ScanPlane, i: number, label: string | null, judged: { set: LikelihoodSet; points: ReturnType<typeof judgedPoints> }[]): string {
  const inputs = plane.parameters.map((name) => `${inputLabel(name)} = ${formatNumber(plane.inputs[name]?.[i])}`);
  const lines = [
    ...(label ? [label] : []),
    `point ${plane.pointIndex[i]}`,
    `n_s = ${formatNumber(plane.ns[i])}, r = ${formatNumber(plane.r[i])}`,
    `α_s = ${formatNumber(plane.alphaS[i])}, N_* = ${formatNumber(plane.nStar[i])}`,
    ...inputs,
    ...judged.map(({ set, points }) => `Δχ² = ${formatNumber(points[i].deltaChi2, 3)} under ${set.name} (${formatNumber(points[i].confidence * 100, 3)} % region)`),
  ];
  return lines.join('<br>');
}

/** The n_s–r plane: the sets' regions underneath, then reference curves, then the scans' points on top. */
export function planeFigure({ series, colorBy, likelihoods, rScale, references, regions = [] }: PlaneFigureInput): { data: Data[]; layout: Partial<Layout> } {
  const rFloor = rFloorOf(series, rScale);
  const data: Data[] = [...likelihoodTraces(likelihoods, rFloor), ...regionTraces(regions), ...(references ? referenceTraces() : [])];

  const single = series.length === 1;
  series.forEach(({ label, plane }, s) => {
    const judged = likelihoods.map((set) => ({ set, points: judgedPoints(plane, set) }));
    const byChi2 = colorBy === 'deltaChi2';
    const values = single && colorBy ? (byChi2 ? judged[0]?.points.map((j) => j.deltaChi2) : colorValues(plane, colorBy)) : undefined;
    const log = values && !byChi2 ? isLogSpaced([...new Set(values)].sort((a, b) => a - b)) : false;
    const many = plane.ns.length > 2000;
    data.push({
      type: 'scatter', mode: 'markers', name: label,
      x: plane.ns, y: plane.r,
      customdata: plane.pointIndex.map((index) => [s, index]),
      text: plane.ns.map((_, i) => hoverText(plane, i, single ? null : label, judged)), hovertemplate: '%{text}<extra></extra>',
      marker: values
        ? {
            size: many ? 4 : 7,
            color: log ? values.map((v) => Math.log10(v)) : values,
            colorscale: PLOT_COLORSCALE,
            ...(byChi2 && { cmin: 0, cmax: DELTA_CHI2_COLOR_MAX }),
            colorbar: {
              title: { text: byChi2 ? `Δχ², ${judged[0].set.name} (≥ ${DELTA_CHI2_COLOR_MAX.toFixed(2)} alike)` : `${log ? 'log₁₀ ' : ''}${inputLabel(colorBy!)}`, side: 'right' },
              thickness: 12, outlinewidth: 0,
            },
            line: { width: 0 },
          }
        : { size: many ? 4 : 7, color: SERIES_COLORS[s % SERIES_COLORS.length], opacity: 0.85, line: { width: 0 } },
    } as Data);
  });
  // Framed on the points and the sets' 95 % regions; reference curves run on past the edges.
  let nsMin = Infinity;
  let nsMax = -Infinity;
  let rMax = 0;
  for (const { outline } of likelihoodOutlines(likelihoods, rFloor)) {
    for (const v of outline) [nsMin, nsMax, rMax] = [Math.min(nsMin, v.ns), Math.max(nsMax, v.ns), Math.max(rMax, v.r)];
  }
  for (const { plane } of series) {
    for (const ns of plane.ns) if (Number.isFinite(ns)) [nsMin, nsMax] = [Math.min(nsMin, ns), Math.max(nsMax, ns)];
    for (const r of plane.r) if (Number.isFinite(r)) rMax = Math.max(rMax, r);
  }
  if (!(nsMax > nsMin)) [nsMin, nsMax] = Number.isFinite(nsMin) ? [nsMin - 0.005, nsMax + 0.005] : [0.94, 0.99];
  if (!(rMax > 0)) rMax = 0.1;
  const pad = (nsMax - nsMin) * 0.08;
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
