/** One hedge's settings: method, rebalances a day, cost and (for Black-Scholes) the hedge vol. */
import type { HedgeForm } from '../form/replay-form';

export const METHOD_LABELS = {
  none: 'no hedge',
  'bs-delta': 'Black-Scholes delta',
  'model-delta': 'model delta',
} as const;

const input = 'tabular rounded border border-rule bg-panel px-2 py-1 text-right';

export function HedgeFields({
  label,
  value,
  onChange,
}: {
  label: string;
  value: HedgeForm;
  onChange: (h: HedgeForm) => void;
}) {
  const row = 'grid grid-cols-[1fr_11rem] items-center gap-2 text-sm';
  return (
    <fieldset className="space-y-2">
      <legend className="text-sm font-semibold">{label}</legend>
      <label className={row}>
        <span>Method</span>
        <select
          aria-label={`${label} method`}
          value={value.method}
          onChange={(e) => onChange({ ...value, method: e.target.value as HedgeForm['method'] })}
          className="rounded border border-rule bg-panel px-2 py-1"
        >
          {Object.entries(METHOD_LABELS).map(([k, v]) => (
            <option key={k} value={k}>
              {v}
            </option>
          ))}
        </select>
      </label>
      <label className={row}>
        <span>Rebalances a day</span>
        <input
          aria-label={`${label} rebalances a day`}
          value={value.rebalancesPerDay}
          onChange={(e) => onChange({ ...value, rebalancesPerDay: e.target.value })}
          className={input}
        />
      </label>
      <label className={row}>
        <span>Cost (bp of traded value)</span>
        <input
          aria-label={`${label} cost`}
          value={value.costBps}
          onChange={(e) => onChange({ ...value, costBps: e.target.value })}
          className={input}
        />
      </label>
      {value.method === 'bs-delta' && (
        <label className={row}>
          <span>Hedge vol % (blank: each leg&apos;s implied vol)</span>
          <input
            aria-label={`${label} hedge vol`}
            value={value.hedgeVol}
            placeholder="implied"
            onChange={(e) => onChange({ ...value, hedgeVol: e.target.value })}
            className={input}
          />
        </label>
      )}
    </fieldset>
  );
}
