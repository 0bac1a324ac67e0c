import { useState } from 'react';
import type { LocalBook, StoredScenario } from '../../../store/db';

interface Props {
  sets: LocalBook[];
  current: LocalBook | undefined;
  scenarios: StoredScenario[];
  onPick: (id: string) => void;
  onCreate: (name: string) => Promise<void>;
  onMembers: (scenarioIds: string[]) => void;
  onBase: (id: string) => void;
}

/** Pick or create a local scenario set, choose its scenarios and its base. */
export function BookPanel({
  sets,
  current,
  scenarios,
  onPick,
  onCreate,
  onMembers,
  onBase,
}: Props) {
  const [name, setName] = useState('');
  const [error, setError] = useState<string | null>(null);
  return (
    <div className="space-y-3">
      <label className="flex flex-col gap-1 text-sm">
        <span className="text-xs font-semibold uppercase tracking-wide text-muted">
          Scenario set
        </span>
        <select
          aria-label="Scenario set"
          value={current?.id ?? ''}
          onChange={(e) => onPick(e.target.value)}
          className="rounded border border-rule bg-panel px-2 py-1.5"
        >
          {sets.length === 0 && <option value="">No sets yet</option>}
          {sets.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </select>
      </label>
      <form
        className="flex gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          onCreate(name)
            .then(() => {
              setName('');
              setError(null);
            })
            .catch((err: Error) => setError(err.message));
        }}
      >
        <input
          aria-label="New set name"
          value={name}
          onChange={(e) => setName(e.target.value)}
          placeholder="New set, e.g. Weekly crash ladder"
          className="min-w-0 flex-1 rounded border border-rule bg-panel px-2 py-1 text-sm"
        />
        <button
          type="submit"
          className="rounded bg-teal px-3 py-1 text-sm font-semibold text-paper"
        >
          Create
        </button>
      </form>
      {error && (
        <p role="alert" className="text-xs text-stressed">
          {error}
        </p>
      )}
      {current && (
        <fieldset className="space-y-1 border-t border-rule pt-2">
          <legend className="text-xs font-semibold uppercase tracking-wide text-muted">
            Scenarios in the set
          </legend>
          {scenarios.length === 0 && (
            <p className="text-sm text-muted">
              No scenarios on this device yet: open Sketch first.
            </p>
          )}
          {scenarios.map((s) => {
            const on = current.scenarioIds.includes(s.id);
            return (
              <div key={s.id} className="flex items-center justify-between gap-2 text-sm">
                <label className="flex items-center gap-2">
                  <input
                    type="checkbox"
                    checked={on}
                    onChange={() =>
                      onMembers(
                        on
                          ? current.scenarioIds.filter((x) => x !== s.id)
                          : [...current.scenarioIds, s.id],
                      )
                    }
                  />
                  {s.name}
                </label>
                {on && (
                  <label className="flex items-center gap-1 text-xs text-muted">
                    <input
                      type="radio"
                      name="base"
                      checked={(current.baseScenarioId ?? current.scenarioIds[0]) === s.id}
                      onChange={() => onBase(s.id)}
                    />
                    base
                  </label>
                )}
              </div>
            );
          })}
          <p className="text-xs text-muted">
            The base is valued with its unstressed parameters; every scenario with its stress.
          </p>
        </fieldset>
      )}
    </div>
  );
}
