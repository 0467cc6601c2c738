import Plotly from 'plotly.js-dist-min';
import createPlotlyComponent from 'react-plotly.js/factory';

/** The Plotly-bound chart component; imported only through React.lazy so Plotly is a chunk of its own. */
const Plot = createPlotlyComponent(Plotly);
export default Plot;

/** Saves the chart in the graph element as a PNG or SVG file. */
export const downloadChart = (graph: HTMLElement, format: 'png' | 'svg', filename: string) =>
  Plotly.downloadImage(graph, { format, filename, width: 1200, height: 800 });
