import { Button, HStack, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { findLimits, nsInterval, ScanGrid, type ScanDetail, type ScanGridSlice, type StoredScanSpec } from '@sixtyfold/shared';
import type { UseQueryResult } from '@tanstack/react-query';
import { useCallback, useEffect, useMemo } from 'react';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingState } from '@/components/ui/loading-state';
import { preloadPlot } from '@/components/plots/plot';
import { Panel } from '@/components/ui/panel';
import { SelectField } from '@/components/ui/select-field';
import { formatNumber } from '@/lib/format-number';
import { isLive } from '../../api/get-scan';
import { panelCells, useScanGridSlice, type ScanGridParams } from '../../api/get-scan-grid';
import { useViewParams } from '../../hooks/use-view-params';
import { cellCounts, cellPointIndex, failedByReason, failureGroups, insideLimitsMask, markedCells, sameCells, type SliceWindow } from '../../utils/grid-cells';
import { outputLabel } from '../../utils/output-labels';
import { axisOptions } from '../../utils/point-columns';
import { LimitSetSelect } from '../limit-set-select';
import { AxisSlider } from './axis-slider';
import { FailureLegend } from './failure-legend';
import { OutlineToggle } from './outline-toggle';
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
  const outlined = params.get('outline') !== 'off';
  const limits = findLimits(params.get('limits') ?? undefined);

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
  // All three panels ask for the same cells, so that n_s and r combine on hover and in the outline.
  const base = { x, y, at, window, maxCells: panelCells({ wide, live }) };
  const ns = useScanGridSlice(scan.id, { ...base, output: 'ns' } satisfies ScanGridParams, { live });
  const r = useScanGridSlice(scan.id, { ...base, output: 'r' }, { live });
  const extra = useScanGridSlice(scan.id, { ...base, output: third }, { live });

  // n_s and r are combined (hover, outline) only while both describe the same cells.
  const nsSlice = ns.data;
  const rSlice = r.data;
  const matched = nsSlice && rSlice && sameCells(nsSlice, rSlice) ? { ns: nsSlice, r: rSlice } : null;
  const hoverSlices = useMemo(() => (nsSlice && rSlice ? [nsSlice, rSlice] : []), [nsSlice, rSlice]);
  const outline = useMemo(
    () => (outlined && nsSlice && rSlice && sameCells(nsSlice, rSlice) ? insideLimitsMask(nsSlice, rSlice, limits) : null),
    [outlined, nsSlice, rSlice, limits],
  );
  const insideCount = outline ? outline.reduce((n, row) => n + row.filter(Boolean).length, 0) : 0;

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
    outline: outline && matched && sameCells(slice, matched.ns) ? outline : null,
    marked: marksOf(slice),
    onCellClick: openCell(slice),
    onZoom,
  });

  const statusSource = ns.data ?? r.data;
  const [nsLow, nsHigh] = nsInterval(limits, 95);

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
            <LimitSetSelect value={limits.key} onChange={(key) => update({ limits: key })} />
            <OutlineToggle checked={outlined} onChange={(checked) => update({ outline: checked ? null : 'off' })} />
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
        {outlined && (
          <Text>
            Outlined{matched ? ` (${insideCount.toLocaleString('en-US')} cells)` : ''}: n_s in the 95% interval {formatNumber(nsLow)} to{' '}
            {formatNumber(nsHigh)} and r below {formatNumber(limits.r.max95)}, the n_s interval × r bound of {limits.label} (the product of the two
            one-dimensional limits, not the joint contour). Source: {limits.source}.
          </Text>
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
