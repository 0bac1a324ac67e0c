import type { LegRisk, Position } from '../../../engine/book';
import { formatNumber, formatVol } from '../../../components/format';

interface Props {
  positions: Position[];
  risks: LegRisk[] | null;
  /** per leg: P&L since trade (null without a trade price) */
  sinceTrade: (number | null)[] | null;
  selected: string | null;
  onSelect: (id: string) => void;
  onQuantity: (id: string, quantity: number) => void;
  onRemove: (id: string) => void;
  /** a desk book the user may only read: no quantity edits, no removal */
  readOnly?: boolean;
}

const MAX_SHOWN = 300;

/**
 * The book's legs with base value and Greeks (in units of the underlying: quantity ×
 * multiplier); quantity editable in place.
 */
export function PositionsTable({
  positions,
  risks,
  sinceTrade,
  selected,
  onSelect,
  onQuantity,
  onRemove,
  readOnly = false,
}: Props) {
  return (
    <div className="max-h-96 overflow-auto rounded border border-rule">
      <table className="tabular w-full text-right text-sm" data-testid="positions-table">
        <thead className="sticky top-0 bg-panel text-xs text-muted">
          <tr>
            {[
              'leg',
              'type',
              'strike',
              'expiry (days)',
              'quantity',
              'contract',
              'vol %',
              'value',
              'delta',
              'gamma',
              'vega /pt',
              'theta /day',
              'P&L since trade',
              '',
            ].map((h) => (
              <th key={h} scope="col" className="px-2 py-1.5 font-normal">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {positions.slice(0, MAX_SHOWN).map((p, i) => {
            const r = risks?.[i];
            return (
              <tr
                key={p.id}
                className={`border-t border-rule/60 ${selected === p.id ? 'bg-teal/10' : ''}`}
              >
                <td className="px-2 py-1 text-left">
                  <button
                    type="button"
                    className="text-teal hover:underline"
                    onClick={() => onSelect(p.id)}
                  >
                    {p.id}
                  </button>
                </td>
                <td className="px-2 py-1 text-muted">{p.type}</td>
                <td className="px-2 py-1">
                  {p.strike === undefined ? '' : formatNumber(p.strike, 2)}
                </td>
                <td className="px-2 py-1">
                  {p.expiry === undefined ? '' : (p.expiry * 365).toFixed(1)}
                </td>
                <td className="px-2 py-1">
                  <input
                    // a new quantity from elsewhere (a colleague's edit, synced) replaces the field
                    key={p.quantity}
                    aria-label={`Quantity of ${p.id}`}
                    defaultValue={p.quantity}
                    readOnly={readOnly}
                    className="tabular w-20 rounded border border-rule bg-panel px-1 text-right"
                    onBlur={(e) => {
                      const q = Number(e.target.value);
                      if (Number.isFinite(q) && q !== 0) onQuantity(p.id, q);
                      else e.target.value = String(p.quantity);
                    }}
                  />
                </td>
                <td className="whitespace-nowrap px-2 py-1 text-muted">
                  ×{p.multiplier ?? 1}
                  {p.currency ? ` ${p.currency}` : ''}
                </td>
                <td className="px-2 py-1">{r ? formatVol(r.impliedVol) : '…'}</td>
                <td className="px-2 py-1">{r ? formatNumber(r.value, 2) : '…'}</td>
                <td className="px-2 py-1">{r ? formatNumber(r.delta, 3) : '…'}</td>
                <td className="px-2 py-1">{r ? r.gamma.toExponential(2) : '…'}</td>
                <td className="px-2 py-1">{r ? formatNumber(r.vega, 2) : '…'}</td>
                <td className="px-2 py-1">{r ? formatNumber(r.theta, 2) : '…'}</td>
                <td
                  className="px-2 py-1"
                  title={
                    p.tradePrice === undefined ? 'no trade price' : `traded at ${p.tradePrice}`
                  }
                >
                  {sinceTrade
                    ? sinceTrade[i] === null
                      ? '—'
                      : formatNumber(sinceTrade[i], 2)
                    : '…'}
                </td>
                <td className="px-2 py-1">
                  {!readOnly && (
                    <button
                      type="button"
                      className="text-xs text-muted hover:text-stressed"
                      onClick={() => onRemove(p.id)}
                      aria-label={`Remove ${p.id}`}
                    >
                      remove
                    </button>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {positions.length > MAX_SHOWN && (
        <p className="p-2 text-xs text-muted">
          Showing {MAX_SHOWN} of {positions.length} legs; totals include all.
        </p>
      )}
    </div>
  );
}
