import { lazy, Suspense } from 'react';
import type { PlotParams } from 'react-plotly.js';
import { PLOT_CONFIG } from './chart-theme';

// Plotly is large: it lives in its own chunk, loaded the first time a chart is shown.
// Plotly measures legend and axis text when it draws: wait for the app's font, or the labels
// are laid out in the fallback's widths and overlap or get cut once Source Sans 3 arrives.
const Plot = lazy(async () => {
  const [{ default: createPlotlyComponent }, Plotly] = await Promise.all([
    import('react-plotly.js/factory'),
    import('plotly.js-dist-min'),
    typeof document !== 'undefined' ? document.fonts?.ready : undefined,
  ]);
  return { default: createPlotlyComponent(Plotly.default ?? Plotly) };
});

/** A chart in the app's way: full width, resizing with its box, the shared tool bar. */
export function PlotlyChart(props: PlotParams) {
  const withDefaults: PlotParams = {
    config: PLOT_CONFIG,
    style: { width: '100%' },
    useResizeHandler: true,
    ...props,
  };
  return (
    <Suspense
      fallback={
        <div className="flex h-80 items-center justify-center text-sm text-muted">
          Loading chart…
        </div>
      }
    >
      <Plot {...withDefaults} />
    </Suspense>
  );
}
