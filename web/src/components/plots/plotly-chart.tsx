import Plotly from 'plotly.js';
import createPlotlyComponent from 'react-plotly.js/factory';

// The 4.6 MB plotly bundle lives in its own chunk: only pages with a chart load it.
const PlotlyChart = createPlotlyComponent(Plotly);
export default PlotlyChart;
