import { useState, memo } from 'react';
import { TENORS } from '../../../engine/core';
import { formatTenor } from '../../../components/format';

interface Props {
  expiries: number[];
  onChange: (expiries: number[]) => void;
}

const same = (a: number, b: number) => Math.abs(a - b) < 1e-9;

// memo: a stress step re-renders the page, not this
export const ExpiryPicker = memo(function ExpiryPicker({ expiries, onChange }: Props) {
  const [days, setDays] = useState('');
  const [error, setError] = useState<string | null>(null);
  const toggle = (t: number) => {
    const has = expiries.some((e) => same(e, t));
    const next = has ? expiries.filter((e) => !same(e, t)) : [...expiries, t];
    if (next.length === 0) return;
    onChange(next.sort((a, b) => a - b));
  };
  const custom = expiries.filter((e) => !TENORS.some((t) => same(t.years, e)));
  return (
    <div className="flex flex-wrap items-center gap-2" role="group" aria-label="Expiries">
      {TENORS.map((t) => {
        const on = expiries.some((e) => same(e, t.years));
        return (
          <button
            key={t.label}
            type="button"
            aria-pressed={on}
            onClick={() => toggle(t.years)}
            className={`rounded-full border px-3 py-0.5 text-sm ${on ? 'border-teal bg-teal/10 text-teal' : 'border-rule text-muted'}`}
          >
            {t.label}
          </button>
        );
      })}
      {custom.map((c) => (
        <button
          key={c}
          type="button"
          aria-pressed
          onClick={() => toggle(c)}
          className="rounded-full border border-teal bg-teal/10 px-3 py-0.5 text-sm text-teal"
          title="Remove"
        >
          {formatTenor(c)} ×
        </button>
      ))}
      <form
        className="flex items-center gap-1"
        onSubmit={(e) => {
          e.preventDefault();
          const n = Number(days);
          if (!Number.isFinite(n) || n <= 0 || n > 3650) {
            setError('days from 0 to 3650');
            return;
          }
          setError(null);
          setDays('');
          if (!expiries.some((x) => same(x, n / 365)))
            onChange([...expiries, n / 365].sort((a, b) => a - b));
        }}
      >
        <input
          aria-label="Custom expiry in days"
          placeholder="days"
          value={days}
          onChange={(e) => setDays(e.target.value)}
          className="tabular w-16 rounded border border-rule bg-panel px-2 py-0.5 text-sm"
        />
        <button type="submit" className="text-sm text-teal">
          Add
        </button>
        {error && <span className="text-xs text-stressed">{error}</span>}
      </form>
    </div>
  );
});
