import type { ReactNode } from 'react';
import type { StoredScenario } from '../store/db';

/** Picks one of the scenarios on this device. */
export function ScenarioSelect({
  label,
  scenarios,
  value,
  onChange,
  children,
}: {
  label: string;
  scenarios: StoredScenario[];
  value: string;
  onChange: (id: string) => void;
  children?: ReactNode;
}) {
  return (
    <label className="flex flex-col gap-1 text-sm">
      <span className="text-xs font-semibold uppercase tracking-wide text-muted">{label}</span>
      <select
        value={value}
        onChange={(e) => onChange(e.target.value)}
        className="rounded border border-rule bg-panel px-2 py-1.5"
      >
        {scenarios.map((s) => (
          <option key={s.id} value={s.id}>
            {s.name}
          </option>
        ))}
      </select>
      {children}
    </label>
  );
}
