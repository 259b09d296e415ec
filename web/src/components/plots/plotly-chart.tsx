import type { Config } from 'plotly.js';
import Plotly from 'plotly.js-cartesian-dist-min';
import { useMemo } from 'react';
import type { PlotParams } from 'react-plotly.js';
import createPlotlyComponent from 'react-plotly.js/factory';

// Plotly's cartesian partial bundle (heatmap, contour, scatter and the other 2-D traces: all we draw; 1.5 MB
// against the full bundle's 4.6 MB) lives in its own chunk: only pages with a chart load it.
const Chart = createPlotlyComponent(Plotly);

/** Beside the modebar's camera (PNG): the same figure as SVG, for papers and slides. */
function saveSvgButton(config: Partial<Config> | undefined) {
  return {
    name: 'Download plot as SVG',
    title: 'Download plot as SVG',
    icon: Plotly.Icons.disk,
    click: (chart: Plotly.PlotlyHTMLElement) => Plotly.downloadImage(chart, { format: 'svg', filename: config?.toImageButtonOptions?.filename ?? 'plot', width: chart.clientWidth, height: chart.clientHeight }),
  };
}

export default function PlotlyChart(props: PlotParams) {
  const config = props.config as Partial<Config> | undefined;
  // A new config (its button's function included) makes Plotly draw the chart anew: keep it while the given one stays.
  const withSvg = useMemo(() => ({ ...config, modeBarButtonsToAdd: [saveSvgButton(config)] }), [config]);
  return <Chart {...props} config={withSvg} />;
}
