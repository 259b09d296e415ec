import { Heading, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { axisValues, ScanGrid, type PointOutput, type ScanDetail, type StoredScanSpec } from '@sixtyfold/shared';
import { useMemo } from 'react';
import { Plot } from '@/components/plots/plot';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Panel } from '@/components/ui/panel';
import { SelectField } from '@/components/ui/select-field';
import { isLive } from '../../api/get-scan';
import { LINE_POINT_LIMIT, useScanLine } from '../../api/get-scan-line';
import { useViewParams } from '../../hooks/use-view-params';
import { failureGroups, isLogSpaced } from '../../utils/grid-cells';
import { lineFigure } from '../../utils/line-figure';
import { outputLabel } from '../../utils/output-labels';
import { inputLabel } from '@/lib/point-labels';
import { FailureLegend } from './failure-legend';
import { PointDrawer, useOpenPoint, type PointDiscussion } from './point-drawer';

const THIRD_LINE_OUTPUTS = ['alphaS', 'nTotal', 'amplitudeScale'] as const satisfies PointOutput[];

/** A one-axis scan has no heatmap: n_s, r and one more output are drawn against its axis. */
export function ScanLinePlots({ scan, spec, pointDiscussion }: { scan: ScanDetail; spec: StoredScanSpec; pointDiscussion?: PointDiscussion }) {
  // Mounted for one-axis grids only (scan-views.tsx).
  const grid = useMemo(() => new ScanGrid(spec.axes ?? []), [spec]);
  const [, openPoint] = useOpenPoint(grid.size);
  const axis = grid.axes[0];
  const values = useMemo(() => axisValues(axis), [axis]);
  const log = isLogSpaced(values);
  const line = useScanLine(scan.id, { live: isLive(scan) });
  const [params, update] = useViewParams();
  const thirdParam = params.get('third');
  const third: PointOutput = (THIRD_LINE_OUTPUTS as readonly string[]).includes(thirdParam ?? '') ? (thirdParam as PointOutput) : 'alphaS';

  if (line.isPending) return <LoadingState label="Loading the points…" />;
  if (line.isError && !line.data) return <ErrorState title="Could not load the points of this scan" error={line.error} onRetry={() => line.refetch()} />;

  const { points, stored } = line.data;
  const failed: Record<string, number> = {};
  for (const p of points) if (p.status !== 'ok') failed[p.status] = (failed[p.status] ?? 0) + 1;
  const groups = failureGroups(failed);
  const missing = Math.max(0, values.length - stored);
  const outputs: PointOutput[] = ['ns', 'r', third];

  return (
    <Stack gap="4">
      <Panel p={{ base: '3', md: '4' }}>
        <SelectField
          label="Third panel"
          value={third}
          options={THIRD_LINE_OUTPUTS.map((output) => ({ value: output, label: outputLabel(output) }))}
          onChange={(next) => update({ third: next })}
        />
      </Panel>
      {line.isError && <Text fontSize="sm" color="fg.error">Could not refresh the points: {line.error.message}</Text>}
      <SimpleGrid columns={{ base: 1, md: 2, xl: 3 }} gap="4">
        {outputs.map((output) => {
          const figure = lineFigure(points, axis.parameter, output, log);
          return (
            <Panel key={output} p={{ base: '3', md: '4' }} minW="0">
              <Stack gap="1.5">
                <Heading as="h3" size="sm" color="ink.900">
                  {outputLabel(output)} against {inputLabel(axis.parameter)}
                </Heading>
                <Plot
                  data={figure.data}
                  layout={figure.layout}
                  height={320}
                  label={`Line plot of ${outputLabel(output)} against ${inputLabel(axis.parameter)}`}
                  onPointClick={(point) => {
                    if (typeof point.customdata === 'number') openPoint(point.customdata);
                  }}
                />
              </Stack>
            </Panel>
          );
        })}
      </SimpleGrid>
      <Stack gap="2" fontSize="sm" color="fg.muted">
        <FailureLegend groups={groups} missing={missing} />
        {stored > points.length && (
          <Text>
            Showing the first {LINE_POINT_LIMIT.toLocaleString('en-US')} of {stored.toLocaleString('en-US')} stored points; the points table
            has them all.
          </Text>
        )}
        <Text>Failed points are shaded by reason. Click a point for its numbers{pointDiscussion ? ' and its discussion' : ''}.</Text>
      </Stack>
      <PointDrawer scan={scan} grid={grid} pointDiscussion={pointDiscussion} />
    </Stack>
  );
}
