import type { PointOutput, ScanPointDto } from '@sixtyfold/shared';
import type { Data, Layout, Shape } from 'plotly.js';
import { PLOT_COLORS } from '@/components/plots/plot';
import { formatNumber } from '@/lib/format-number';
import { failureColor } from './failure-colors';
import { LOG_OUTPUTS, outputLabel } from './output-labels';
import { inputLabel } from '@/lib/point-labels';

/**
 * Failed points as shaded bands reaching halfway to their neighbours, one band per run of the
 * same reason, so a failure is visible without a number. `log` takes halfway on a log scale.
 */
export function failureBands(points: ScanPointDto[], axis: string, log: boolean): Partial<Shape>[] {
  const xs = points.map((p) => p.inputs[axis]);
  const mid = (a: number, b: number) => (log ? Math.sqrt(a * b) : (a + b) / 2);
  const lower = (i: number) => (i > 0 ? mid(xs[i - 1], xs[i]) : xs.length > 1 ? (log ? xs[0] ** 2 / mid(xs[0], xs[1]) : 2 * xs[0] - mid(xs[0], xs[1])) : xs[0]);
  const upper = (i: number) => (i < xs.length - 1 ? mid(xs[i], xs[i + 1]) : xs.length > 1 ? (log ? xs[i] ** 2 / mid(xs[i - 1], xs[i]) : 2 * xs[i] - mid(xs[i - 1], xs[i])) : xs[i]);
  const bands: Partial<Shape>[] = [];
  for (let i = 0; i < points.length; i++) {
    const reason = points[i].status;
    if (reason === 'ok') continue;
    let j = i;
    while (j + 1 < points.length && points[j + 1].status === reason) j++;
    bands.push({
      type: 'rect', xref: 'x', yref: 'paper', x0: lower(i), x1: upper(j), y0: 0, y1: 1,
      fillcolor: failureColor(reason), opacity: 0.28, line: { width: 0 }, layer: 'below',
    });
    i = j;
  }
  return bands;
}

/** One output against the axis of a one-axis scan: ok points as a line, failures as bands. */
export function lineFigure(points: ScanPointDto[], axis: string, output: PointOutput, log: boolean): { data: Data[]; layout: Partial<Layout> } {
  const ok = points.filter((p) => p.status === 'ok' && p[output] !== null);
  const label = outputLabel(output);
  const logScale = LOG_OUTPUTS.has(output);
  const axisLabel = inputLabel(axis);
  return {
    data: [
      {
        type: 'scatter',
        mode: ok.length > 200 ? 'lines' : 'lines+markers',
        name: label,
        x: ok.map((p) => p.inputs[axis]),
        y: ok.map((p) => p[output]),
        customdata: ok.map((p) => p.pointIndex),
        text: ok.map((p) => `${axisLabel} = ${formatNumber(p.inputs[axis])}<br>${label} = ${formatNumber(p[output])}<br>n_s = ${formatNumber(p.ns)}, r = ${formatNumber(p.r)}`),
        hovertemplate: '%{text}<extra></extra>',
        line: { color: PLOT_COLORS.accent, width: 2 },
        marker: { color: PLOT_COLORS.ember, size: 5 },
      } as Data,
    ],
    layout: {
      xaxis: { title: { text: axisLabel }, type: log ? 'log' : 'linear' },
      yaxis: { title: { text: label }, type: logScale ? 'log' : 'linear', exponentformat: 'power' },
      shapes: failureBands(points, axis, log),
      showlegend: false,
      hovermode: 'closest',
      margin: { l: 72, r: 16, t: 12, b: 56 },
    },
  };
}
