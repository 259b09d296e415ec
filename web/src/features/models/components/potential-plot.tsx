import type { CompiledPotential } from '@sixtyfold/shared';
import type { Data, Layout } from 'plotly.js';
import { useMemo } from 'react';
import { Plot, PLOT_COLORS } from '@/components/plots/plot';
import { slowRollCurves } from '../utils/slow-roll-curves';

interface PotentialPlotProps {
  potential: CompiledPotential;
  phiMin: number;
  phiMax: number;
  /** Where the field starts, marked on both panels when known. */
  phiStart?: number;
}

export const POTENTIAL_PLOT_LABEL = 'V(φ) above, and the slow-roll parameters ε_V and |η_V| on a log scale below';

/** V(φ) on the upper panel; ε_V and |η_V| below on a log axis, with the line ε_V = 1 where slow roll ends. */
export function PotentialPlot({ potential, phiMin, phiMax, phiStart }: PotentialPlotProps) {
  const curves = useMemo(() => slowRollCurves(potential, phiMin, phiMax), [potential, phiMin, phiMax]);

  const data = useMemo<Data[]>(
    () => [
      {
        x: curves.phi,
        y: curves.V,
        type: 'scatter',
        mode: 'lines',
        name: 'V(φ)',
        line: { color: PLOT_COLORS.ink, width: 2 },
        hovertemplate: 'φ = %{x:.4g}<br>V = %{y:.4g}<extra></extra>',
      },
      {
        x: curves.phi,
        y: curves.epsilonV,
        type: 'scatter',
        mode: 'lines',
        name: 'ε_V',
        xaxis: 'x',
        yaxis: 'y2',
        line: { color: PLOT_COLORS.ember, width: 2 },
        hovertemplate: 'φ = %{x:.4g}<br>ε_V = %{y:.3g}<extra></extra>',
      },
      {
        x: curves.phi,
        y: curves.absEtaV,
        type: 'scatter',
        mode: 'lines',
        name: '|η_V|',
        xaxis: 'x',
        yaxis: 'y2',
        line: { color: PLOT_COLORS.accent, width: 2, dash: 'dot' },
        hovertemplate: 'φ = %{x:.4g}<br>|η_V| = %{y:.3g}<extra></extra>',
      },
      {
        x: [phiMin, phiMax],
        y: [1, 1],
        type: 'scatter',
        mode: 'lines',
        name: 'ε_V = 1 (slow roll ends)',
        xaxis: 'x',
        yaxis: 'y2',
        line: { color: PLOT_COLORS.muted, width: 1, dash: 'dash' },
        hoverinfo: 'skip',
      },
    ],
    [curves, phiMin, phiMax],
  );

  const layout = useMemo<Partial<Layout>>(
    () => ({
      margin: { l: 72, r: 24, t: 28, b: 56 },
      legend: { orientation: 'h', x: 0, y: -0.14 },
      xaxis: { title: { text: 'φ (reduced Planck units)' }, anchor: 'y2', range: [phiMin, phiMax] },
      yaxis: { title: { text: 'V(φ)' }, domain: [0.55, 1], exponentformat: 'power' },
      yaxis2: {
        title: { text: 'ε_V, |η_V|' },
        domain: [0, 0.45],
        type: 'log',
        exponentformat: 'power',
        dtick: 1,
        gridcolor: PLOT_COLORS.grid,
      },
      shapes:
        phiStart !== undefined && phiStart >= phiMin && phiStart <= phiMax
          ? [{ type: 'line', xref: 'x', yref: 'paper', x0: phiStart, x1: phiStart, y0: 0, y1: 1, line: { color: PLOT_COLORS.ember, width: 1, dash: 'dot' } }]
          : [],
      annotations:
        phiStart !== undefined && phiStart >= phiMin && phiStart <= phiMax
          ? [{ x: phiStart, y: 1, xref: 'x', yref: 'paper', text: 'φ_init', showarrow: false, yanchor: 'bottom', font: { color: PLOT_COLORS.ember, size: 11 } }]
          : [],
    }),
    [phiMin, phiMax, phiStart],
  );

  return <Plot data={data} layout={layout} label={POTENTIAL_PLOT_LABEL} height={520} />;
}
