import type { Data, Layout } from 'plotly.js';
import { useMemo } from 'react';
import { normCdf, type SmileSlice, type SmileSurface } from '../../../engine/analytic';
import type { TargetVol } from '../../../engine/fit';
import { chartFrame, chartTheme } from '../../../components/chart-theme';
import { useTheme } from '../../../components/theme';
import { formatTenor } from '../../../components/format';
import { PlotlyChart } from '../../../components/PlotlyChart';

export type AxisMode = 'strike' | 'moneyness' | 'delta';

export const AXIS_LABEL: Record<AxisMode, string> = {
  strike: 'Strike',
  moneyness: 'Log-moneyness ln(K/F)',
  delta: 'Call delta (forward)',
};

function xValues(slice: SmileSlice, mode: AxisMode): (number | null)[] {
  if (mode === 'strike') return slice.strikes;
  if (mode === 'moneyness') return slice.logMoneyness;
  return slice.callDeltas;
}

function trace(
  slice: SmileSlice,
  mode: AxisMode,
  axis: number,
  color: string,
  name: string,
  dash: 'solid' | 'dash',
): Data {
  const x = xValues(slice, mode);
  const y = slice.impliedVols.map((v) => (v === null ? null : 100 * v));
  return {
    type: 'scatter',
    mode: 'lines',
    x,
    y,
    name,
    legendgroup: name,
    showlegend: axis === 1,
    line: { color, width: 2, dash },
    xaxis: axis === 1 ? 'x' : `x${axis}`,
    yaxis: axis === 1 ? 'y' : `y${axis}`,
    hovertemplate: `${formatTenor(slice.expiry)} ${name}: %{y:.2f}%<extra></extra>`,
  } as Data;
}

const NO_TARGETS: TargetVol[] = [];

/** Base and stressed smiles side by side, one small panel per expiry. */
export function SmileChart({
  base,
  stressed,
  mode,
  targets = NO_TARGETS,
  onPick,
  onPainted,
}: {
  base: SmileSurface;
  stressed: SmileSurface | null;
  mode: AxisMode;
  targets?: TargetVol[];
  /** a click on a smile: its panel's expiry, the point's ln(K/F) and vol */
  onPick?: (p: { expiry: number; logMoneyness: number; impliedVol: number }) => void;
  /** Plotly has drawn a new figure (the first or an update) */
  onPainted?: () => void;
}) {
  const theme = useTheme();
  const figure = useMemo(() => {
    const t = chartTheme(theme);
    const n = base.slices.length;
    const columns = Math.min(n, n > 4 ? 3 : n);
    const rows = Math.ceil(n / columns);
    const data: Data[] = [];
    const layout: Partial<Layout> = {
      grid: { rows, columns, pattern: 'independent', xgap: 0.08, ygap: 0.22 },
      ...chartFrame(t, 12),
      margin: { l: 44, r: 12, t: 28, b: 36 },
      height: 250 * rows + 40,
      legend: { orientation: 'h', y: 1.06 + 0.02 * rows, x: 0 },
      annotations: [],
    };
    base.slices.forEach((slice, i) => {
      const axis = i + 1;
      data.push(trace(slice, mode, axis, t.base, 'base', 'solid'));
      const s = stressed?.slices[i];
      if (s) data.push(trace(s, mode, axis, t.stressed, 'stressed', 'dash'));
      const here = targets.filter((x) => Math.abs(x.expiry - slice.expiry) < 1e-9);
      if (here.length > 0) {
        const xs = here.map((x) => {
          if (mode === 'moneyness') return x.logMoneyness;
          if (mode === 'strike') return slice.forward * Math.exp(x.logMoneyness);
          const sd = x.impliedVol * Math.sqrt(slice.expiry);
          return normCdf(-x.logMoneyness / sd + 0.5 * sd);
        });
        data.push({
          type: 'scatter',
          mode: 'markers',
          x: xs,
          y: here.map((x) => 100 * x.impliedVol),
          name: 'target',
          showlegend: false,
          marker: { color: t.teal, size: 9, symbol: 'diamond' },
          xaxis: axis === 1 ? 'x' : `x${axis}`,
          yaxis: axis === 1 ? 'y' : `y${axis}`,
        } as Data);
      }
      const suffix = axis === 1 ? '' : String(axis);
      const axisStyle = {
        gridcolor: t.grid,
        zerolinecolor: t.grid,
        linecolor: t.grid,
        tickfont: { color: t.muted },
      };
      (layout as Record<string, unknown>)[`xaxis${suffix}`] = {
        ...axisStyle,
        autorange: mode === 'delta' ? 'reversed' : true,
      };
      (layout as Record<string, unknown>)[`yaxis${suffix}`] = { ...axisStyle, ticksuffix: '%' };
      layout.annotations!.push({
        text: `<b>${formatTenor(slice.expiry)}</b>`,
        xref: `x${suffix} domain` as never,
        yref: `y${suffix} domain` as never,
        x: 0,
        y: 1.12,
        showarrow: false,
        xanchor: 'left',
        font: { size: 13, color: t.ink },
      });
    });
    return { data, layout };
  }, [base, stressed, mode, targets, theme]);
  return (
    <PlotlyChart
      data={figure.data}
      layout={figure.layout}
      onInitialized={onPainted}
      onUpdate={onPainted}
      onClick={(e) => {
        const point = e.points[0];
        if (!onPick || !point) return;
        const name = (point.data as { name?: string }).name;
        const surface = name === 'stressed' ? stressed : name === 'base' ? base : null;
        const xaxis = (point.data as { xaxis?: string }).xaxis ?? 'x';
        const slice = surface?.slices[xaxis === 'x' ? 0 : Number(xaxis.slice(1)) - 1];
        const vol = slice?.impliedVols[point.pointIndex];
        if (!slice || vol === null || vol === undefined) return;
        onPick({
          expiry: slice.expiry,
          logMoneyness: slice.logMoneyness[point.pointIndex],
          impliedVol: vol,
        });
      }}
    />
  );
}
