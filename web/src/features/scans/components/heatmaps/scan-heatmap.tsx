import { Heading, Stack, Text } from '@chakra-ui/react';
import type { ScanGridSlice } from '@sixtyfold/shared';
import { useMemo } from 'react';
import { Plot } from '@/components/plots/plot';
import { formatNumber } from '@/lib/format-number';
import { cellCounts, zRangeOf } from '../../utils/grid-cells';
import { heatmapFigure } from '../../utils/heatmap-figure';
import { outputLabel } from '../../utils/output-labels';
import { inputLabel } from '../../utils/point-columns';

export interface ScanHeatmapProps {
  /** The output drawn, with every cell's status (from useScanGridSlice). */
  slice: ScanGridSlice;
  title: string;
  /** One colour range in the output's units for several panels or scans; from this slice when absent. */
  zRange?: [number, number];
  /** Other outputs at the same cells, listed on hover (n_s and r beside α_s, say). */
  hoverSlices?: ScanGridSlice[];
  /** Cells to outline, e.g. insideLimitsMask(ns, r, limits). */
  outline?: boolean[][] | null;
  /** Cells marked with a dot (points with comments). */
  marked?: boolean[][] | null;
  /** A click on a stored cell, by its x and y index; combine with the slice's `at` for the point. */
  onCellClick?: (cell: { ix: number; iy: number }) => void;
  height?: number;
}

/** One heatmap panel: the output over two axes, failed cells coloured by reason, blanks not yet stored. */
export function ScanHeatmap({ slice, title, zRange, hoverSlices, outline, marked, onCellClick, height = 340 }: ScanHeatmapProps) {
  const figure = useMemo(() => heatmapFigure({ slice, zRange, hoverSlices, outline, marked }), [slice, zRange, hoverSlices, outline, marked]);
  const counts = cellCounts(slice.status);
  const range = slice.output === 'status' ? undefined : zRangeOf([slice]);
  const axes = `${inputLabel(slice.x.parameter)} and ${inputLabel(slice.y.parameter)}`;
  const n = (value: number) => value.toLocaleString('en-US');

  return (
    <Stack gap="1.5" minW="0">
      <Heading as="h3" size="sm" color="ink.900">
        {title}
      </Heading>
      <Plot
        data={figure.data}
        layout={figure.layout}
        height={height}
        label={`Heatmap of ${outputLabel(slice.output)} over ${axes}`}
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
        {range ? `${outputLabel(slice.output)} from ${formatNumber(range[0])} to ${formatNumber(range[1])}; ` : ''}
        {n(counts.ok)} ok, {n(counts.failed)} failed, {n(counts.missing)} not stored yet
      </Text>
    </Stack>
  );
}
