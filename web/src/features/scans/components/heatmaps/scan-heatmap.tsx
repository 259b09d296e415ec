import { Heading, HStack, Stack, Text } from '@chakra-ui/react';
import type { ScanGridSlice } from '@sixtyfold/shared';
import { useMemo } from 'react';
import { Plot } from '@/components/plots/plot';
import { formatNumber } from '@/lib/format-number';
import { cellCounts, cellStatistic, zoomWindow, zRangeOf, type SliceWindow } from '../../utils/grid-cells';
import { heatmapFigure, type BoundarySlice } from '../../utils/heatmap-figure';
import { outputLabel } from '../../utils/output-labels';
import { inputLabel } from '@/lib/point-labels';

export interface ScanHeatmapProps {
  /** The output drawn, with each cell's counts (from useScanGridSlice). */
  slice: ScanGridSlice;
  title: string;
  /** One colour range in the output's units for several panels or scans; from this slice when absent. */
  zRange?: [number, number];
  /** Other outputs at the same cells, listed on hover (n_s and r beside α_s, say). */
  hoverSlices?: ScanGridSlice[];
  /** Δχ² slices at the same cells whose 68 and 95 % boundaries are drawn as lines. */
  boundaries?: BoundarySlice[];
  /** Cells marked with a dot (points with comments). */
  marked?: boolean[][] | null;
  /** A click on a stored cell, by its x and y index; combine with the slice's `at` for the point. */
  onCellClick?: (cell: { ix: number; iy: number }) => void;
  /** A drag over the plot: the axis-index window it covers; a double-click: null, the whole slice. */
  onZoom?: (window: SliceWindow | null) => void;
  /** Beside the title, e.g. a full-width switch. */
  actions?: React.ReactNode;
  height?: number;
}

/** The x and y ranges of a drag-zoom, or 'reset' for a double-click, from Plotly's relayout event. */
function zoomOf(event: Record<string, unknown>): { x: [number, number]; y: [number, number] } | 'reset' | null {
  if (event['xaxis.autorange'] === true || event['yaxis.autorange'] === true) return 'reset';
  const range = (axis: 'xaxis' | 'yaxis'): [number, number] | null => {
    const low = Number(event[`${axis}.range[0]`]);
    const high = Number(event[`${axis}.range[1]`]);
    return Number.isFinite(low) && Number.isFinite(high) ? [low, high] : null;
  };
  const x = range('xaxis');
  const y = range('yaxis');
  // A drag along one axis only keeps the other axis whole.
  return x || y ? { x: x ?? [-Infinity, Infinity], y: y ?? [-Infinity, Infinity] } : null;
}

/** One heatmap panel: the output over two axes, failed cells coloured by reason, blanks not yet stored. */
export function ScanHeatmap({ slice, title, zRange, hoverSlices, boundaries, marked, onCellClick, onZoom, actions, height = 340 }: ScanHeatmapProps) {
  const figure = useMemo(() => heatmapFigure({ slice, zRange, hoverSlices, boundaries, marked }), [slice, zRange, hoverSlices, boundaries, marked]);
  const counts = cellCounts(slice);
  const range = slice.output === 'status' ? undefined : zRangeOf([slice]);
  const axes = `${inputLabel(slice.x.parameter)} and ${inputLabel(slice.y.parameter)}`;
  const n = (value: number) => value.toLocaleString('en-US');

  return (
    <Stack gap="1.5" minW="0">
      <HStack justify="space-between" gap="2">
        <Heading as="h3" size="sm" color="ink.900">
          {title}
        </Heading>
        {actions}
      </HStack>
      <Plot
        data={figure.data}
        layout={figure.layout}
        height={height}
        label={`Heatmap of ${outputLabel(slice.output)} over ${axes}`}
        imageName={`heatmap-${slice.output}-${slice.x.parameter}-${slice.y.parameter}`}
        onRelayout={
          onZoom
            ? (event) => {
                const zoom = zoomOf(event);
                if (zoom === 'reset') onZoom(null);
                else if (zoom) {
                  const window = zoomWindow(slice, zoom.x, zoom.y);
                  if (window) onZoom(window);
                }
              }
            : undefined
        }
        onPointClick={
          onCellClick
            ? (point) => {
                const ix = Number(point.x);
                const iy = Number(point.y);
                if (Number.isInteger(ix) && Number.isInteger(iy)) onCellClick({ ix, iy });
              }
            : undefined
        }
      />
      <Text fontSize="xs" color="fg.muted">
        {zoomed(slice) ? `Zoomed in${onZoom ? ' (double-click to return)' : ''}; ` : ''}
        Cells: {cellStatistic(slice)}.{' '}
        {range ? `${outputLabel(slice.output)} from ${formatNumber(range[0])} to ${formatNumber(range[1])}; ` : ''}
        {n(counts.ok)} ok, {n(counts.failed)} failed, {n(counts.missing)} not stored yet
      </Text>
    </Stack>
  );
}

/** True when a slice shows a window, not the whole of its axes. */
function zoomed({ x, y }: Pick<ScanHeatmapProps['slice'], 'x' | 'y'>): boolean {
  return x.from > 0 || y.from > 0 || x.to < x.length - 1 || y.to < y.length - 1;
}
