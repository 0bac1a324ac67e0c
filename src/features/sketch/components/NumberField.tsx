import { useEffect, useId, useState } from 'react';

interface Props {
  label: string;
  value: number;
  onChange: (value: number) => void;
  step?: number;
  error?: string;
  hint?: string;
  /** shown after the input, e.g. "%" */
  unit?: string;
  /** display = value × scale (e.g. 100 for percent) */
  scale?: number;
}

/** A number input that keeps what the user is typing and reports bad entries next to it. */
export function NumberField({
  label,
  value,
  onChange,
  step = 0.01,
  error,
  hint,
  unit,
  scale = 1,
}: Props) {
  const id = useId();
  const [text, setText] = useState(() => formatForInput(value * scale));
  const [local, setLocal] = useState<string | null>(null);
  useEffect(() => {
    // follow outside changes unless the user is mid-edit on a value that still parses the same
    setText((t) => (Number(t) === value * scale ? t : formatForInput(value * scale)));
  }, [value, scale]);
  const message = local ?? error;
  return (
    <label
      htmlFor={id}
      className="grid grid-cols-[1fr_7.5rem] items-center gap-x-2 gap-y-0.5 text-sm"
    >
      <span className="text-ink/85">{label}</span>
      <span className="flex items-center gap-1">
        <input
          id={id}
          inputMode="decimal"
          value={text}
          step={step}
          aria-invalid={message ? true : undefined}
          aria-describedby={message ? `${id}-msg` : undefined}
          className={`tabular w-full rounded border bg-panel px-2 py-1 text-right ${message ? 'border-stressed' : 'border-rule'}`}
          onChange={(e) => {
            const raw = e.target.value;
            setText(raw);
            const n = Number(raw.replace(',', '.'));
            if (raw.trim() === '' || !Number.isFinite(n)) {
              setLocal('enter a number');
              return;
            }
            setLocal(null);
            onChange(n / scale);
          }}
          onKeyDown={(e) => {
            if (e.key !== 'ArrowUp' && e.key !== 'ArrowDown') return;
            e.preventDefault();
            const n = Number(text) + (e.key === 'ArrowUp' ? step : -step);
            const rounded = Number(n.toPrecision(12));
            setText(formatForInput(rounded));
            setLocal(null);
            onChange(rounded / scale);
          }}
        />
        {unit && <span className="w-4 text-muted">{unit}</span>}
      </span>
      {(message || hint) && (
        <span
          id={`${id}-msg`}
          className={`col-span-2 text-xs ${message ? 'text-stressed' : 'text-muted'}`}
        >
          {message ?? hint}
        </span>
      )}
    </label>
  );
}

function formatForInput(v: number): string {
  return Number.isFinite(v) ? String(Number(v.toPrecision(10))) : '';
}
