import Plotly, { type Config } from 'plotly.js';
import type { PlotParams } from 'react-plotly.js';
import createPlotlyComponent from 'react-plotly.js/factory';

// The 4.6 MB plotly bundle lives in its own chunk: only pages with a chart load it.
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
  return <Chart {...props} config={{ ...config, modeBarButtonsToAdd: [saveSvgButton(config)] }} />;
}
