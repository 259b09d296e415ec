import { Heading, SimpleGrid, Stack } from '@chakra-ui/react';
import type { EvaluateResponse } from '@sixtyfold/shared';
import type { Data, Layout } from 'plotly.js';
import { useMemo } from 'react';
import { Plot, PLOT_COLORS } from '@/components/plots/plot';

type Trajectory = NonNullable<EvaluateResponse['trajectory']>;

interface PointTrajectoryProps {
  trajectory: Trajectory;
  /** E-folds from φ_init to the end of inflation, and N_* before the end: where the pivot crossed. */
  nTotal: number | null;
  nStar: number | null;
}

/** Vertical markers at the pivot crossing and the end of inflation. */
function marks(nTotal: number | null, nStar: number | null): Partial<Layout> {
  const lines: { at: number; label: string; color: string }[] = [];
  if (nTotal !== null && nStar !== null) lines.push({ at: nTotal - nStar, label: 'pivot', color: PLOT_COLORS.ember });
  if (nTotal !== null) lines.push({ at: nTotal, label: 'end', color: PLOT_COLORS.muted });
  return {
    shapes: lines.map((line) => ({ type: 'line', xref: 'x', yref: 'paper', x0: line.at, x1: line.at, y0: 0, y1: 1, line: { color: line.color, width: 1.5, dash: 'dot' } })),
    annotations: lines.map((line) => ({ x: line.at, y: 1, xref: 'x', yref: 'paper', text: line.label, showarrow: false, yanchor: 'bottom', font: { size: 11, color: line.color } })),
  };
}

/** φ(N) and ε_H(N) of the background the point was computed on, from φ_init to the end of inflation. */
export function PointTrajectory({ trajectory, nTotal, nStar }: PointTrajectoryProps) {
  const figures = useMemo(() => {
    const marked = marks(nTotal, nStar);
    const base: Partial<Layout> = { ...marked, showlegend: false, margin: { l: 64, r: 16, t: 24, b: 52 }, hovermode: 'x' };
    const phi: Data[] = [{ type: 'scatter', mode: 'lines', name: 'φ', x: trajectory.N, y: trajectory.phi, line: { color: PLOT_COLORS.accent, width: 2 }, hovertemplate: 'N = %{x:.3f}<br>φ = %{y:.6g}<extra></extra>' }];
    const epsilon: Data[] = [
      { type: 'scatter', mode: 'lines', name: 'ε_H', x: trajectory.N, y: trajectory.epsilonH, line: { color: PLOT_COLORS.ember, width: 2 }, hovertemplate: 'N = %{x:.3f}<br>ε_H = %{y:.4g}<extra></extra>' },
    ];
    return {
      phi: { data: phi, layout: { ...base, xaxis: { title: { text: 'N (e-folds from φ_init)' } }, yaxis: { title: { text: 'φ (M_pl)' } } } },
      epsilon: {
        data: epsilon,
        layout: {
          ...base,
          shapes: [...(base.shapes ?? []), { type: 'line', xref: 'paper', yref: 'y', x0: 0, x1: 1, y0: 1, y1: 1, line: { color: PLOT_COLORS.muted, width: 1 } }],
          xaxis: { title: { text: 'N (e-folds from φ_init)' } },
          // Decades only: the minor ticks of a log axis crowd a small chart.
          yaxis: { title: { text: 'ε_H' }, type: 'log', exponentformat: 'power', dtick: 1 },
        } as Partial<Layout>,
      },
    };
  }, [trajectory, nTotal, nStar]);

  return (
    <SimpleGrid columns={{ base: 1, lg: 2 }} gap="4">
      <Stack gap="1">
        <Heading as="h3" size="sm" color="ink.900">
          Field φ(N)
        </Heading>
        <Plot data={figures.phi.data} layout={figures.phi.layout} height={300} label="Trajectory plot of φ against N" />
      </Stack>
      <Stack gap="1">
        <Heading as="h3" size="sm" color="ink.900">
          Slow-roll parameter ε_H(N), inflation ends at 1
        </Heading>
        <Plot data={figures.epsilon.data} layout={figures.epsilon.layout} height={300} label="Trajectory plot of ε_H against N" />
      </Stack>
    </SimpleGrid>
  );
}
