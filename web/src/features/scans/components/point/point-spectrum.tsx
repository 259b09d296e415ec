import { PIVOT_K_PER_MPC, type EvaluateResponse } from '@sixtyfold/shared';
import type { Data, Layout } from 'plotly.js';
import { useMemo } from 'react';
import { Plot, PLOT_COLORS } from '@/components/plots/plot';

type Spectrum = NonNullable<EvaluateResponse['spectrum']>;

/** P_R(k) and P_t(k) from the mode equations around the pivot, on log-log axes. */
export function PointSpectrum({ spectrum }: { spectrum: Spectrum }) {
  const figure = useMemo(() => {
    const data: Data[] = [
      { type: 'scatter', mode: 'lines+markers', name: 'P_R(k), scalar', x: spectrum.kPerMpc, y: spectrum.scalar, line: { color: PLOT_COLORS.accent, width: 2 }, marker: { size: 5 } },
      { type: 'scatter', mode: 'lines+markers', name: 'P_t(k), tensor', x: spectrum.kPerMpc, y: spectrum.tensor, line: { color: PLOT_COLORS.ember, width: 2 }, marker: { size: 5 } },
    ];
    const layout: Partial<Layout> = {
      xaxis: { title: { text: 'k (Mpc⁻¹)' }, type: 'log', exponentformat: 'power' },
      yaxis: { title: { text: 'power spectrum' }, type: 'log', exponentformat: 'power', dtick: 1 },
      shapes: [{ type: 'line', xref: 'x', yref: 'paper', x0: PIVOT_K_PER_MPC, x1: PIVOT_K_PER_MPC, y0: 0, y1: 1, line: { color: PLOT_COLORS.muted, width: 1.5, dash: 'dot' } }],
      // On a log axis an annotation takes log₁₀ of its position, a shape the value itself.
      annotations: [{ x: Math.log10(PIVOT_K_PER_MPC), y: 1, xref: 'x', yref: 'paper', text: `pivot k_* = ${PIVOT_K_PER_MPC} Mpc⁻¹`, showarrow: false, yanchor: 'bottom', font: { size: 11, color: PLOT_COLORS.muted } }],
      legend: { orientation: 'h', y: -0.25, x: 0 },
      margin: { l: 72, r: 16, t: 24, b: 52 },
      hovermode: 'x',
    };
    return { data, layout };
  }, [spectrum]);
  return <Plot data={figure.data} layout={figure.layout} height={340} label="Spectrum plot of P_R and P_t against k" />;
}
