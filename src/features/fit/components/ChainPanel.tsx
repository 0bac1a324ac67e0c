/**
 * What an uploaded chain says before any fit: each expiry's forward and discount read off it by
 * put–call parity (with their standard errors and the carry they imply), the quotes dropped and
 * why, and the static-arbitrage flags, which the user may drop from the fit or keep.
 */
import { formatNumber, formatTenor } from '../../../components/format';
import type { ArbitrageFlag, ParsedQuotes } from '../../../engine/fit';

type Chain = NonNullable<ParsedQuotes['chain']>;

const pct = (x: number, digits = 2) => `${formatNumber(100 * x, digits)} %`;

export function ForwardsTable({ chain }: { chain: Chain }) {
  const dropped = chain.dropped;
  return (
    <div className="space-y-2" data-testid="chain-forwards">
      <h2 className="text-lg font-semibold">Forwards by put–call parity</h2>
      <table className="tabular text-sm">
        <thead className="text-xs text-muted">
          <tr>
            <th className="pr-4 text-left font-normal">expiry</th>
            <th className="px-3 text-right font-normal">forward</th>
            <th className="px-3 text-right font-normal">± s.e.</th>
            <th className="px-3 text-right font-normal">discount</th>
            <th className="px-3 text-right font-normal">± s.e.</th>
            <th className="px-3 text-right font-normal">implied carry (dividend + borrow)</th>
            <th className="px-3 text-right font-normal">strikes used</th>
          </tr>
        </thead>
        <tbody>
          {chain.forwards.map((f, i) => (
            <tr key={f.expiry} className="border-t border-rule/60">
              <td className="pr-4">{formatTenor(f.expiry)}</td>
              <td className="px-3 text-right">{formatNumber(f.forward, 2)}</td>
              <td className="px-3 text-right text-muted">{formatNumber(f.forwardStdError, 3)}</td>
              <td className="px-3 text-right">{formatNumber(f.discount, 6)}</td>
              <td className="px-3 text-right text-muted">
                {f.discountStdError === 0 ? 'from the rate' : formatNumber(f.discountStdError, 6)}
              </td>
              <td className="px-3 text-right">{pct(chain.carry[i])}</td>
              <td className="px-3 text-right">{f.used}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="text-xs text-muted">
        C − P = D·(F − K) fitted over the strikes with both sides, weighted by their spreads and
        robust to bad quotes; the out-of-the-money side of each strike is then fitted at its mid. On
        short expiries the strikes span little and the discount is loosely pinned: its standard
        error says how loosely.
      </p>
      {dropped.length > 0 && (
        <details className="text-sm" data-testid="chain-dropped">
          <summary className="cursor-pointer">
            {dropped.length} quote{dropped.length > 1 ? 's' : ''} dropped
          </summary>
          <ul className="tabular mt-1 columns-2 text-xs text-muted md:columns-3">
            {dropped.map((d, i) => (
              <li key={i}>
                {formatTenor(d.expiry)} {d.strike} {d.type}: {d.reason}
              </li>
            ))}
          </ul>
        </details>
      )}
    </div>
  );
}

export function ArbitrageList({
  flags,
  dropFlagged,
  onDropFlagged,
}: {
  flags: ArbitrageFlag[];
  dropFlagged: boolean;
  onDropFlagged: (drop: boolean) => void;
}) {
  return (
    <div className="space-y-2" data-testid="arbitrage-flags">
      <h2 className="text-lg font-semibold">Static arbitrage in the quotes</h2>
      {flags.length === 0 ? (
        <p className="text-sm text-muted">
          None: calls fall and are convex in strike, and total variance rises with expiry.
        </p>
      ) : (
        <>
          <ul className="tabular text-sm">
            {flags.slice(0, 30).map((f, i) => (
              <li key={i}>
                <span className="font-semibold">{f.kind}</span>:{' '}
                {f.quotes.map((q) => `${formatTenor(q.expiry)} ${q.strike}`).join(', ')} — by{' '}
                {f.kind === 'calendar'
                  ? `${formatNumber(f.size * 1e4, 2)} × 10⁻⁴ of total variance`
                  : `${formatNumber(f.size * 1e4, 2)} bp of the forward`}
              </li>
            ))}
          </ul>
          {flags.length > 30 && <p className="text-xs text-muted">and {flags.length - 30} more</p>}
          <label className="flex items-center gap-2 text-sm">
            <input
              type="checkbox"
              checked={dropFlagged}
              onChange={(e) => onDropFlagged(e.target.checked)}
            />
            Leave the flagged quotes out of the fit
          </label>
        </>
      )}
    </div>
  );
}
