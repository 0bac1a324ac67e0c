/** One hedge's settings: method, rebalances a day, cost and (for Black-Scholes) the hedge vol. */
import type { UseFormRegister } from 'react-hook-form';
import type { HedgeForm, ReplayForm } from '../form/replay-form';

export const METHOD_LABELS = {
  none: 'no hedge',
  'bs-delta': 'Black-Scholes delta',
  'model-delta': 'model delta',
} as const;

const input = 'tabular rounded border border-rule bg-panel px-2 py-1 text-right';

export function HedgeFields({
  label,
  name,
  method,
  register,
}: {
  label: string;
  /** which of the form's hedges */
  name: 'hedge' | 'compare';
  method: HedgeForm['method'];
  register: UseFormRegister<ReplayForm>;
}) {
  const row = 'grid grid-cols-[1fr_11rem] items-center gap-2 text-sm';
  return (
    <fieldset className="space-y-2">
      <legend className="text-sm font-semibold">{label}</legend>
      <label className={row}>
        <span>Method</span>
        <select
          aria-label={`${label} method`}
          className="rounded border border-rule bg-panel px-2 py-1"
          {...register(`${name}.method`)}
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
          className={input}
          {...register(`${name}.rebalancesPerDay`)}
        />
      </label>
      <label className={row}>
        <span>Cost (bp of traded value)</span>
        <input aria-label={`${label} cost`} className={input} {...register(`${name}.costBps`)} />
      </label>
      {method === 'bs-delta' && (
        <label className={row}>
          <span>Hedge vol % (blank: each leg&apos;s implied vol)</span>
          <input
            aria-label={`${label} hedge vol`}
            placeholder="implied"
            className={input}
            {...register(`${name}.hedgeVol`)}
          />
        </label>
      )}
    </fieldset>
  );
}
