import type { Data, Layout } from 'plotly.js';

/** What a chart was given: its traces, its layout and the click and relayout (zoom) handlers Plotly would call. */
export interface RecordedPlot {
  data: Data[];
  layout: Partial<Layout>;
  onClick?: (event: { points: { x?: unknown; y?: unknown; customdata?: unknown; curveNumber: number }[] }) => void;
  onRelayout?: (event: Record<string, unknown>) => void;
}

type WithPlot = HTMLElement & { plot?: RecordedPlot };

/**
 * Stands in for the Plotly chart in unit tests (happy-dom draws no SVG or WebGL): it keeps the
 * props on its element, so a test can read the traces and fire the chart's click.
 * Use with `vi.mock('@/components/plots/plotly-chart', () => import('@/testing/plotly-chart-mock'))`.
 */
export default function PlotlyChartMock(props: RecordedPlot) {
  return (
    <div
      data-testid="plotly-chart"
      ref={(element) => {
        if (element) (element as WithPlot).plot = props;
      }}
    />
  );
}

/** The recorded props of the chart inside `container` (the element with the chart's accessible name). */
export function plotIn(container: HTMLElement): RecordedPlot {
  const element = container.querySelector<WithPlot>('[data-testid="plotly-chart"]');
  if (!element?.plot) throw new Error('no chart has rendered in this element yet');
  return element.plot;
}
