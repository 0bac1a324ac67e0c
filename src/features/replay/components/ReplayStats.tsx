/**
 * The P&L statistics and jump attribution of each replayed run, side by side. One sign
 * convention throughout: every figure is a P&L, positive a gain and negative a loss (VaR and
 * expected shortfall included, as the P&L at the 1st percentile and the mean of the worst 1 %).
 */
import type { ReplayRequest, ReplayResult } from '../../../engine/replay';
import { formatNumber } from '../../../components/format';
import { METHOD_LABELS } from './HedgeFields';

type Row = [string, (r: ReplayResult) => number | undefined];

const TOP: Row[] = [
  ['mean P&L', (r) => r.pnl.mean],
  ['standard deviation of P&L', (r) => r.pnl.stdev],
  ['99 % VaR: P&L at the 1st percentile', (r) => -r.pnl.var99],
  ['99 % expected shortfall: mean P&L of the worst 1 %', (r) => -r.pnl.es99],
  ['worst path P&L', (r) => r.pnl.worst],
];

const SPLIT: Row[] = [
  ['mean P&L on steps without a jump', (r) => r.attribution.diffusion],
  ['mean P&L on steps with a jump', (r) => r.attribution.jumps],
  ['worst 1 %: P&L on steps without a jump', (r) => r.attribution.tailDiffusion],
  ['worst 1 %: P&L on steps with a jump', (r) => r.attribution.tailJumps],
];

/** With scheduled moves, the steps they land on are a part of their own. */
const SPLIT_WITH_MOVES: Row[] = [
  ['mean P&L on other steps', (r) => r.attribution.diffusion],
  ['mean P&L on steps with a jump', (r) => r.attribution.jumps],
  ['mean P&L on scheduled-move steps', (r) => r.attribution.events ?? 0],
  ['worst 1 %: P&L on other steps', (r) => r.attribution.tailDiffusion],
  ['worst 1 %: P&L on steps with a jump', (r) => r.attribution.tailJumps],
  ['worst 1 %: P&L on scheduled-move steps', (r) => r.attribution.tailEvents ?? 0],
];

const CASH: Row[] = [['cash at inception for the position', (r) => -r.premium]];

const OVERLAY: Row[] = [
  ['cash at inception for the overlay', (r) => -r.overlayPremium],
  ['overlay alone, unhedged: mean P&L', (r) => r.overlayPnl?.mean],
  ['overlay alone, unhedged: s.d.', (r) => r.overlayPnl?.stdev],
];

export const hasMoves = (requests: readonly ReplayRequest[]) =>
  requests.some((r) => (r.model.events?.length ?? 0) > 0);

const hasOverlay = (r: ReplayRequest) => (r.overlay?.length ?? 0) > 0;

export const hedgeName = (r: ReplayRequest) =>
  `${METHOD_LABELS[r.hedge.method]}${r.hedge.method === 'none' ? '' : `, ${r.hedge.rebalancesPerDay}× a day`}${r.hedge.costBps ? `, ${r.hedge.costBps} bp` : ''}${r.hedge.hedgeVol ? ` at ${(100 * r.hedge.hedgeVol).toFixed(1)} %` : ''}${r.hedge.instrument && r.hedge.method.startsWith('model-delta-') ? ` (${r.hedge.instrument.type} ${r.hedge.instrument.strike}, ${Math.round(r.hedge.instrument.expiry * 365)} d)` : ''}${hasOverlay(r) ? ' + overlay' : ''}`;

export function ReplayStats({
  requests,
  results,
}: {
  requests: ReplayRequest[];
  results: ReplayResult[];
}) {
  const rows = [
    ...TOP,
    ...(hasMoves(requests) ? SPLIT_WITH_MOVES : SPLIT),
    ...CASH,
    ...(requests.some(hasOverlay) ? OVERLAY : []),
  ];
  return (
    <table className="tabular text-right text-sm" data-testid="replay-stats">
      <caption className="pb-1 text-left text-xs text-muted">
        Per path, discounted to today. Every figure is a P&amp;L or a cash amount: positive is a
        gain (or cash received), negative a loss (or cash paid).
      </caption>
      <thead className="text-xs text-muted">
        <tr>
          <th className="px-3 text-left font-normal" />
          {requests.map((r, i) => (
            <th key={i} className="px-3 font-normal">
              {hedgeName(r)}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.map(([label, pick]) => (
          <tr key={label} className="border-t border-rule/60">
            <td className="px-3 text-left">{label}</td>
            {results.map((r, i) => (
              <td key={i} className="px-3">
                {hasOverlay(requests[i]) || !label.startsWith('overlay')
                  ? formatNumber(pick(r), 4)
                  : '—'}
              </td>
            ))}
          </tr>
        ))}
        <tr className="border-t border-rule/60 text-muted">
          <td className="px-3 text-left">digest of every path&apos;s P&amp;L</td>
          {results.map((r, i) => (
            <td key={i} className="px-3 font-mono text-xs">
              {r.digest}
            </td>
          ))}
        </tr>
      </tbody>
    </table>
  );
}
