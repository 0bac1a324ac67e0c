/** One replayed path: spot with its jumps, variance, the hedge held and the cumulative P&L. */
import type { Data, Layout } from 'plotly.js';
import { useMemo } from 'react';
import type { PathTrace, ReplayRequest } from '../../../engine/replay';
import { chartFrame, chartTheme, panelTitle } from '../../../components/chart-theme';
import { PlotlyChart } from '../../../components/PlotlyChart';
import { useTheme } from '../../../components/theme';
import { hedgeColours, legendName } from './ReplayCharts';

export function PathDrillDown({
  traces,
  requests,
}: {
  traces: PathTrace[];
  requests: ReplayRequest[];
}) {
  const theme = useTheme();
  const figure = useMemo(() => {
    const t = chartTheme(theme);
    const colours = hedgeColours(t, requests);
    const axis = { gridcolor: t.grid, zerolinecolor: t.grid, tickfont: { color: t.muted } };
    const first = traces[0];
    const days = first.times.map((s) => s * 365);
    const line = (y: number[], axes: string, color: string, name: string, legend = false) =>
      ({
        type: 'scatter',
        mode: 'lines',
        x: days,
        y,
        xaxis: `x${axes}`,
        yaxis: `y${axes}`,
        line: { color, width: 1.6, shape: 'hv' },
        name,
        showlegend: legend,
      }) as Data;
    const jumpAt = first.jumps.map((j) => first.times.findIndex((x) => x === j.time));
    const data: Data[] = [
      line(first.spot, '', t.ink, 'spot'),
      {
        type: 'scatter',
        mode: 'markers',
        x: jumpAt.map((i) => days[i]),
        y: jumpAt.map((i) => first.spot[i]),
        marker: { color: t.stressed, size: 9, symbol: 'triangle-down' },
        text: first.jumps.map((j) => `jump ${(100 * j.size).toFixed(2)} %`),
        hoverinfo: 'text',
        name: 'jump',
        showlegend: false,
      } as Data,
      {
        type: 'scatter',
        mode: 'markers',
        x: (first.events ?? []).map((e) => e.time * 365),
        y: (first.events ?? []).map((e) => first.spot[first.times.findIndex((x) => x === e.time)]),
        marker: { color: t.teal, size: 10, symbol: 'diamond' },
        text: (first.events ?? []).map(
          (e) => `scheduled move ${(100 * Math.expm1(e.size)).toFixed(2)} %`,
        ),
        hoverinfo: 'text',
        name: 'scheduled move',
        showlegend: false,
      } as Data,
      line(first.variance, '2', t.teal, 'variance'),
      ...traces.map((tr, k) => line(tr.shares, '3', colours[k], legendName(requests[k]), true)),
      ...traces.map((tr, k) => line(tr.pnl, '4', colours[k], legendName(requests[k]))),
    ];
    const layout: Partial<Layout> = {
      ...chartFrame(t, 11),
      height: 520,
      margin: { l: 55, r: 10, t: 30, b: 40 },
      grid: { rows: 2, columns: 2, pattern: 'independent', ygap: 0.3, xgap: 0.12 },
      legend: { orientation: 'h', y: -0.12 },
      xaxis: { ...axis, title: { text: 'days' } },
      xaxis2: { ...axis, title: { text: 'days' } },
      xaxis3: { ...axis, title: { text: 'days' } },
      xaxis4: { ...axis, title: { text: 'days' } },
      yaxis: axis,
      yaxis2: axis,
      yaxis3: axis,
      yaxis4: axis,
      annotations: [
        panelTitle('', `Spot, path ${first.path} (${first.jumps.length} jumps)`),
        panelTitle('2', 'Variance'),
        panelTitle('3', 'Shares held after each rebalance'),
        panelTitle('4', 'Cumulative P&L'),
      ] as Layout['annotations'],
    };
    return { data, layout };
  }, [traces, requests, theme]);
  return (
    <div data-testid="path-drilldown">
      <PlotlyChart data={figure.data} layout={figure.layout} />
    </div>
  );
}
