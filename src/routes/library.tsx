import { useQuery } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { Link } from 'react-router';
import { newScenario } from '../engine/scenario-defaults';
import { localScenariosQuery, useDeleteScenario, useSaveScenario } from '../store/hooks';

const today = () => new Date().toISOString().slice(0, 10);

export function LibraryPage() {
  const scenarios = useQuery(localScenariosQuery);
  const save = useSaveScenario();
  const remove = useDeleteScenario();
  const [name, setName] = useState('');
  const [error, setError] = useState<string | null>(null);

  const create = async (e: FormEvent) => {
    e.preventDefault();
    const trimmed = name.trim();
    if (!trimmed) {
      setError('Give the scenario a name.');
      return;
    }
    setError(null);
    try {
      await save.mutateAsync(newScenario(crypto.randomUUID(), trimmed, today()));
      setName('');
    } catch (err) {
      setError((err as Error).message);
    }
  };

  return (
    <section aria-labelledby="library-title" className="space-y-6">
      <h1 id="library-title" className="text-2xl font-semibold">
        Library
      </h1>
      <form onSubmit={create} className="flex flex-wrap items-end gap-3">
        <label className="flex flex-col gap-1 text-sm">
          <span className="text-muted">New scenario</span>
          <input
            value={name}
            onChange={(e) => setName(e.target.value)}
            placeholder="e.g. Weekly crash ladder"
            className="w-72 rounded-md border border-rule bg-panel px-3 py-1.5 text-[15px]"
            aria-invalid={error !== null}
            aria-describedby={error ? 'new-scenario-error' : undefined}
          />
        </label>
        <button
          type="submit"
          disabled={save.isPending}
          className="rounded-md bg-teal px-4 py-1.5 font-semibold text-paper disabled:opacity-60"
        >
          Create
        </button>
        {error && (
          <p id="new-scenario-error" role="alert" className="text-sm text-stressed">
            {error}
          </p>
        )}
      </form>

      {scenarios.isPending ? (
        <p className="text-muted">Loading scenarios…</p>
      ) : scenarios.isError ? (
        <p role="alert" className="text-stressed">
          The local database could not be read: {scenarios.error.message}
        </p>
      ) : scenarios.data.length === 0 ? (
        <p className="text-muted">
          No scenarios on this device yet. Create one above, or open Sketch.
        </p>
      ) : (
        <table className="tabular w-full max-w-3xl text-left text-[15px]">
          <thead className="border-b border-rule text-sm text-muted">
            <tr>
              <th className="py-2 font-normal">Scenario</th>
              <th className="py-2 font-normal">Model</th>
              <th className="py-2 font-normal">Sync</th>
              <th className="py-2 font-normal">Edited</th>
              <th className="py-2" />
            </tr>
          </thead>
          <tbody>
            {scenarios.data.map((s) => (
              <tr key={s.id} className="border-b border-rule/60" data-testid="scenario-row">
                <td className="py-2">
                  <Link
                    className="text-teal underline-offset-2 hover:underline"
                    to={`/?scenario=${s.id}`}
                  >
                    {s.name}
                  </Link>
                </td>
                <td className="py-2">{s.document.model.kind}</td>
                <td className="py-2">{s.syncState}</td>
                <td className="py-2 text-muted">{new Date(s.updatedAt).toLocaleString()}</td>
                <td className="py-2 text-right">
                  <button
                    type="button"
                    className="text-sm text-muted hover:text-stressed"
                    onClick={() => {
                      if (confirm(`Delete "${s.name}" from this device?`)) remove.mutate(s.id);
                    }}
                  >
                    Delete
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </section>
  );
}
