/** Scenario sets on the service: personal ones and the desks'; new, rename, delete. */
import { useQuery } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import type { DeskMembership } from '../../../api/session';
import { setsQuery } from '../api/queries';
import { useSetActions } from '../hooks/use-set-actions';

export function SetsPanel({ desks }: { desks: DeskMembership[] }) {
  const sets = useQuery(setsQuery);
  const actions = useSetActions();
  const { message } = actions;
  const [name, setName] = useState('');
  const [owner, setOwner] = useState('');
  const leadOf = desks.filter((d) => d.role === 'lead');
  const create = (e: FormEvent) => {
    e.preventDefault();
    void actions.create(name, owner || undefined).then((ok) => ok && setName(''));
  };
  return (
    <div className="space-y-3" data-testid="sets-panel">
      <h2 className="text-lg font-semibold">Scenario sets on the service</h2>
      {sets.isPending && <p className="text-sm text-muted">Loading sets…</p>}
      {sets.isError && (
        <p className="text-sm text-muted">Sets show when the service can be reached.</p>
      )}
      <ul className="space-y-1 text-sm">
        {sets.data?.sets.map((s) => (
          <li key={s.id} className="flex flex-wrap items-baseline gap-3">
            <span className="font-semibold">{s.name}</span>
            <span className="text-muted">
              {s.deskName ? `desk ${s.deskName}, you are ${s.role}` : 'personal'} · {s.scenarios}{' '}
              scenario
              {s.scenarios === 1 ? '' : 's'}
              {!s.canWrite && ' · read only'}
            </span>
            {s.canManage && (
              <>
                <button
                  type="button"
                  className="text-teal"
                  onClick={() => {
                    const n = prompt('New name for the set', s.name);
                    if (n) void actions.rename(s.id, n);
                  }}
                >
                  Rename
                </button>
                <button
                  type="button"
                  className="text-muted hover:text-stressed"
                  onClick={() => {
                    if (
                      confirm(
                        `Delete the set "${s.name}" and its ${s.scenarios} scenarios for everyone? Their history is kept.`,
                      )
                    )
                      void actions.remove(s.id);
                  }}
                >
                  Delete
                </button>
              </>
            )}
          </li>
        ))}
      </ul>
      <form
        onSubmit={create}
        className="flex flex-wrap items-end gap-2 text-sm"
        aria-label="new set"
      >
        <label className="flex flex-col gap-1">
          <span className="text-muted">New set</span>
          <input
            value={name}
            onChange={(e) => setName(e.target.value)}
            className="w-56 rounded-md border border-rule bg-panel px-2 py-1"
            aria-label="New set name"
          />
        </label>
        <select
          value={owner}
          onChange={(e) => setOwner(e.target.value)}
          aria-label="New set owner"
          className="rounded-md border border-rule bg-panel px-2 py-1"
        >
          <option value="">personal</option>
          {leadOf.map((d) => (
            <option key={d.id} value={d.id}>
              shared with {d.name}
            </option>
          ))}
        </select>
        <button type="submit" className="rounded-md border border-teal px-3 py-1 text-teal">
          Create set
        </button>
      </form>
      {message && (
        <p role="alert" className="text-sm text-stressed">
          {message}
        </p>
      )}
    </div>
  );
}
