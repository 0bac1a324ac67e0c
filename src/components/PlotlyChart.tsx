import { lazy, Suspense } from 'react';
import type { PlotParams } from 'react-plotly.js';

// Plotly is large: it lives in its own chunk, loaded the first time a chart is shown.
const Plot = lazy(async () => {
  const [{ default: createPlotlyComponent }, Plotly] = await Promise.all([
    import('react-plotly.js/factory'),
    import('plotly.js-dist-min'),
  ]);
  return { default: createPlotlyComponent(Plotly.default ?? Plotly) };
});

export function PlotlyChart(props: PlotParams) {
  return (
    <Suspense
      fallback={
        <div className="flex h-80 items-center justify-center text-sm text-muted">
          Loading chart…
        </div>
      }
    >
      <Plot {...props} />
    </Suspense>
  );
}
