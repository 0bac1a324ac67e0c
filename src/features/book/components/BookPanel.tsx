import { useState } from 'react';
import type { RemoteSet, StoredScenario } from '../../../store/db';
import type { OpenBook } from '../hooks/use-book-source';

interface Props {
  books: OpenBook[];
  current: OpenBook | undefined;
  /** the scenarios the current book may be revalued under */
  candidates: StoredScenario[];
  writableSets: RemoteSet[];
  onPick: (key: string) => void;
  onCreate: (name: string, setId: string | null) => Promise<void>;
  onMembers: (scenarioIds: string[]) => void;
  onBase: (id: string) => void;
}

const field = 'rounded border border-rule bg-panel px-2 py-1.5';
const heading = 'text-xs font-semibold uppercase tracking-wide text-muted';

/** Pick or create a book (on this device or in a desk set), choose its scenarios and its base. */
export function BookPanel({
  books,
  current,
  candidates,
  writableSets,
  onPick,
  onCreate,
  onMembers,
  onBase,
}: Props) {
  const [name, setName] = useState('');
  const [where, setWhere] = useState('');
  const [error, setError] = useState<string | null>(null);
  const device = books.filter((b) => !b.set);
  const deskSets = [...new Map(books.flatMap((b) => (b.set ? [[b.set.id, b.set]] : []))).values()];
  const locked = current ? !current.editable : false;
  return (
    <div className="space-y-3">
      <label className="flex flex-col gap-1 text-sm">
        <span className={heading}>Book</span>
        <select
          aria-label="Open book"
          value={current?.key ?? ''}
          onChange={(e) => onPick(e.target.value)}
          className={field}
        >
          {books.length === 0 && <option value="">No books yet</option>}
          {device.length > 0 && (
            <optgroup label="On this device">
              {device.map((b) => (
                <option key={b.key} value={b.key}>
                  {b.name}
                </option>
              ))}
            </optgroup>
          )}
          {deskSets.map((s) => (
            <optgroup key={s.id} label={`Desk set: ${s.name}`}>
              {books
                .filter((b) => b.set?.id === s.id)
                .map((b) => (
                  <option key={b.key} value={b.key}>
                    {b.name}
                  </option>
                ))}
            </optgroup>
          ))}
        </select>
      </label>
      <form
        className="space-y-2"
        onSubmit={(e) => {
          e.preventDefault();
          onCreate(name, where || null)
            .then(() => {
              setName('');
              setError(null);
            })
            .catch((err: Error) => setError(err.message));
        }}
      >
        <div className="flex gap-2">
          <input
            aria-label="New book name"
            value={name}
            onChange={(e) => setName(e.target.value)}
            placeholder="New book, e.g. Weekly crash ladder"
            className="min-w-0 flex-1 rounded border border-rule bg-panel px-2 py-1 text-sm"
          />
          <button
            type="submit"
            className="rounded bg-teal px-3 py-1 text-sm font-semibold text-paper"
          >
            Create
          </button>
        </div>
        {writableSets.length > 0 && (
          <label className="flex items-center gap-2 text-xs text-muted">
            <span>Keep it</span>
            <select
              aria-label="Where the new book is kept"
              value={where}
              onChange={(e) => setWhere(e.target.value)}
              className="min-w-0 flex-1 rounded border border-rule bg-panel px-1 py-0.5 text-sm text-ink"
            >
              <option value="">on this device only</option>
              {writableSets.map((s) => (
                <option key={s.id} value={s.id}>
                  in the set {s.name} (shared)
                </option>
              ))}
            </select>
          </label>
        )}
      </form>
      {error && (
        <p role="alert" className="text-xs text-stressed">
          {error}
        </p>
      )}
      {current && (
        <fieldset className="space-y-1 border-t border-rule pt-2" disabled={locked}>
          <legend className={heading}>Scenarios of the book</legend>
          {candidates.length === 0 && (
            <p className="text-sm text-muted">
              {current.set
                ? 'No scenarios in this set yet: add some from the Library.'
                : 'No scenarios on this device yet: open Sketch first.'}
            </p>
          )}
          {candidates.map((s) => {
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
