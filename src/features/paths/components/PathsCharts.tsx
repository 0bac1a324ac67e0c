import type { Data, Layout } from 'plotly.js';
import { useMemo } from 'react';
import { FAN_PERCENTILES, type HistogramSpec, type PathsView } from '../../../engine/paths';
import {
  chartFrame,
  chartTheme,
  legendRow,
  LOG_AXIS,
  withAlpha,
} from '../../../components/chart-theme';
import { PlotlyChart } from '../../../components/PlotlyChart';
import { useTheme } from '../../../components/theme';

const base = (t: ReturnType<typeof chartTheme>): Partial<Layout> => ({
  ...chartFrame(t, 11),
  margin: { l: 55, r: 10, t: 30, b: 40 },
  height: 300,
  showlegend: false,
});

function fanTraces(times: number[], rows: number[][], color: string): Data[] {
  // bands between symmetric percentiles, darker towards the median
  const x = times.map((t) => t * 365);
  const out: Data[] = [];
  for (const [lo, hi, alpha] of [
    [0, 6, 0.12],
    [1, 5, 0.2],
    [2, 4, 0.32],
  ] as const) {
    out.push({
      type: 'scatter',
      mode: 'lines',
      x,
      y: rows[lo],
      line: { width: 0 },
      hoverinfo: 'skip',
      showlegend: false,
    } as Data);
    out.push({
      type: 'scatter',
      mode: 'lines',
      x,
      y: rows[hi],
      fill: 'tonexty',
      fillcolor: withAlpha(color, alpha),
      line: { width: 0 },
      name: `${100 * FAN_PERCENTILES[lo]}–${100 * FAN_PERCENTILES[hi]} %`,
    } as Data);
  }
  out.push({
    type: 'scatter',
    mode: 'lines',
    x,
    y: rows[3],
    line: { color, width: 2 },
    name: 'median',
  } as Data);
  return out;
}

export function PathsCharts({
  view,
  histogram,
  spec,
  density,
  meanTerminal,
}: {
  view: PathsView;
  histogram: number[] | null;
  spec: HistogramSpec | null;
  density: number[] | null;
  meanTerminal: number;
}) {
  const theme = useTheme();
  const figures = useMemo(() => {
    const t = chartTheme(theme);
    const axis = { gridcolor: t.grid, zerolinecolor: t.grid, tickfont: { color: t.muted } };
    const x = view.times.map((s) => s * 365);
    const spot: { data: Data[]; layout: Partial<Layout> } = {
      data: [
        ...fanTraces(view.times, view.spotFan, t.base),
        ...view.samples.slice(0, 12).map(
          (p, i) =>
            ({
              type: 'scatter',
              mode: 'lines',
              x,
              y: p,
              line: { color: t.stressed, width: 0.7 },
              opacity: 0.6,
              hoverinfo: 'skip',
              name: 'sample paths',
              legendgroup: 'samples',
              showlegend: i === 0,
            }) as Data,
        ),
      ],
      layout: {
        ...base(t),
        title: { text: 'Spot: percentile fan and sample paths', font: { size: 13 }, x: 0 },
        showlegend: true,
        legend: legendRow('below', 0.3),
        height: 340,
        xaxis: { ...axis, title: { text: 'days' } },
        yaxis: { ...axis, title: { text: 'spot' } },
      },
    };
    const variance = {
      data: fanTraces(view.times, view.varianceFan, t.teal),
      layout: {
        ...base(t),
        title: { text: 'Variance: percentile fan', font: { size: 13 }, x: 0 },
        showlegend: true,
        legend: legendRow('below', 0.3),
        height: 340,
        xaxis: { ...axis, title: { text: 'days' } },
        yaxis: { ...axis, title: { text: 'variance (per year)' } },
      },
    };
    const jumps = {
      data: [
        {
          type: 'bar',
          x: view.jumpCountHistogram.map((_, i) => (i === 10 ? '10+' : String(i))),
          y: view.jumpCountHistogram,
          marker: { color: t.stressed },
        } as Data,
      ],
      layout: {
        ...base(t),
        title: { text: 'Jumps per path (recorded block)', font: { size: 13 }, x: 0 },
        xaxis: { ...axis, type: 'category' as const, title: { text: 'jumps in the path' } },
        yaxis: { ...axis, ...LOG_AXIS, title: { text: 'paths' } },
      },
    };
    let terminal: { data: Data[]; layout: Partial<Layout> } | null = null;
    if (histogram && spec) {
      const width = (spec.hi - spec.lo) / spec.bins;
      const total = histogram.reduce((a, b) => a + b, 0);
      const centres = histogram.map((_, i) => spec.lo + (i + 0.5) * width);
      const data: Data[] = [
        {
          type: 'bar',
          x: centres,
          y: histogram.map((c) => c / (total * width)),
          name: 'Monte Carlo',
          marker: { color: t.base, opacity: 0.6 },
        } as Data,
      ];
      if (density)
        data.push({
          type: 'scatter',
          mode: 'lines',
          x: centres,
          y: density,
          name: 'analytic (COS)',
          line: { color: t.ink, width: 2 },
        } as Data);
      terminal = {
        data,
        layout: {
          ...base(t),
          showlegend: true,
          legend: legendRow('below', 0.3),
          title: {
            text: `ln(S_T/S_0) at the horizon (mean S_T ${meanTerminal.toFixed(2)})`,
            font: { size: 13 },
            x: 0,
          },
          xaxis: { ...axis, title: { text: 'log-return ln(S_T/S_0)' } },
          yaxis: { ...axis, ...LOG_AXIS, title: { text: 'paths per bin' } },
          bargap: 0,
        },
      };
    }
    const sizes = {
      data: [
        {
          type: 'bar',
          x: view.jumpSizes.centres.map((c) => 100 * c),
          y: view.jumpSizes.counts,
          marker: { color: t.stressed },
        } as Data,
      ],
      layout: {
        ...base(t),
        title: { text: 'Jump sizes, log-return in % (recorded block)', font: { size: 13 }, x: 0 },
        xaxis: { ...axis, ticksuffix: '%', title: { text: 'log-return of the jump' } },
        yaxis: { ...axis, title: { text: 'jumps' } },
        bargap: 0.05,
      },
    };
    return { spot, variance, jumps, terminal, sizes };
  }, [view, histogram, spec, density, meanTerminal, theme]);
  return (
    <div className="grid gap-4 xl:grid-cols-2" data-testid="paths-charts">
      <PlotlyChart data={figures.spot.data} layout={figures.spot.layout} />
      <PlotlyChart data={figures.variance.data} layout={figures.variance.layout} />
      {figures.terminal && (
        <PlotlyChart data={figures.terminal.data} layout={figures.terminal.layout} />
      )}
      <PlotlyChart data={figures.jumps.data} layout={figures.jumps.layout} />
      {view.jumpSizes.counts.length > 0 && (
        <PlotlyChart data={figures.sizes.data} layout={figures.sizes.layout} />
      )}
    </div>
  );
}
