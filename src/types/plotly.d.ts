declare module 'react-plotly.js/factory' {
  import type { ComponentType } from 'react';
  import type { PlotParams } from 'react-plotly.js';
  export default function createPlotlyComponent(plotly: unknown): ComponentType<PlotParams>;
}

declare module 'plotly.js-dist-min' {
  const Plotly: unknown;
  export default Plotly;
}
