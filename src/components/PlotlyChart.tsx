import { Component, lazy, Suspense, useState, type ReactNode } from 'react';
import type { PlotParams } from 'react-plotly.js';
import { PLOT_CONFIG } from './chart-theme';

// Plotly is large: it lives in its own chunk, loaded the first time a chart is shown.
// Plotly measures legend and axis text when it draws: wait for the app's font, or the labels
// are laid out in the fallback's widths and overlap or get cut once Source Sans 3 arrives.
const loadPlot = () =>
  lazy(async () => {
    const [{ default: createPlotlyComponent }, Plotly] = await Promise.all([
      import('react-plotly.js/factory'),
      import('plotly.js-dist-min'),
      typeof document !== 'undefined' ? document.fonts?.ready : undefined,
    ]);
    return { default: createPlotlyComponent(Plotly.default ?? Plotly) };
  });

let Plot = loadPlot();

/**
 * Catches a chart that could not load (its chunk fetched while the connection is down, before
 * the service worker holds it), so the page stays up and says so; "Try again" loads it afresh.
 */
class ChartBoundary extends Component<
  { children: ReactNode; onRetry: () => void },
  { failed: boolean }
> {
  override state = { failed: false };
  static getDerivedStateFromError() {
    return { failed: true };
  }
  override render() {
    if (!this.state.failed) return this.props.children;
    return (
      <div className="flex h-40 flex-col items-center justify-center gap-2 text-sm text-muted">
        <span>The chart could not be loaded (is the connection down?).</span>
        <button
          type="button"
          className="rounded border border-rule px-3 py-1 text-ink hover:border-ink"
          onClick={() => {
            this.setState({ failed: false });
            this.props.onRetry();
          }}
        >
          Try again
        </button>
      </div>
    );
  }
}

/** A chart in the app's way: full width, resizing with its box, the shared tool bar. */
export function PlotlyChart(props: PlotParams) {
  const [attempt, setAttempt] = useState(0);
  const withDefaults: PlotParams = {
    config: PLOT_CONFIG,
    style: { width: '100%' },
    useResizeHandler: true,
    ...props,
  };
  return (
    <ChartBoundary
      key={attempt}
      onRetry={() => {
        // a failed lazy load stays failed: load it anew
        Plot = loadPlot();
        setAttempt((a) => a + 1);
      }}
    >
      <Suspense
        fallback={
          <div className="flex h-80 items-center justify-center text-sm text-muted">
            Loading chart…
          </div>
        }
      >
        <Plot {...withDefaults} />
      </Suspense>
    </ChartBoundary>
  );
}
