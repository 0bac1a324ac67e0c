/** The position builder: one row a European leg, with add and remove and per-row messages. */
export interface LegRow {
  type: 'call' | 'put';
  side: 'long' | 'short';
  strike: string;
  days: string;
  quantity: string;
}

const cell = 'rounded border border-rule bg-panel px-2 py-1';

export function LegsTable({
  rows,
  onChange,
  issues,
  spot,
}: {
  rows: LegRow[];
  onChange: (rows: LegRow[]) => void;
  /** a message per row index, from validation */
  issues: Record<number, string>;
  spot: number;
}) {
  const set = (i: number, patch: Partial<LegRow>) =>
    onChange(rows.map((r, j) => (j === i ? { ...r, ...patch } : r)));
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
          {rows.map((r, i) => (
            <tr key={i} className="align-top">
              <td>
                <select
                  aria-label={`Leg ${i + 1} side`}
                  value={r.side}
                  onChange={(e) => set(i, { side: e.target.value as LegRow['side'] })}
                  className={cell}
                >
                  <option value="long">long</option>
                  <option value="short">short</option>
                </select>
              </td>
              <td>
                <select
                  aria-label={`Leg ${i + 1} type`}
                  value={r.type}
                  onChange={(e) => set(i, { type: e.target.value as LegRow['type'] })}
                  className={cell}
                >
                  <option value="put">put</option>
                  <option value="call">call</option>
                </select>
              </td>
              {(['strike', 'days', 'quantity'] as const).map((k) => (
                <td key={k}>
                  <input
                    aria-label={`Leg ${i + 1} ${k}`}
                    value={r[k]}
                    inputMode="decimal"
                    onChange={(e) => set(i, { [k]: e.target.value })}
                    className={`${cell} tabular w-full text-right`}
                  />
                </td>
              ))}
              <td>
                <button
                  type="button"
                  aria-label={`Remove leg ${i + 1}`}
                  onClick={() => onChange(rows.filter((_, j) => j !== i))}
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
      {rows.length === 0 && <p className="text-xs text-muted">No legs: add one to replay.</p>}
      <button
        type="button"
        disabled={rows.length >= 20}
        onClick={() =>
          onChange([
            ...rows,
            { type: 'put', side: 'short', strike: String(spot), days: '7', quantity: '1' },
          ])
        }
        className="text-sm text-teal disabled:opacity-50"
      >
        + Add leg
      </button>
    </div>
  );
}
