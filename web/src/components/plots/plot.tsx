import { Box, type BoxProps } from '@chakra-ui/react';
import type { Config, Data, Layout } from 'plotly.js';
import { lazy, Suspense, useMemo } from 'react';
import { LoadingState } from '@/components/ui/loading-state';

const loadPlotly = () => import('./plotly-chart');
const PlotlyChart = lazy(loadPlotly);

/**
 * Starts loading Plotly (a large chunk) without drawing anything: a page whose charts wait for data
 * calls it first, so the chunk arrives while the data does instead of after it.
 */
export const preloadPlot = () => {
  // A failed load shows where the chart would be, when the chart itself asks again.
  loadPlotly().catch(() => undefined);
};

/** Typography and colours shared by every chart, matching the app theme. */
export const PLOT_FONT = "'IBM Plex Sans', system-ui, sans-serif";
export const PLOT_COLORS = {
  ink: '#1a234f',
  muted: '#686153',
  grid: '#e7e3da',
  ember: '#ea7a12',
  accent: '#43529e',
  limit68: 'rgba(67, 82, 158, 0.22)',
  limit95: 'rgba(67, 82, 158, 0.10)',
  failed: '#b3261e',
};

/** A sequential scale from deep ink through violet to ember, readable in greyscale too. */
export const PLOT_COLORSCALE: [number, string][] = [
  [0, '#111735'],
  [0.25, '#323f83'],
  [0.5, '#8c5aa8'],
  [0.75, '#f08a3c'],
  [1, '#ffe7a8'],
];

export interface PlotProps extends Omit<BoxProps, 'onClick'> {
  data: Data[];
  layout?: Partial<Layout>;
  /** What the chart shows, for screen readers (the canvas itself says nothing). */
  label: string;
  height?: number;
  onPointClick?: (point: { pointIndex?: number; x?: unknown; y?: unknown; customdata?: unknown; curveNumber: number }) => void;
  /** Plotly's relayout event: a drag-zoom gives `xaxis.range[0]` and the like, a double-click `xaxis.autorange`. */
  onRelayout?: (event: Record<string, unknown>) => void;
  /** The name of saved images (PNG from the camera, SVG from the disk beside it). */
  imageName?: string;
}

const BASE_CONFIG: Partial<Config> = {
  displaylogo: false,
  responsive: true,
  modeBarButtonsToRemove: ['lasso2d', 'select2d'],
  toImageButtonOptions: { format: 'png', scale: 2 },
};

/** A Plotly chart with the app's look, loaded lazily and resizing with its container. */
export function Plot({ data, layout, label, height = 420, onPointClick, onRelayout, imageName, ...boxProps }: PlotProps) {
  const fullLayout = useMemo<Partial<Layout>>(
    () => ({
      autosize: true,
      height,
      margin: { l: 64, r: 24, t: 24, b: 56 },
      paper_bgcolor: 'rgba(0,0,0,0)',
      plot_bgcolor: 'rgba(0,0,0,0)',
      font: { family: PLOT_FONT, size: 12, color: PLOT_COLORS.ink },
      hoverlabel: { font: { family: PLOT_FONT } },
      ...layout,
      xaxis: { gridcolor: PLOT_COLORS.grid, zeroline: false, ...layout?.xaxis },
      yaxis: { gridcolor: PLOT_COLORS.grid, zeroline: false, ...layout?.yaxis },
    }),
    [layout, height],
  );
  // Kept between renders: a changed config redraws the whole chart.
  const config = useMemo(
    () => (imageName ? { ...BASE_CONFIG, toImageButtonOptions: { ...BASE_CONFIG.toImageButtonOptions, filename: imageName } } : BASE_CONFIG),
    [imageName],
  );
  return (
    <Box role="img" aria-label={label} minH={`${height}px`} w="full" {...boxProps}>
      <Suspense fallback={<LoadingState label="Loading the chart…" />}>
        <PlotlyChart
          data={data}
          layout={fullLayout}
          config={config}
          onRelayout={onRelayout}
          useResizeHandler
          style={{ width: '100%', height: `${height}px` }}
          onClick={
            onPointClick
              ? (event: { points?: { pointIndex?: number; x?: unknown; y?: unknown; customdata?: unknown; curveNumber: number }[] }) => {
                  const point = event.points?.[0];
                  if (point) onPointClick(point);
                }
              : undefined
          }
        />
      </Suspense>
    </Box>
  );
}
