import { Heading, HStack, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { ScanGrid, type PointOutput, type ScanDetail, type ScanGridSlice, type StoredScanSpec } from '@sixtyfold/shared';
import { useQueries } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { Panel } from '@/components/ui/panel';
import { SelectField } from '@/components/ui/select-field';
import { paths } from '@/config/paths';
import { formatNumber } from '@/lib/format-number';
import { COMPARED_LIKELIHOODS } from '../../api/get-evidence-comparison';
import { getScanQueryOptions, isLive } from '../../api/get-scan';
import { getScanGridQueryOptions, panelCells } from '../../api/get-scan-grid';
import { getScanPlaneQueryOptions } from '../../api/get-scan-plane';
import { likelihoodRef, useChosenLikelihoods } from '../../hooks/use-chosen-likelihoods';
import { useViewParams } from '../../hooks/use-view-params';
import { cellPointIndex, sameCells, zRangeOf } from '../../utils/grid-cells';
import type { BoundarySlice } from '../../utils/heatmap-figure';
import { outputLabel } from '../../utils/output-labels';
import { DRAWN_LEVELS, SET_COLORS } from '../../utils/plane-figure';
import { axisOptions, inputLabel } from '@/lib/point-labels';
import { BoundaryToggle } from '../heatmaps/boundary-toggle';
import { ScanHeatmap } from '../heatmaps/scan-heatmap';
import { LikelihoodSetChecks } from '../likelihood-set-picker';
import { NsRPlane } from '../plane/ns-r-plane';
import { PlaneControls, type PlaneSettings } from '../plane/plane-controls';
import type { UseRegionOverlay } from '../plane/region-overlay';
import { EvidenceTables } from './evidence-tables';

/** What the side-by-side maps can show; one colour scale spans all of them. */
export const COMPARED_OUTPUTS = ['ns', 'r', 'alphaS', 'nTotal', 'amplitudeScale'] as const satisfies readonly PointOutput[];
type ComparedOutput = (typeof COMPARED_OUTPUTS)[number];

/** Axis parameters every scan has, in the first scan's order: only those can be compared cell by cell. */
export function commonAxes(specs: Pick<StoredScanSpec, 'axes'>[]): string[] {
  if (specs.length === 0) return [];
  const [first, ...rest] = specs;
  // A scan over a list of points has no axes, so nothing to compare cell by cell.
  return (first.axes ?? []).map((axis) => axis.parameter).filter((name) => rest.every((spec) => (spec.axes ?? []).some((axis) => axis.parameter === name)));
}

/** Each axis that is neither x nor y sits at its middle value, in each scan's own grid. */
function middleOfOtherAxes(spec: StoredScanSpec, x: string, y: string): Record<string, number> {
  const axes = spec.axes ?? [];
  const grid = new ScanGrid(axes);
  return Object.fromEntries(
    axes.flatMap((axis, a) => (axis.parameter === x || axis.parameter === y ? [] : [[axis.parameter, Math.floor((grid.lengths[a] - 1) / 2)]])),
  );
}

/**
 * Two to four scans side by side: the same output over the same two axes on one colour scale,
 * then all of them on one n_s–r plane. Settings live in the address with the selection.
 */
export function ComparePlots({ scanIds, useRegionOverlay }: { scanIds: number[]; useRegionOverlay: UseRegionOverlay }) {
  const details = useQueries({ queries: scanIds.map((id) => getScanQueryOptions(id)) });
  const failed = details.find((query) => query.isError);
  if (failed?.isError) return <ErrorState title="Could not load a scan to compare" error={failed.error} onRetry={() => failed.refetch()} />;
  if (details.some((query) => !query.data)) return <LoadingState label="Loading the scans…" />;
  return <ComparedScans scans={details.map((query) => query.data!)} useRegionOverlay={useRegionOverlay} />;
}

function ComparedScans({ scans, useRegionOverlay }: { scans: ScanDetail[]; useRegionOverlay: UseRegionOverlay }) {
  const navigate = useNavigate();
  const specs = scans.map((scan) => scan.spec);
  const axes = commonAxes(specs);
  const [params, update] = useViewParams();

  const outputParam = params.get('output');
  const output: ComparedOutput = (COMPARED_OUTPUTS as readonly string[]).includes(outputParam ?? '') ? (outputParam as ComparedOutput) : 'ns';
  const xParam = params.get('x');
  const yParam = params.get('y');
  const x = xParam && axes.includes(xParam) ? xParam : axes[0];
  const y = yParam && axes.includes(yParam) && yParam !== x ? yParam : axes.find((name) => name !== x);
  const bounded = params.get('boundaries') !== 'off';
  // Every chosen set is drawn on every map and on the plane, each in its own colour.
  const likelihoods = useChosenLikelihoods(COMPARED_LIKELIHOODS);
  const canMap = x !== undefined && y !== undefined;

  // n_s and r of every scan (for hover), and the chosen output when it is another.
  const outputs: ComparedOutput[] = output === 'ns' || output === 'r' ? ['ns', 'r'] : ['ns', 'r', output];
  const sliceQueries = useQueries({
    queries: canMap
      ? scans.flatMap((scan, s) =>
          outputs.map((o) => ({
            ...getScanGridQueryOptions(scan.id, { x, y, output: o, at: middleOfOtherAxes(specs[s], x, y), maxCells: panelCells({ wide: false, live: isLive(scan) }) }, { live: isLive(scan) }),
          })),
        )
      : [],
  });
  const sliceOf = (s: number, o: ComparedOutput): ScanGridSlice | undefined => sliceQueries[s * outputs.length + outputs.indexOf(o)]?.data;
  const shown = scans.map((_, s) => sliceOf(s, output));
  const zRange = zRangeOf(shown.filter((slice): slice is ScanGridSlice => !!slice));
  // Each scan's Δχ² under each chosen set, at the same cells, for the boundary lines.
  const boundarySets = bounded && canMap ? likelihoods.sets : [];
  const boundaryQueries = useQueries({
    // A live scan's lines wait for it to finish, as on the scan page.
    queries: scans.flatMap((scan, s) =>
      boundarySets.map((set) =>
        getScanGridQueryOptions(
          scan.id,
          { x: x!, y: y!, output: 'deltaChi2', likelihood: likelihoodRef(set), at: middleOfOtherAxes(specs[s], x!, y!), maxCells: panelCells({ wide: false, live: false }) },
          { enabled: !isLive(scan) },
        ),
      ),
    ),
  });
  const boundariesOf = (s: number, slice: ScanGridSlice): BoundarySlice[] =>
    boundarySets.flatMap((_, b) => {
      const data = boundaryQueries[s * boundarySets.length + b]?.data;
      return data && sameCells(data, slice) ? [{ slice: data, color: SET_COLORS[b % SET_COLORS.length] }] : [];
    });
  const sliceError = [...sliceQueries, ...boundaryQueries].find((query) => query.isError);

  const planeQueries = useQueries({ queries: scans.map((scan) => getScanPlaneQueryOptions(scan.id, { live: isLive(scan) })) });
  const series = scans.flatMap((scan, s) => {
    const plane = planeQueries[s]?.data;
    return plane ? [{ label: scan.name, plane }] : [];
  });
  // The regions of every group the compared scans belong to.
  const regions = useRegionOverlay(scans.map((scan) => scan.groupId));
  const planeSettings: PlaneSettings = {
    colorBy: null,
    rScale: params.get('rscale') === 'log' ? 'log' : 'linear',
    references: params.get('refs') !== 'off',
  };
  const onPlaneChange = (changes: Partial<PlaneSettings>) =>
    update({
      ...(changes.rScale !== undefined && { rscale: changes.rScale === 'log' ? 'log' : null }),
      ...(changes.references !== undefined && { refs: changes.references ? null : 'off' }),
    });

  return (
    <Stack gap="6">
      <Panel p={{ base: '3', md: '4' }}>
        <HStack gap="4" wrap="wrap" align="end">
          <LikelihoodSetChecks choice={likelihoods} />
          <BoundaryToggle checked={bounded} onChange={(checked) => update({ boundaries: checked ? null : 'off' })} />
        </HStack>
        <Text fontSize="xs" color="fg.muted" mt="2">
          Each chosen set’s 68 and 95 % regions are drawn on the maps and on the plane below, each set in its own colour.
        </Text>
      </Panel>
      <Stack gap="3">
        <Heading as="h2" size="md" color="ink.900">
          Heatmaps on one colour scale
        </Heading>
        {!canMap ? (
          <Text color="fg.muted">
            These scans share {axes.length === 0 ? 'no axis' : `only the axis ${inputLabel(axes[0])}`}, so their cells cannot be laid
            side by side; the n_s–r plane below still compares them.
          </Text>
        ) : (
          <>
            <Panel p={{ base: '3', md: '4' }}>
              <HStack gap="3" wrap="wrap" align="end">
                <SelectField label="Output" value={output} options={COMPARED_OUTPUTS.map((o) => ({ value: o, label: outputLabel(o) }))} onChange={(next) => update({ output: next })} />
                <SelectField label="x axis" value={x} options={axisOptions(axes)} onChange={(next) => update(next === y ? { x: next, y: x } : { x: next })} />
                <SelectField label="y axis" value={y} options={axisOptions(axes.filter((a) => a !== x))} onChange={(next) => update({ y: next })} />
              </HStack>
              <Text fontSize="xs" color="fg.muted" mt="3">
                {zRange
                  ? `One colour scale for every scan: ${outputLabel(output)} from ${formatNumber(zRange[0])} to ${formatNumber(zRange[1])}.`
                  : 'No stored values yet.'}{' '}
                Other axes sit at their middle value in each scan.
                {boundarySets.length > 0 &&
                  ` Lines: the ${DRAWN_LEVELS.map((d) => `${d.percent} (${d.dash === 'solid' ? 'solid' : 'dashed'}, Δχ² = ${d.deltaChi2.toFixed(2)})`).join(' and ')} boundaries of ${boundarySets.map((set, b) => `${set.name} (${SET_COLORS[b % SET_COLORS.length].name})`).join(', ')}, for two parameters (n_s, r), through each cell’s Δχ².`}
              </Text>
            </Panel>
            {sliceError?.isError && <ErrorState title="Could not load a heatmap" error={sliceError.error} onRetry={() => sliceError.refetch()} />}
            <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
              {scans.map((scan, s) => {
                const slice = shown[s];
                const ns = sliceOf(s, 'ns');
                const r = sliceOf(s, 'r');
                const matched = slice && ns && r && sameCells(ns, r) && sameCells(slice, ns);
                const grid = new ScanGrid(specs[s].axes ?? []);
                return (
                  <Panel key={scan.id} p={{ base: '3', md: '4' }} minW="0">
                    {slice ? (
                      <ScanHeatmap
                        title={`${scan.name} — ${outputLabel(output)}`}
                        slice={slice}
                        zRange={zRange}
                        hoverSlices={matched ? [ns, r] : undefined}
                        boundaries={boundariesOf(s, slice)}
                        onCellClick={({ ix, iy }) => navigate(paths.point.getHref(scan.id, cellPointIndex(grid, slice, ix, iy)))}
                      />
                    ) : (
                      <LoadingState label={`Loading ${scan.name}…`} />
                    )}
                  </Panel>
                );
              })}
            </SimpleGrid>
          </>
        )}
      </Stack>

      <Stack gap="3">
        <Heading as="h2" size="md" color="ink.900">
          Together on the n_s–r plane
        </Heading>
        <Panel p={{ base: '3', md: '4' }}>
          <PlaneControls settings={planeSettings} onChange={onPlaneChange} />
          {regions.toggles && <Stack mt="3">{regions.toggles}</Stack>}
        </Panel>
        <Panel p={{ base: '3', md: '4' }}>
          {series.length < scans.length ? (
            <LoadingState label="Loading the n_s–r planes…" />
          ) : (
            <NsRPlane
              series={series}
              likelihoods={likelihoods.sets}
              rScale={planeSettings.rScale}
              references={planeSettings.references}
              regions={regions.shown}
              onPointClick={({ series: s, pointIndex }) => navigate(paths.point.getHref(scans[s].id, pointIndex))}
            />
          )}
        </Panel>
      </Stack>

      <EvidenceTables scans={scans} />
    </Stack>
  );
}
