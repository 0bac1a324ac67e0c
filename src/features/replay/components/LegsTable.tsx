/**
 * A leg list builder (the position, or its overlay): one row a European leg, with add and
 * remove and per-row messages.
 */
import { useFieldArray, type Control, type UseFormRegister } from 'react-hook-form';
import type { ReplayForm } from '../form/replay-form';

const cell = 'rounded border border-rule bg-panel px-2 py-1';

export function LegsTable({
  control,
  register,
  issues,
  spot,
  name = 'legs',
  noun = 'Leg',
  empty = 'No legs: add one to replay.',
}: {
  /** which of the form's lists */
  name?: 'legs' | 'overlay';
  /** what a row is called in labels and messages */
  noun?: string;
  empty?: string;
  control: Control<ReplayForm, unknown, unknown>;
  register: UseFormRegister<ReplayForm>;
  /** a message per row index, from validation */
  issues: Record<number, string>;
  spot: number;
}) {
  const { fields, append, remove } = useFieldArray({ control, name });
  return (
    <div className="space-y-2">
      <table className="w-full text-sm" data-testid={name}>
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
                  aria-label={`${noun} ${i + 1} side`}
                  className={cell}
                  {...register(`${name}.${i}.side`)}
                >
                  <option value="long">long</option>
                  <option value="short">short</option>
                </select>
              </td>
              <td>
                <select
                  aria-label={`${noun} ${i + 1} type`}
                  className={cell}
                  {...register(`${name}.${i}.type`)}
                >
                  <option value="put">put</option>
                  <option value="call">call</option>
                </select>
              </td>
              {(['strike', 'days', 'quantity'] as const).map((k) => (
                <td key={k}>
                  <input
                    aria-label={`${noun} ${i + 1} ${k}`}
                    inputMode="decimal"
                    className={`${cell} tabular w-full text-right`}
                    {...register(`${name}.${i}.${k}`)}
                  />
                </td>
              ))}
              <td>
                <button
                  type="button"
                  aria-label={`Remove ${noun.toLowerCase()} ${i + 1}`}
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
          {Number(i) >= 0 ? `${noun} ${Number(i) + 1}: ` : ''}
          {m}
        </p>
      ))}
      {fields.length === 0 && <p className="text-xs text-muted">{empty}</p>}
      <button
        type="button"
        disabled={fields.length >= (name === 'legs' ? 20 : 10)}
        onClick={() =>
          append(
            name === 'legs'
              ? { type: 'put', side: 'short', strike: String(spot), days: '7', quantity: '1' }
              : { type: 'put', side: 'long', strike: String(0.9 * spot), days: '7', quantity: '1' },
          )
        }
        className="text-sm text-teal disabled:opacity-50"
      >
        + Add {noun.toLowerCase()}
      </button>
    </div>
  );
}
