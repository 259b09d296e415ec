import { Button, HStack, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { ScanGrid, type ScanDetail, type ScanGridSlice, type StoredScanSpec } from '@sixtyfold/shared';
import type { UseQueryResult } from '@tanstack/react-query';
import { useCallback, useEffect, useMemo } from 'react';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { preloadPlot } from '@/components/plots/plot';
import { Panel } from '@/components/ui/panel';
import { SelectField } from '@/components/ui/select-field';
import { isLive } from '../../api/get-scan';
import { DEFAULT_LIKELIHOOD } from '../../api/get-likelihood-sets';
import { panelCells, useScanGridSlice, type ScanGridParams } from '../../api/get-scan-grid';
import { likelihoodRef, useChosenLikelihoods } from '../../hooks/use-chosen-likelihoods';
import { useViewParams } from '../../hooks/use-view-params';
import { cellCounts, cellPointIndex, failedByReason, failureGroups, markedCells, sameCells, type SliceWindow } from '../../utils/grid-cells';
import type { BoundarySlice } from '../../utils/heatmap-figure';
import { outputLabel } from '../../utils/output-labels';
import { DRAWN_LEVELS, SET_COLORS } from '../../utils/plane-figure';
import { axisOptions } from '@/lib/point-labels';
import { LikelihoodSetNote } from '../likelihood-set-note';
import { LikelihoodSetSelect } from '../likelihood-set-picker';
import { AxisSlider } from './axis-slider';
import { BoundaryToggle } from './boundary-toggle';
import { FailureLegend } from './failure-legend';
import { PointDrawer, useOpenPoint, type PointDiscussion } from './point-drawer';
import { ScanHeatmap } from './scan-heatmap';

/** The outputs the third panel may show beside n_s and r. */
export const THIRD_OUTPUTS = ['alphaS', 'nTotal', 'amplitudeScale', 'status'] as const;
type ThirdOutput = (typeof THIRD_OUTPUTS)[number];

const TITLES: Record<'ns' | 'r' | ThirdOutput, string> = {
  ns: 'Spectral index n_s',
  r: 'Tensor-to-scalar ratio r',
  alphaS: 'Running α_s',
  nTotal: 'N_total, e-folds from φ_init to the end',
  amplitudeScale: 'A_s normalisation, the factor on V for A_s = 2.1 × 10⁻⁹',
  status: 'Status of each point',
};

const WINDOW_KEYS = ['xFrom', 'xTo', 'yFrom', 'yTo'] as const;
/** Changing the axes or a cut leaves the zoom window behind. */
const NO_WINDOW = Object.fromEntries(WINDOW_KEYS.map((key) => [key, null]));

/** The zoom window kept in the address, when all four ends are whole numbers inside the axes. */
function windowParam(params: URLSearchParams, xLength: number, yLength: number): SliceWindow | null {
  const ends = WINDOW_KEYS.map((key) => Number(params.get(key) ?? NaN));
  const [xFrom, xTo, yFrom, yTo] = ends;
  if (!ends.every((end) => Number.isInteger(end) && end >= 0)) return null;
  return xFrom <= xTo && xTo < xLength && yFrom <= yTo && yTo < yLength ? { xFrom, xTo, yFrom, yTo } : null;
}

interface ScanHeatmapsProps {
  scan: ScanDetail;
  spec: StoredScanSpec;
  pointDiscussion?: PointDiscussion;
}

/** A panel of one slice query: the heatmap once there is data, else loading or what went wrong. */
function SlicePanel({ query, what, wide = false, children }: { query: UseQueryResult<ScanGridSlice>; what: string; wide?: boolean; children: (slice: ScanGridSlice) => React.ReactNode }) {
  return (
    <Panel p={{ base: '3', md: '4' }} minW="0" gridColumn={wide ? '1 / -1' : undefined}>
      {query.data ? (
        <Stack gap="2">
          {query.isError && <Text fontSize="xs" color="fg.error">Could not refresh {what}: {query.error.message}</Text>}
          {children(query.data)}
        </Stack>
      ) : query.isError ? (
        <ErrorState title={`Could not load the ${what} slice`} error={query.error} onRetry={() => query.refetch()} />
      ) : (
        <LoadingState label={`Loading ${what}…`} />
      )}
    </Panel>
  );
}

/** n_s and r side by side and one output of choice, over two axes, with the others held by sliders. */
export function ScanHeatmaps({ scan, spec, pointDiscussion }: ScanHeatmapsProps) {
  // Mounted for grids only (scan-views.tsx).
  const grid = useMemo(() => new ScanGrid(spec.axes ?? []), [spec]);
  const names = grid.axes.map((axis) => axis.parameter);
  const [params, update] = useViewParams();
  // Plotly loads while the slices are read, not after them.
  useEffect(preloadPlot, []);

  const xParam = params.get('x');
  const yParam = params.get('y');
  const thirdParam = params.get('third');
  const x = xParam && names.includes(xParam) ? xParam : names[0];
  const y = yParam && names.includes(yParam) && yParam !== x ? yParam : names.find((name) => name !== x)!;
  const third: ThirdOutput = (THIRD_OUTPUTS as readonly string[]).includes(thirdParam ?? '') ? (thirdParam as ThirdOutput) : 'alphaS';
  const bounded = params.get('boundaries') !== 'off';
  const likelihoods = useChosenLikelihoods([DEFAULT_LIKELIHOOD]);
  const set = likelihoods.sets[0];

  // Axes other than x and y sit at an index kept in the address as at.<parameter>; the middle by default.
  const at: Record<string, number> = {};
  names.forEach((name, a) => {
    if (name === x || name === y) return;
    const raw = params.get(`at.${name}`);
    const index = Number(raw);
    at[name] = raw !== null && Number.isInteger(index) && index >= 0 && index < grid.lengths[a] ? index : Math.floor((grid.lengths[a] - 1) / 2);
  });
  // A zoom window stays while a slider moves: the same region of another cut.
  const setAt = useCallback((name: string, index: number) => update({ [`at.${name}`]: String(index) }), [update]);
  const window = windowParam(params, grid.lengths[names.indexOf(x)], grid.lengths[names.indexOf(y)]);
  const onZoom = useCallback(
    (next: SliceWindow | null) => update(next ? Object.fromEntries(WINDOW_KEYS.map((key) => [key, String(next[key])])) : NO_WINDOW),
    [update],
  );
  const wide = params.get('wide') === 'on';

  const live = isLive(scan);
  // All panels ask for the same cells, so that n_s and r combine on hover and the boundary lines fall on every map.
  const base = { x, y, at, window, maxCells: panelCells({ wide, live }) };
  const ns = useScanGridSlice(scan.id, { ...base, output: 'ns' } satisfies ScanGridParams, { live });
  const r = useScanGridSlice(scan.id, { ...base, output: 'r' }, { live });
  const extra = useScanGridSlice(scan.id, { ...base, output: third }, { live });
  // The boundary lines wait for the finished scan: while it fills in, a fourth slice at every refresh
  // would redraw all three panels each time and keep the page busy (measured by `npm run bench -- million`).
  // They are asked once the three maps are in, so the maps get the server first.
  const drawBoundaries = bounded && !!set && !live;
  const mapsIn = !!ns.data && !!r.data && !!extra.data;
  const boundary = useScanGridSlice(scan.id, { ...base, output: 'deltaChi2', likelihood: set && likelihoodRef(set) }, { enabled: drawBoundaries && mapsIn });

  // n_s and r are combined on hover only while both describe the same cells.
  const nsSlice = ns.data;
  const rSlice = r.data;
  const matched = nsSlice && rSlice && sameCells(nsSlice, rSlice) ? { ns: nsSlice, r: rSlice } : null;
  const hoverSlices = useMemo(() => (nsSlice && rSlice ? [nsSlice, rSlice] : []), [nsSlice, rSlice]);
  const boundarySlice = drawBoundaries ? boundary.data : undefined;
  // One array per Δχ² answer, so a panel's figure is rebuilt only when the lines change.
  const boundaries = useMemo<BoundarySlice[]>(() => (boundarySlice ? [{ slice: boundarySlice, color: SET_COLORS[0] }] : []), [boundarySlice]);

  // The clicked cell's point opens in the drawer.
  const [, openPoint] = useOpenPoint(grid.size);
  const openCell = (slice: ScanGridSlice) => (cell: { ix: number; iy: number }) =>
    openPoint(cellPointIndex(grid, slice, cell.ix, cell.iy));
  const counts = pointDiscussion?.counts;
  // Marks are worked out once per slice and set of counts, so a panel's figure is rebuilt only when they change.
  const marks = useMemo(() => new WeakMap<ScanGridSlice, boolean[][] | null>(), [counts, grid]);
  const marksOf = (slice: ScanGridSlice) => {
    if (!counts) return null;
    if (!marks.has(slice)) marks.set(slice, markedCells(grid, slice, counts));
    return marks.get(slice) ?? null;
  };
  const panelProps = (slice: ScanGridSlice) => ({
    slice,
    hoverSlices: matched && sameCells(slice, matched.ns) ? hoverSlices : undefined,
    boundaries: boundarySlice && sameCells(slice, boundarySlice) ? boundaries : undefined,
    marked: marksOf(slice),
    onCellClick: openCell(slice),
    onZoom,
  });

  const statusSource = ns.data ?? r.data;

  return (
    <Stack gap="4">
      <Panel p={{ base: '3', md: '4' }}>
        <Stack gap="4">
          <HStack gap="3" wrap="wrap" align="end">
            <SelectField
              label="x axis"
              value={x}
              options={axisOptions(names)}
              // Choosing the current y for x swaps the two.
              onChange={(next) => update(next === y ? { ...NO_WINDOW, x: next, y: x } : { ...NO_WINDOW, x: next })}
            />
            <SelectField label="y axis" value={y} options={axisOptions(names.filter((name) => name !== x))} onChange={(next) => update({ ...NO_WINDOW, y: next })} />
            <Button size="sm" variant="outline" onClick={() => update({ ...NO_WINDOW, x: y, y: x })}>
              Swap axes
            </Button>
            <SelectField
              label="Third panel"
              value={third}
              options={THIRD_OUTPUTS.map((output) => ({ value: output, label: outputLabel(output) }))}
              onChange={(next) => update({ third: next })}
              minW="48"
            />
            <LikelihoodSetSelect choice={likelihoods} />
            <BoundaryToggle checked={bounded} onChange={(checked) => update({ boundaries: checked ? null : 'off' })} />
          </HStack>
          {Object.keys(at).length > 0 && (
            <Stack direction={{ base: 'column', md: 'row' }} gap="6">
              {Object.entries(at).map(([name, index]) => (
                <AxisSlider
                  key={name}
                  parameter={name}
                  values={grid.values[names.indexOf(name)]}
                  index={index}
                  onChange={(next) => setAt(name, next)}
                />
              ))}
            </Stack>
          )}
        </Stack>
      </Panel>

      <SimpleGrid columns={{ base: 1, md: 2, xl: 3 }} gap="4">
        <SlicePanel query={ns} what="n_s" wide={wide}>
          {(slice) => (
            <ScanHeatmap
              title={TITLES.ns}
              {...panelProps(slice)}
              height={wide ? 560 : undefined}
              actions={
                <Button size="xs" variant="ghost" aria-pressed={wide} onClick={() => update({ wide: wide ? null : 'on' })}>
                  {wide ? 'Back to three across' : 'Full width'}
                </Button>
              }
            />
          )}
        </SlicePanel>
        <SlicePanel query={r} what="r">
          {(slice) => <ScanHeatmap title={TITLES.r} {...panelProps(slice)} />}
        </SlicePanel>
        <SlicePanel query={extra} what={outputLabel(third)}>
          {(slice) => <ScanHeatmap title={TITLES[third]} {...panelProps(slice)} />}
        </SlicePanel>
      </SimpleGrid>

      <Stack gap="2" fontSize="sm" color="fg.muted">
        {statusSource && <FailureLegend groups={failureGroups(failedByReason(statusSource))} missing={cellCounts(statusSource).missing} />}
        {bounded && set && (
          <>
            <Text>
              {live ? 'Once the scan has finished, lines show ' : 'Lines: '}the{' '}
              {DRAWN_LEVELS.map((d) => `${d.percent} (${d.dash === 'solid' ? 'solid' : 'dashed'}, Δχ² = ${d.deltaChi2.toFixed(2)})`).join(' and ')} boundaries
              of {set.name} for two parameters (n_s, r), drawn through each cell’s Δχ² (a block’s mean)
              {boundarySlice?.refined?.cells.length ? ', through the refinement levels’ finer cells where they are' : ''}.
              {boundary.isError ? ` Could not load them: ${boundary.error.message}` : ''}
            </Text>
            <LikelihoodSetNote likelihood={set} />
          </>
        )}
        <Text>
          Click a cell for its point (a block: its first point){pointDiscussion ? ' and its discussion; cells with a dot have comments' : ''}. Drag
          over a map to zoom in at finer resolution; double-click to return.
          {live ? ' The maps fill in as workers store points.' : ''}
        </Text>
      </Stack>

      <PointDrawer scan={scan} grid={grid} pointDiscussion={pointDiscussion} />
    </Stack>
  );
}
