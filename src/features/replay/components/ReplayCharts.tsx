/** The replayed hedges' P&L histograms on shared bins, and where the mean and tail P&L came from. */
import type { Data, Layout } from 'plotly.js';
import { useMemo } from 'react';
import type { ReplayRequest, ReplayResult, PnlHistogram } from '../../../engine/replay';
import { chartFrame, chartTheme, legendRow, LOG_AXIS } from '../../../components/chart-theme';
import { PlotlyChart } from '../../../components/PlotlyChart';
import { useTheme } from '../../../components/theme';
import { hasMoves } from './ReplayStats';
import { SHORT_METHOD_LABELS } from './HedgeFields';

/** Short enough for a legend under a half-width chart. */
export const legendName = (r: ReplayRequest) =>
  `${SHORT_METHOD_LABELS[r.hedge.method]}${(r.overlay?.length ?? 0) > 0 ? ' + overlay' : ''}`;

/** One colour per run: the hedges in teal and blue, their overlay runs in the stressed orange and ink. */
export function hedgeColours(t: ReturnType<typeof chartTheme>, requests: readonly ReplayRequest[]) {
  const withOverlay = requests.some((r) => (r.overlay?.length ?? 0) > 0);
  return withOverlay ? [t.teal, t.stressed, t.base, t.ink] : [t.teal, t.base];
}

export function ReplayCharts({
  requests,
  results,
  histograms,
}: {
  requests: ReplayRequest[];
  results: ReplayResult[];
  histograms: PnlHistogram[];
}) {
  const theme = useTheme();
  const figures = useMemo(() => {
    const t = chartTheme(theme);
    const colours = hedgeColours(t, requests);
    // a fresh axis object for every chart: Plotly writes its ranges into the layout it is given
    const axis = () => ({ gridcolor: t.grid, zerolinecolor: t.grid, tickfont: { color: t.muted } });
    const layout = (title: string): Partial<Layout> => ({
      ...chartFrame(t, 11),
      margin: { l: 60, r: 10, t: 30, b: 50 },
      height: 320,
      title: { text: title, font: { size: 13 }, x: 0 },
      legend: legendRow('below', 0.32),
      xaxis: axis(),
      yaxis: axis(),
    });
    const h0 = histograms[0];
    const width = (h0.hi - h0.lo) / h0.counts.length;
    const centres = h0.counts.map((_, i) => h0.lo + (i + 0.5) * width);
    const histogram: Data[] = histograms.map(
      (h, k) =>
        ({
          type: 'bar',
          x: centres,
          y: h.counts,
          name: legendName(requests[k]),
          marker: { color: colours[k], opacity: 0.55 },
        }) as Data,
    );
    const moves = hasMoves(requests);
    const parts = moves
      ? [
          'mean,<br>other',
          'mean,<br>jump',
          'mean,<br>move',
          'worst 1 %,<br>other',
          'worst 1 %,<br>jump',
          'worst 1 %,<br>move',
        ]
      : ['mean,<br>no jump', 'mean,<br>jump', 'worst 1 %,<br>no jump', 'worst 1 %,<br>jump'];
    const attribution: Data[] = results.map(
      (r, k) =>
        ({
          type: 'bar',
          x: parts,
          y: moves
            ? [
                r.attribution.diffusion,
                r.attribution.jumps,
                r.attribution.events ?? 0,
                r.attribution.tailDiffusion,
                r.attribution.tailJumps,
                r.attribution.tailEvents ?? 0,
              ]
            : [
                r.attribution.diffusion,
                r.attribution.jumps,
                r.attribution.tailDiffusion,
                r.attribution.tailJumps,
              ],
          name: legendName(requests[k]),
          marker: { color: colours[k] },
        }) as Data,
    );
    return {
      histogram: {
        data: histogram,
        layout: {
          ...layout('P&L per path at the horizon (paths per bin, log scale)'),
          xaxis: { ...axis(), title: { text: 'P&L at the horizon (discounted)' } },
          yaxis: { ...axis(), ...LOG_AXIS, title: { text: 'paths' } },
          barmode: 'overlay',
          bargap: 0,
        },
      },
      attribution: {
        data: attribution,
        layout: {
          ...layout(
            moves
              ? 'P&L booked on steps with a jump, with a scheduled move, and the rest'
              : 'P&L booked on steps with and without a jump',
          ),
          yaxis: { ...axis(), title: { text: 'P&L per path' } },
          barmode: 'group',
        },
      },
    };
  }, [requests, results, histograms, theme]);
  return (
    <div className="grid gap-4 xl:grid-cols-2" data-testid="replay-charts">
      <PlotlyChart data={figures.histogram.data} layout={figures.histogram.layout} />
      <PlotlyChart data={figures.attribution.data} layout={figures.attribution.layout} />
    </div>
  );
}
