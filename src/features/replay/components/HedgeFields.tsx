/**
 * One hedge's settings: method, rebalances a day, cost, the hedge vol (Black-Scholes) and the
 * hedge option (gamma and vega hedges).
 */
import type { UseFormRegister } from 'react-hook-form';
import type { HedgeForm, ReplayForm } from '../form/replay-form';

export const METHOD_LABELS = {
  none: 'no hedge',
  'bs-delta': 'Black-Scholes delta',
  'model-delta': 'model delta',
  'model-delta-gamma': 'model delta + gamma with an option',
  'model-delta-vega': 'model delta + vega with an option',
} as const;

/** Short enough for a chart legend. */
export const SHORT_METHOD_LABELS = {
  none: 'no hedge',
  'bs-delta': 'BS delta',
  'model-delta': 'model delta',
  'model-delta-gamma': 'delta-gamma',
  'model-delta-vega': 'delta-vega',
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
        <span>Cost (bp of traded value or premium)</span>
        <input aria-label={`${label} cost`} className={input} {...register(`${name}.costBps`)} />
      </label>
      {(method === 'model-delta-gamma' || method === 'model-delta-vega') && (
        <div className="space-y-2 border-l-2 border-rule pl-2">
          <p className="text-xs text-muted">
            The option held, at each rebalance, in the quantity that zeroes the book&apos;s model{' '}
            {method === 'model-delta-gamma' ? 'gamma' : 'vega'}; the delta left is hedged in the
            underlying. It must not expire before the last leg.
          </p>
          <label className={row}>
            <span>Hedge option</span>
            <select
              aria-label={`${label} option type`}
              className="rounded border border-rule bg-panel px-2 py-1"
              {...register(`${name}.instrumentType`)}
            >
              <option value="call">call</option>
              <option value="put">put</option>
            </select>
          </label>
          <label className={row}>
            <span>Its strike</span>
            <input
              aria-label={`${label} option strike`}
              inputMode="decimal"
              className={input}
              {...register(`${name}.instrumentStrike`)}
            />
          </label>
          <label className={row}>
            <span>Its days to expiry</span>
            <input
              aria-label={`${label} option days`}
              inputMode="decimal"
              className={input}
              {...register(`${name}.instrumentDays`)}
            />
          </label>
        </div>
      )}
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
