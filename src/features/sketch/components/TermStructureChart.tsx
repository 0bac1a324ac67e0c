import type { Data, Layout } from 'plotly.js';
import { useMemo, memo } from 'react';
import type { SmileSurface } from '../../../engine/analytic';
import type { AtmTerm } from '../../../workers/engine-api';
import { chartFrame, chartTheme, panelTitle } from '../../../components/chart-theme';
import { useTheme } from '../../../components/theme';
import { formatTenor } from '../../../components/format';
import { PlotlyChart } from '../../../components/PlotlyChart';

type Measure = 'atm' | 'rr25' | 'bf25';
const TITLES: Record<Measure, string> = {
  atm: 'ATM vol',
  rr25: 'Risk reversal: 25Δ solid, 10Δ dotted (vol pts)',
  bf25: 'Butterfly: 25Δ solid, 10Δ dotted (vol pts)',
};

export interface EventMarker {
  time: number;
  label: string;
}

/**
 * ATM, RR25 and BF25 against expiry, base and stressed. The ATM panel draws the denser term
 * curve it is given, with a dotted line at each scheduled move's date.
 */
// memo: a slider step re-renders the page, not this (its inputs follow when the drag pauses)
export const TermStructureChart = memo(function TermStructureChart({
  base,
  stressed,
  term,
  events,
}: {
  base: SmileSurface;
  stressed: SmileSurface | null;
  term: AtmTerm;
  events: EventMarker[];
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
      const dense = m === 'atm' && term.expiries.length !== base.slices.length;
      const pct = (v: (number | null)[]) => v.map((a) => (a === null ? null : 100 * a));
      const common = {
        type: 'scatter',
        mode: dense ? 'lines' : 'lines+markers',
        x: dense ? term.expiries.map((e) => e * 365) : x,
        xaxis: `x${suffix}`,
        yaxis: `y${suffix}`,
      };
      const baseY = dense ? pct(term.base) : series(base);
      data.push({
        ...common,
        y: baseY,
        name: 'base',
        line: { color: t.base, width: 2 },
        marker: { size: 6 },
      } as Data);
      const stressedY = stressed
        ? dense && term.stressed
          ? pct(term.stressed)
          : series(stressed)
        : null;
      if (stressedY)
        data.push({
          ...common,
          y: stressedY,
          name: 'stressed',
          line: { color: t.stressed, width: 2, dash: 'dash' },
          marker: { size: 6 },
        } as Data);
      // the 10-delta wings beside the 25-delta ones, thinner and dotted
      if (m !== 'atm') {
        const tenDelta = m === 'rr25' ? 'rr10' : 'bf10';
        const wing = (surface: SmileSurface) =>
          surface.slices.map((s) => (s[tenDelta] === null ? null : 100 * (s[tenDelta] as number)));
        data.push({
          ...common,
          mode: 'lines+markers',
          y: wing(base),
          name: 'base, 10Δ',
          line: { color: t.base, width: 1.5, dash: 'dot' },
          marker: { size: 4 },
        } as Data);
        if (stressed)
          data.push({
            ...common,
            mode: 'lines+markers',
            y: wing(stressed),
            name: 'stressed, 10Δ',
            line: { color: t.stressed, width: 1.5, dash: 'dot' },
            marker: { size: 4 },
          } as Data);
      }
      if (m === 'atm' && events.length > 0) {
        const ys = [...baseY, ...(stressedY ?? [])].filter((v): v is number => v !== null);
        const lo = Math.min(...ys);
        const hi = Math.max(...ys);
        for (const e of events)
          data.push({
            type: 'scatter',
            mode: 'lines',
            x: [e.time * 365, e.time * 365],
            y: [lo, hi],
            xaxis: 'x',
            yaxis: 'y',
            name: e.label,
            hovertemplate: `${e.label}<extra></extra>`,
            line: { color: t.muted, width: 1, dash: 'dot' },
          } as Data);
      }
      const axis = {
        gridcolor: t.grid,
        zerolinecolor: t.muted,
        linecolor: t.grid,
        tickfont: { color: t.muted },
      };
      layout[`xaxis${suffix}`] = { ...axis, type: 'log', tickvals: x, ticktext: ticks };
      // ATM vol in percent; risk reversal and butterfly are differences of vols: vol points
      layout[`yaxis${suffix}`] =
        m === 'atm' ? { ...axis, ticksuffix: '%' } : { ...axis, ticksuffix: ' pts' };
      (layout.annotations as unknown[]).push(panelTitle(suffix, TITLES[m], 1.14));
    });
    return { data, layout: layout as Partial<Layout> };
  }, [base, stressed, term, events, theme]);
  return <PlotlyChart data={figure.data} layout={figure.layout} />;
});
