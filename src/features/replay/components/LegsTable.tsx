/** The position builder: one row a European leg, with add and remove and per-row messages. */
import { useFieldArray, type Control, type UseFormRegister } from 'react-hook-form';
import type { ReplayForm } from '../form/replay-form';

const cell = 'rounded border border-rule bg-panel px-2 py-1';

export function LegsTable({
  control,
  register,
  issues,
  spot,
}: {
  control: Control<ReplayForm, unknown, unknown>;
  register: UseFormRegister<ReplayForm>;
  /** a message per row index, from validation */
  issues: Record<number, string>;
  spot: number;
}) {
  const { fields, append, remove } = useFieldArray({ control, name: 'legs' });
  return (
    <div className="space-y-2">
      <table className="w-full text-sm" data-testid="legs">
        <thead className="text-xs text-muted">
          <tr>
            <th className="text-left font-normal">side</th>
            <th className="text-left font-normal">type</th>
            <th className="text-right font-normal">strike</th>
            <th className="text-right font-normal">days</th>
            <th className="text-right font-normal">quantity</th>
            <th />
          </tr>
        </thead>
        <tbody>
          {fields.map((row, i) => (
            <tr key={row.id} className="align-top">
              <td>
                <select
                  aria-label={`Leg ${i + 1} side`}
                  className={cell}
                  {...register(`legs.${i}.side`)}
                >
                  <option value="long">long</option>
                  <option value="short">short</option>
                </select>
              </td>
              <td>
                <select
                  aria-label={`Leg ${i + 1} type`}
                  className={cell}
                  {...register(`legs.${i}.type`)}
                >
                  <option value="put">put</option>
                  <option value="call">call</option>
                </select>
              </td>
              {(['strike', 'days', 'quantity'] as const).map((k) => (
                <td key={k}>
                  <input
                    aria-label={`Leg ${i + 1} ${k}`}
                    inputMode="decimal"
                    className={`${cell} tabular w-full text-right`}
                    {...register(`legs.${i}.${k}`)}
                  />
                </td>
              ))}
              <td>
                <button
                  type="button"
                  aria-label={`Remove leg ${i + 1}`}
                  onClick={() => remove(i)}
                  className="px-2 py-1 text-muted hover:text-stressed"
                >
                  ×
                </button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {Object.entries(issues).map(([i, m]) => (
        <p key={i} role="alert" className="text-xs text-stressed">
          {Number(i) >= 0 ? `Leg ${Number(i) + 1}: ` : ''}
          {m}
        </p>
      ))}
      {fields.length === 0 && <p className="text-xs text-muted">No legs: add one to replay.</p>}
      <button
        type="button"
        disabled={fields.length >= 20}
        onClick={() =>
          append({ type: 'put', side: 'short', strike: String(spot), days: '7', quantity: '1' })
        }
        className="text-sm text-teal disabled:opacity-50"
      >
        + Add leg
      </button>
    </div>
  );
}
