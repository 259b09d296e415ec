import { SimpleGrid } from '@chakra-ui/react';
import type { ScanConstraints } from '@sixtyfold/shared';
import type { Data, Layout } from 'plotly.js';
import { Plot, PLOT_COLORS } from '@/components/plots/plot';
import { Panel } from '@/components/ui/panel';
import { inputLabel } from '@/lib/point-labels';

/** The 68 and 95 % regions as bands behind the curve; a one-sided limit's band runs from the axis end. */
function intervalBands(constraint: ScanConstraints['constraints'][number] | undefined): Partial<Layout>['shapes'] {
  return (constraint?.intervals ?? []).map((interval) => ({
    type: 'rect',
    xref: 'x',
    yref: 'paper',
    x0: interval.lower,
    x1: interval.upper,
    y0: 0,
    y1: 1,
    line: { width: 0 },
    fillcolor: interval.level === 0.68 ? PLOT_COLORS.limit68 : PLOT_COLORS.limit95,
    layer: 'below',
  }));
}

/** Each axis's 1-D marginal as a small line plot, on a log axis where its prior is uniform in the logarithm. */
export function MarginalPlots({ answer }: { answer: ScanConstraints }) {
  return (
    <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
      {answer.marginals.map((marginal) => {
        const label = inputLabel(marginal.axis);
        const data: Data[] = [
          { type: 'scatter', mode: 'lines+markers', x: marginal.values, y: marginal.density, line: { color: PLOT_COLORS.ember }, marker: { size: 4 }, name: label },
        ];
        const layout: Partial<Layout> = {
          showlegend: false,
          xaxis: { title: { text: label }, type: marginal.prior === 'log' ? 'log' : 'linear' },
          yaxis: { title: { text: 'Posterior density' }, rangemode: 'tozero' },
          shapes: intervalBands(answer.constraints.find((c) => c.axis === marginal.axis)),
        };
        return (
          <Panel key={marginal.axis} p={{ base: '3', md: '4' }} minW="0">
            <Plot data={data} layout={layout} height={260} label={`1-D marginal of ${label}`} imageName={`marginal-${marginal.axis}`} />
          </Panel>
        );
      })}
    </SimpleGrid>
  );
}
