/** The P&L statistics and jump attribution of each replayed hedge, side by side. */
import type { ReplayRequest, ReplayResult } from '../../../engine/replay';
import { formatNumber } from '../../../components/format';
import { METHOD_LABELS } from './HedgeFields';

type Row = [string, (r: ReplayResult) => number];

const ROWS: Row[] = [
  ['mean P&L', (r) => r.pnl.mean],
  ['standard deviation', (r) => r.pnl.stdev],
  ['99 % VaR (loss)', (r) => r.pnl.var99],
  ['99 % expected shortfall (loss)', (r) => r.pnl.es99],
  ['worst path', (r) => r.pnl.worst],
  ['mean P&L on steps without a jump', (r) => r.attribution.diffusion],
  ['mean P&L on steps with a jump', (r) => r.attribution.jumps],
  ['worst 1 %: on steps without a jump', (r) => r.attribution.tailDiffusion],
  ['worst 1 %: on steps with a jump', (r) => r.attribution.tailJumps],
];

/** With scheduled moves, the steps they land on are a part of their own. */
const ROWS_WITH_MOVES: Row[] = [
  ...ROWS.slice(0, 5),
  ['mean P&L on other steps', (r) => r.attribution.diffusion],
  ['mean P&L on steps with a jump', (r) => r.attribution.jumps],
  ['mean P&L on scheduled-move steps', (r) => r.attribution.events ?? 0],
  ['worst 1 %: on other steps', (r) => r.attribution.tailDiffusion],
  ['worst 1 %: on steps with a jump', (r) => r.attribution.tailJumps],
  ['worst 1 %: on scheduled-move steps', (r) => r.attribution.tailEvents ?? 0],
];

export const hasMoves = (requests: readonly ReplayRequest[]) =>
  requests.some((r) => (r.model.events?.length ?? 0) > 0);

export const hedgeName = (r: ReplayRequest) =>
  `${METHOD_LABELS[r.hedge.method]}${r.hedge.method === 'none' ? '' : `, ${r.hedge.rebalancesPerDay}× a day`}${r.hedge.costBps ? `, ${r.hedge.costBps} bp` : ''}${r.hedge.hedgeVol ? ` at ${(100 * r.hedge.hedgeVol).toFixed(1)} %` : ''}`;

export function ReplayStats({
  requests,
  results,
}: {
  requests: ReplayRequest[];
  results: ReplayResult[];
}) {
  return (
    <table className="tabular text-right text-sm" data-testid="replay-stats">
      <thead className="text-xs text-muted">
        <tr>
          <th className="px-3 text-left font-normal">per path, discounted to today</th>
          {requests.map((r, i) => (
            <th key={i} className="px-3 font-normal">
              {hedgeName(r)}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {(hasMoves(requests) ? ROWS_WITH_MOVES : ROWS).map(([label, pick]) => (
          <tr key={label} className="border-t border-rule/60">
            <td className="px-3 text-left">{label}</td>
            {results.map((r, i) => (
              <td key={i} className="px-3">
                {formatNumber(pick(r), 4)}
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
