/**
 * Fits of one underlying over days: the jump intensity, mean jump, jump spread, initial variance
 * and correlation as lines with ±1 standard-error bands, one small panel each.
 */
import type { Data, Layout } from 'plotly.js';
import { useMemo } from 'react';
import { parameterLabel, type ParameterKey } from '../../../engine/core';
import type { FitHistoryEntry } from '../../../engine/fit';
import { chartFrame, chartTheme, panelTitle, withAlpha } from '../../../components/chart-theme';
import { PlotlyChart } from '../../../components/PlotlyChart';
import { useTheme } from '../../../components/theme';

const SHOWN: ParameterKey[] = ['jumpIntensity', 'jumpMean', 'jumpStdev', 'v0', 'rho'];

export function FitHistoryChart({ history }: { history: FitHistoryEntry[] }) {
  const theme = useTheme();
  const figure = useMemo(() => {
    const t = chartTheme(theme);
    const shown = SHOWN.filter((k) => history.some((h) => typeof h.parameters[k] === 'number'));
    const data: Data[] = [];
    const layout: Record<string, unknown> = {
      grid: { rows: 1, columns: shown.length, pattern: 'independent', xgap: 0.08 },
      ...chartFrame(t, 11),
      height: 240,
      margin: { l: 44, r: 10, t: 34, b: 50 },
      showlegend: false,
      annotations: [] as unknown[],
    };
    shown.forEach((k, i) => {
      const suffix = i === 0 ? '' : String(i + 1);
      const rows = history.filter((h) => typeof h.parameters[k] === 'number');
      const x = rows.map((h) => h.date);
      const y = rows.map((h) => h.parameters[k]);
      const se = rows.map((h) => h.standardErrors[k] ?? 0);
      const axes = { xaxis: `x${suffix}`, yaxis: `y${suffix}` };
      data.push(
        {
          type: 'scatter',
          mode: 'lines',
          x,
          y: y.map((v, j) => v + se[j]),
          line: { width: 0 },
          hoverinfo: 'skip',
          ...axes,
        } as Data,
        {
          type: 'scatter',
          mode: 'lines',
          x,
          y: y.map((v, j) => v - se[j]),
          fill: 'tonexty',
          fillcolor: withAlpha(t.base, 0.18),
          line: { width: 0 },
          hoverinfo: 'skip',
          ...axes,
        } as Data,
        {
          type: 'scatter',
          mode: 'lines+markers',
          x,
          y,
          name: parameterLabel(k),
          line: { color: t.base, width: 2 },
          marker: { size: 5 },
          ...axes,
        } as Data,
      );
      const axis = { gridcolor: t.grid, zerolinecolor: t.grid, tickfont: { color: t.muted } };
      layout[`xaxis${suffix}`] = { ...axis, type: 'category', tickangle: -45 };
      layout[`yaxis${suffix}`] = axis;
      (layout.annotations as unknown[]).push(panelTitle(suffix, parameterLabel(k), 1.16));
    });
    return { data, layout: layout as Partial<Layout> };
  }, [history, theme]);
  return (
    <div data-testid="fit-history-chart">
      <PlotlyChart data={figure.data} layout={figure.layout} />
    </div>
  );
}
