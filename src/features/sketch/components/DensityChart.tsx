import type { Data, Layout } from 'plotly.js';
import { useMemo, memo } from 'react';
import type { DensityCurve } from '../../../workers/engine-api';
import { chartFrame, chartTheme, legendRow, LOG_AXIS } from '../../../components/chart-theme';
import { useTheme } from '../../../components/theme';
import { PlotlyChart } from '../../../components/PlotlyChart';

/** A point mass of an up-or-down scheduled move: its log-move and what to call it. */
export interface PointMass {
  x: number;
  label: string;
}

/**
 * Density of the log-return ln(S_T/F) at one expiry, base against stressed, on a log scale.
 * An up-or-down scheduled move is two point masses: they are drawn as spikes at their log-moves,
 * since the curve alone is smooth only because the diffusion spreads them.
 */
const NO_POINT_MASSES: PointMass[] = [];

// memo: a slider step re-renders the page, not this (its inputs follow when the drag pauses)
export const DensityChart = memo(function DensityChart({
  density,
  title,
  pointMasses = NO_POINT_MASSES,
}: {
  density: DensityCurve;
  title: string;
  pointMasses?: PointMass[];
}) {
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
    if (pointMasses.length > 0) {
      const ys = density.base.filter((y) => y > 1e-8);
      const lo = Math.min(...ys);
      const hi = Math.max(...ys);
      data.push({
        type: 'scatter',
        mode: 'lines',
        x: pointMasses.flatMap((p) => [p.x, p.x, null]),
        y: pointMasses.flatMap(() => [lo, hi, null]),
        text: pointMasses.flatMap((p) => [p.label, p.label, '']),
        hovertemplate: '%{text}<extra></extra>',
        name: 'up-or-down move outcomes',
        line: { color: t.muted, width: 1.5, dash: 'dot' },
      } as Data);
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
  }, [density, title, pointMasses, theme]);
  return <PlotlyChart data={figure.data} layout={figure.layout} />;
});
