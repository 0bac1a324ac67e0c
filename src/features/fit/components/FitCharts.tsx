import type { Data, Layout } from 'plotly.js';
import { useMemo } from 'react';
import type { Residual } from '../../../engine/fit';
import {
  chartFrame,
  chartTheme,
  legendRow,
  LOG_AXIS,
  panelTitle,
} from '../../../components/chart-theme';
import { formatTenor } from '../../../components/format';
import { PlotlyChart } from '../../../components/PlotlyChart';
import { useTheme } from '../../../components/theme';

/** A quote's bid and ask vols, for the bars drawn behind its mid. */
export interface SpreadBar {
  expiry: number;
  strike: number;
  bidVol: number | null;
  askVol: number | null;
}

/**
 * Quotes (dots, with bid–ask bars when the chain gives them) against the fitted smile (line),
 * one panel per expiry, and a residual map.
 */
export function FitCharts({
  residuals,
  compare,
  spreads,
}: {
  residuals: Residual[];
  compare?: Residual[];
  spreads?: SpreadBar[];
}) {
  const theme = useTheme();
  const figure = useMemo(() => {
    const t = chartTheme(theme);
    const expiries = [...new Set(residuals.map((r) => r.expiry))].sort((a, b) => a - b);
    const columns = Math.min(4, expiries.length);
    const rows = Math.ceil(expiries.length / columns);
    const data: Data[] = [];
    const layout: Record<string, unknown> = {
      grid: { rows, columns, pattern: 'independent', xgap: 0.08, ygap: 0.3 },
      ...chartFrame(t, 11),
      height: 210 * rows + 50,
      margin: { l: 40, r: 10, t: 30, b: 30 },
      legend: legendRow('above', 0.06),
      annotations: [] as unknown[],
    };
    expiries.forEach((T, i) => {
      const suffix = i === 0 ? '' : String(i + 1);
      const pick = (list: Residual[]) =>
        list.filter((r) => r.expiry === T).sort((a, b) => a.strike - b.strike);
      const here = pick(residuals);
      const axes = { xaxis: `x${suffix}`, yaxis: `y${suffix}`, showlegend: i === 0 };
      const bars = (spreads ?? []).filter(
        (b) => b.expiry === T && b.bidVol !== null && b.askVol !== null,
      );
      if (bars.length > 0)
        data.push({
          type: 'scatter',
          mode: 'lines',
          x: bars.flatMap((b) => [b.strike, b.strike, null]),
          y: bars.flatMap((b) => [100 * b.bidVol!, 100 * b.askVol!, null]),
          name: 'bid–ask',
          line: { color: t.muted, width: 3 },
          opacity: 0.45,
          ...axes,
        } as Data);
      data.push({
        type: 'scatter',
        mode: 'markers',
        x: here.map((r) => r.strike),
        y: here.map((r) => 100 * r.market),
        name: 'quotes',
        marker: { color: t.ink, size: 5 },
        ...axes,
      } as Data);
      data.push({
        type: 'scatter',
        mode: 'lines',
        x: here.map((r) => r.strike),
        y: here.map((r) => (r.model === null ? null : 100 * r.model)),
        name: 'fitted',
        line: { color: t.base, width: 2 },
        ...axes,
      } as Data);
      if (compare) {
        const c = pick(compare);
        data.push({
          type: 'scatter',
          mode: 'lines',
          x: c.map((r) => r.strike),
          y: c.map((r) => (r.model === null ? null : 100 * r.model)),
          name: 'Heston',
          line: { color: t.muted, width: 1.5, dash: 'dot' },
          ...axes,
        } as Data);
      }
      const axis = { gridcolor: t.grid, zerolinecolor: t.grid, tickfont: { color: t.muted } };
      layout[`xaxis${suffix}`] = axis;
      layout[`yaxis${suffix}`] = {
        ...axis,
        ticksuffix: '%',
        title: { text: i === 0 ? 'implied vol' : '' },
      };
      (layout.annotations as unknown[]).push(panelTitle(suffix, formatTenor(T), 1.18));
    });
    return { data, layout: layout as Partial<Layout> };
  }, [residuals, compare, spreads, theme]);
  return <PlotlyChart data={figure.data} layout={figure.layout} />;
}

export function ResidualMap({ residuals }: { residuals: Residual[] }) {
  const theme = useTheme();
  const figure = useMemo(() => {
    const t = chartTheme(theme);
    const z = residuals.map((r) => (r.model === null ? null : 100 * (r.model - r.market)));
    const extent = Math.max(0.05, ...z.map((v) => Math.abs(v ?? 0)));
    const data: Data[] = [
      {
        type: 'scatter',
        mode: 'markers',
        x: residuals.map((r) => r.strike),
        y: residuals.map((r) => r.expiry * 365),
        text: residuals.map(
          (r, i) =>
            `K ${r.strike.toFixed(2)}, ${formatTenor(r.expiry)}: ${z[i] === null ? '—' : (z[i] as number).toFixed(3)} vol pts`,
        ),
        hoverinfo: 'text',
        marker: {
          size: 12,
          symbol: 'square',
          color: z as number[],
          cmin: -extent,
          cmax: extent,
          colorscale: [
            [0, t.base],
            [0.5, t.paper],
            [1, t.stressed],
          ],
          colorbar: { title: { text: 'model − quote (vol pts)' } },
        },
      } as Data,
    ];
    const axis = { gridcolor: t.grid, tickfont: { color: t.muted } };
    const layout: Partial<Layout> = {
      ...chartFrame(t, 11),
      height: 300,
      margin: { l: 50, r: 10, t: 10, b: 40 },
      xaxis: { ...axis, title: { text: 'strike' } },
      yaxis: { ...axis, ...LOG_AXIS, title: { text: 'days to expiry' } },
    };
    return { data, layout };
  }, [residuals, theme]);
  return <PlotlyChart data={figure.data} layout={figure.layout} />;
}
