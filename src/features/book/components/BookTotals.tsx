/**
 * The base's totals per underlying and currency (never added up across either), the P&L since
 * trade and vega by expiry.
 */
import { formatNumber } from '../../../components/format';
import type { SetRevaluation } from '../../../engine/book';

export function BookTotals({ data }: { data: SetRevaluation }) {
  const several = data.totals.length > 1;
  return (
    <div className="space-y-1">
      {data.totals.map((t) => (
        <p
          key={t.currency ?? ''}
          className="tabular text-sm"
          data-testid="book-total"
          data-currency={t.currency ?? ''}
        >
          <span className="font-semibold">
            {t.underlying ?? 'Base underlying'}
            {t.currency ? ` · ${t.currency}` : ''}
          </span>
          {several && ` (${t.legs} legs)`}: value {formatNumber(t.value, 2)} · delta{' '}
          {formatNumber(t.delta, 2)} · gamma {t.gamma.toExponential(3)} · vega{' '}
          {formatNumber(t.vega, 2)} per vol point · theta {formatNumber(t.theta, 2)} per day
          {!several && ` · ${data.elapsedMs.toFixed(0)} ms`}
        </p>
      ))}
      {several && (
        <p role="note" className="text-sm text-warn">
          The legs are booked in {data.totals.length} currencies: each is totalled on its own. The
          ladder, the scenario matrix and the jump figures below add all legs in units of the
          underlying, with no FX conversion.
        </p>
      )}
      <p className="tabular text-sm" data-testid="book-since-trade">
        {data.sinceTrade.priced > 0
          ? `P&L since trade ${data.totals
              .map((t) => `${formatNumber(t.sinceTrade, 2)}${t.currency ? ` ${t.currency}` : ''}`)
              .join(
                ' · ',
              )} over the ${data.sinceTrade.priced} leg${data.sinceTrade.priced > 1 ? 's' : ''} with a trade price`
          : 'No leg has a trade price: add a tradePrice column for the P&L since trade'}{' '}
        · vega by expiry{' '}
        {data.vegaByExpiry
          .filter((b) => b.vega !== 0)
          .map((b) => `${b.label} ${formatNumber(b.vega, 2)}`)
          .join(', ') || 'none'}
      </p>
    </div>
  );
}
