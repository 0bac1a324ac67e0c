import type { Data, Layout } from 'plotly.js';
import { useMemo } from 'react';
import type { DensityCurve } from '../../../workers/engine-api';
import { chartFrame, chartTheme, legendRow, LOG_AXIS } from '../../../components/chart-theme';
import { useTheme } from '../../../components/theme';
import { PlotlyChart } from '../../../components/PlotlyChart';

/** Density of the log-return ln(S_T/F) at one expiry, base against stressed, on a log scale. */
export function DensityChart({ density, title }: { density: DensityCurve; title: string }) {
  const theme = useTheme();
  const figure = useMemo(() => {
    const t = chartTheme(theme);
    const clip = (ys: number[]) => ys.map((y) => (y > 1e-8 ? y : null));
    const data: Data[] = [
      {
        type: 'scatter',
        mode: 'lines',
        x: density.points,
        y: clip(density.base),
        name: 'base',
        line: { color: t.base, width: 2 },
      },
    ];
    if (density.stressed) {
      data.push({
        type: 'scatter',
        mode: 'lines',
        x: density.points,
        y: clip(density.stressed),
        name: 'stressed',
        line: { color: t.stressed, width: 2, dash: 'dash' },
      });
    }
    const axis = {
      gridcolor: t.grid,
      zerolinecolor: t.grid,
      linecolor: t.grid,
      tickfont: { color: t.muted },
    };
    const layout: Partial<Layout> = {
      ...chartFrame(t, 12),
      margin: { l: 50, r: 12, t: 30, b: 40 },
      height: 260,
      title: { text: title, font: { size: 13 }, x: 0, xanchor: 'left' },
      xaxis: { ...axis, title: { text: 'log-return ln(S/F)' } },
      yaxis: { ...axis, ...LOG_AXIS, title: { text: 'density' } },
      legend: legendRow('below', 0.3),
    };
    return { data, layout };
  }, [density, title, theme]);
  return <PlotlyChart data={figure.data} layout={figure.layout} />;
}
