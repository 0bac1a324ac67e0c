import type { Data, Layout } from 'plotly.js';
import { useMemo } from 'react';
import type { SetRevaluation } from '../../../engine/book';
import {
  chartFrame,
  chartTheme,
  legendRow,
  logAxisFor,
  withAlpha,
} from '../../../components/chart-theme';
import { PlotlyChart } from '../../../components/PlotlyChart';
import { useTheme } from '../../../components/theme';

const HEIGHT = 480;
const MARGIN = { l: 70, r: 12, t: 16, b: 44 };
/** the probability panel's share of the plot's height, in pixels: its log labels are spaced by it */
const PROBABILITY_PIXELS = 0.26 * (HEIGHT - MARGIN.t - MARGIN.b);

/**
 * The gap ladder over the jump law: the base model, sticky strike, sticky strike with the
 * user's spot-vol reaction, sticky moneyness when it differs from the model, and one scenario;
 * each line says its rule.
 */
export function LadderChart({
  result,
  scenarioIndex,
}: {
  result: SetRevaluation;
  scenarioIndex: number;
}) {
  const theme = useTheme();
  const figure = useMemo(() => {
    const t = chartTheme(theme);
    const x = result.moves.map((m) => 100 * m);
    const s = result.scenarios[scenarioIndex];
    // the model line is sticky moneyness unless the model's variance reacts to a jump (SVCJ)
    const reacts = result.baseLadder.some((v, i) => v !== result.stickyMoneynessLadder[i]);
    const data: Data[] = [
      {
        type: 'scatter',
        mode: 'lines+markers',
        x,
        y: result.baseLadder,
        name: reacts
          ? 'base model: variance jumps with the move'
          : 'base model (sticky moneyness: the smile moves with spot)',
        line: { color: t.base, width: 2 },
        marker: { size: 4 },
        xaxis: 'x',
        yaxis: 'y',
      },
    ];
    if (reacts)
      data.push({
        type: 'scatter',
        mode: 'lines',
        x,
        y: result.stickyMoneynessLadder,
        name: 'sticky moneyness (variance held)',
        line: { color: t.base, width: 1.5, dash: 'dash' },
        xaxis: 'x',
        yaxis: 'y',
      });
    data.push(
      {
        type: 'scatter',
        mode: 'lines',
        x,
        y: result.stickyStrikeLadder,
        name: 'sticky strike (each option keeps its vol)',
        line: { color: t.muted, width: 1.5, dash: 'dot' },
        xaxis: 'x',
        yaxis: 'y',
      },
      {
        type: 'scatter',
        mode: 'lines',
        x,
        y: result.volReactionLadder,
        name: `sticky strike, ATM vol +${result.volReaction} pts per 1 % fall`,
        line: { color: t.teal, width: 1.5, dash: 'dashdot' },
        xaxis: 'x',
        yaxis: 'y',
      },
    );
    if (s?.ladder)
      data.push({
        type: 'scatter',
        mode: 'lines',
        x,
        y: s.ladder,
        name: s.name,
        line: { color: t.stressed, width: 2, dash: 'dash' },
        xaxis: 'x',
        yaxis: 'y',
      });
    data.push(
      {
        type: 'bar',
        x,
        y: result.jumpPerDay.map((p) => (p > 0 ? p : null)),
        name: 'jump within a day',
        marker: { color: t.teal },
        xaxis: 'x',
        yaxis: 'y2',
      },
      {
        type: 'bar',
        x,
        y: result.jumpPerWeek.map((p) => (p > 0 ? p : null)),
        name: 'jump within a week',
        marker: { color: withAlpha(t.teal, 0.45) },
        xaxis: 'x',
        yaxis: 'y2',
      },
    );
    const shown = [...result.jumpPerDay, ...result.jumpPerWeek].filter((p) => p > 0);
    const axis = {
      gridcolor: t.grid,
      zerolinecolor: t.muted,
      linecolor: t.grid,
      tickfont: { color: t.muted },
    };
    const layout: Partial<Layout> = {
      ...chartFrame(t, 12),
      height: HEIGHT,
      margin: MARGIN,
      barmode: 'overlay',
      legend: legendRow('above', 0.02),
      xaxis: {
        ...axis,
        anchor: 'y2',
        title: { text: 'instant move of the underlying (%)' },
        ticksuffix: '%',
      },
      yaxis: { ...axis, domain: [0.36, 1], title: { text: 'book P&L' } },
      yaxis2: {
        ...axis,
        ...logAxisFor(Math.min(...shown), Math.max(...shown), PROBABILITY_PIXELS),
        domain: [0, 0.26],
        title: { text: 'probability' },
      },
    };
    return { data, layout };
  }, [result, scenarioIndex, theme]);
  return <PlotlyChart data={figure.data} layout={figure.layout} />;
}
