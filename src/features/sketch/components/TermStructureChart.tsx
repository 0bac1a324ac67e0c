import type { Data, Layout } from 'plotly.js';
import { useMemo } from 'react';
import type { SmileSurface } from '../../../engine/analytic';
import { chartFrame, chartTheme, panelTitle } from '../../../components/chart-theme';
import { useTheme } from '../../../components/theme';
import { formatTenor } from '../../../components/format';
import { PlotlyChart } from '../../../components/PlotlyChart';

type Measure = 'atm' | 'rr25' | 'bf25';
const TITLES: Record<Measure, string> = {
  atm: 'ATM vol',
  rr25: '25Δ risk reversal',
  bf25: '25Δ butterfly',
};

/** ATM, RR25 and BF25 against expiry, base and stressed. */
export function TermStructureChart({
  base,
  stressed,
}: {
  base: SmileSurface;
  stressed: SmileSurface | null;
}) {
  const theme = useTheme();
  const figure = useMemo(() => {
    const t = chartTheme(theme);
    const measures: Measure[] = ['atm', 'rr25', 'bf25'];
    const data: Data[] = [];
    const layout: Record<string, unknown> = {
      grid: { rows: 1, columns: 3, pattern: 'independent', xgap: 0.1 },
      ...chartFrame(t, 12),
      margin: { l: 44, r: 12, t: 30, b: 36 },
      height: 250,
      showlegend: false,
      annotations: [] as unknown[],
    };
    const x = base.slices.map((s) => s.expiry * 365);
    const ticks = base.slices.map((s) => formatTenor(s.expiry));
    measures.forEach((m, i) => {
      const suffix = i === 0 ? '' : String(i + 1);
      const series = (surface: SmileSurface) =>
        surface.slices.map((s) => (s[m] === null ? null : 100 * (s[m] as number)));
      const common = {
        type: 'scatter',
        mode: 'lines+markers',
        x,
        xaxis: `x${suffix}`,
        yaxis: `y${suffix}`,
      };
      data.push({
        ...common,
        y: series(base),
        name: 'base',
        line: { color: t.base, width: 2 },
        marker: { size: 6 },
      } as Data);
      if (stressed)
        data.push({
          ...common,
          y: series(stressed),
          name: 'stressed',
          line: { color: t.stressed, width: 2, dash: 'dash' },
          marker: { size: 6 },
        } as Data);
      const axis = {
        gridcolor: t.grid,
        zerolinecolor: t.muted,
        linecolor: t.grid,
        tickfont: { color: t.muted },
      };
      layout[`xaxis${suffix}`] = { ...axis, type: 'log', tickvals: x, ticktext: ticks };
      layout[`yaxis${suffix}`] = { ...axis, ticksuffix: '%' };
      (layout.annotations as unknown[]).push(panelTitle(suffix, TITLES[m], 1.14));
    });
    return { data, layout: layout as Partial<Layout> };
  }, [base, stressed, theme]);
  return <PlotlyChart data={figure.data} layout={figure.layout} />;
}
