/** One group of the Library (a set, or this device only): its scenarios with their actions. */
import { useState } from 'react';
import { Link } from 'react-router';
import { modelShortLabel, type ScenarioDocument } from '../../../engine/core';
import type { RemoteSet, StoredScenario } from '../../../store/db';
import { ConflictPanel } from './ConflictPanel';
import { HistoryPanel } from './HistoryPanel';
import { SyncBadge } from '../../../components/SyncBadge';
import { formatDateTime } from '../../../components/format';

export interface RowActions {
  remove: (s: StoredScenario) => void;
  putInSet: (s: StoredScenario, setId: string) => void;
  fork: (s: StoredScenario) => void;
  moveVariants: (s: StoredScenario) => void;
  resolve: (s: StoredScenario, how: 'mine' | 'theirs' | 'both') => void;
  exportFile: (s: StoredScenario) => void;
  restore: (s: StoredScenario, doc: ScenarioDocument) => void;
}

export function ScenarioGroup({
  title,
  set,
  scenarios,
  writableSets,
  signedIn,
  actions,
}: {
  title: string;
  set: RemoteSet | null;
  scenarios: StoredScenario[];
  writableSets: RemoteSet[];
  signedIn: boolean;
  actions: RowActions;
}) {
  const [open, setOpen] = useState<{ id: string; what: 'history' | 'conflict' } | null>(null);
  const canWrite = set ? set.canWrite : true;
  const canDelete = set ? set.canManage : true;
  return (
    <section className="space-y-2" data-testid="scenario-group" data-set={set?.id ?? 'device'}>
      <h2 className="text-lg font-semibold">
        {title}
        {set && !set.canWrite && (
          <span className="ml-2 text-sm font-normal text-muted">read only: fork to edit</span>
        )}
      </h2>
      {scenarios.length === 0 ? (
        <p className="text-sm text-muted">No scenarios here{set ? ' yet' : ''}.</p>
      ) : (
        <table className="tabular w-full text-left text-[15px]">
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
            {scenarios.map((s) => (
              <Row
                key={s.id}
                s={s}
                open={open?.id === s.id ? open.what : null}
                setOpen={(what) => setOpen(what ? { id: s.id, what } : null)}
                canWrite={canWrite}
                canDelete={canDelete}
                writableSets={writableSets}
                signedIn={signedIn}
                actions={actions}
              />
            ))}
          </tbody>
        </table>
      )}
    </section>
  );
}

function Row({
  s,
  open,
  setOpen,
  canWrite,
  canDelete,
  writableSets,
  signedIn,
  actions,
}: {
  s: StoredScenario;
  open: 'history' | 'conflict' | null;
  setOpen: (what: 'history' | 'conflict' | null) => void;
  canWrite: boolean;
  canDelete: boolean;
  writableSets: RemoteSet[];
  signedIn: boolean;
  actions: RowActions;
}) {
  const link = 'text-sm text-teal';
  return (
    <>
      <tr className="border-b border-rule/60" data-testid="scenario-row" data-id={s.id}>
        <td className="py-2">
          <Link className="text-teal underline-offset-2 hover:underline" to={`/?scenario=${s.id}`}>
            {s.name}
          </Link>
        </td>
        <td className="py-2">{modelShortLabel(s.document.model.kind)}</td>
        <td className="py-2">
          <SyncBadge s={s} />
        </td>
        <td className="py-2 text-sm text-muted">
          {formatDateTime(s.updatedAt)}
          {s.updatedBy && ` · ${s.updatedBy}`}
        </td>
        <td className="space-x-3 py-2 text-right">
          {s.syncState === 'conflict' && (
            <button
              type="button"
              className="text-sm font-semibold text-stressed"
              onClick={() => setOpen(open === 'conflict' ? null : 'conflict')}
            >
              Resolve
            </button>
          )}
          {signedIn && s.revision > 0 && (
            <button
              type="button"
              className={link}
              onClick={() => setOpen(open === 'history' ? null : 'history')}
            >
              History
            </button>
          )}
          {s.setId === null && writableSets.length > 0 && (
            <select
              aria-label={`Put ${s.name} in a set`}
              value=""
              onChange={(e) => e.target.value && actions.putInSet(s, e.target.value)}
              className="rounded border border-rule bg-panel px-1 py-0.5 text-sm"
            >
              <option value="">share in set…</option>
              {writableSets.map((w) => (
                <option key={w.id} value={w.id}>
                  {w.name}
                </option>
              ))}
            </select>
          )}
          {s.setId !== null && (
            <button type="button" className={link} onClick={() => actions.fork(s)}>
              Fork
            </button>
          )}
          {(s.document.model.events?.length ?? 0) > 0 && (
            <button
              type="button"
              className={link}
              title="Copies with every scheduled move 1.5× and 0.5× as large, in the same set"
              onClick={() => actions.moveVariants(s)}
            >
              Move variants
            </button>
          )}
          <button type="button" className={link} onClick={() => actions.exportFile(s)}>
            Export
          </button>
          {canDelete && (
            <button
              type="button"
              className="text-sm text-muted hover:text-stressed"
              onClick={() => {
                if (
                  confirm(
                    `Delete "${s.name}"${s.setId ? ' for everyone in its set' : ' from this device'}?`,
                  )
                )
                  actions.remove(s);
              }}
            >
              Delete
            </button>
          )}
        </td>
      </tr>
      {open && (
        <tr>
          <td colSpan={5} className="py-2">
            {open === 'conflict' && s.conflict ? (
              <ConflictPanel
                scenario={s}
                onResolve={(how) => {
                  actions.resolve(s, how);
                  setOpen(null);
                }}
              />
            ) : (
              <HistoryPanel
                scenarioId={s.id}
                canWrite={canWrite}
                onRestore={(doc) => actions.restore(s, doc)}
              />
            )}
          </td>
        </tr>
      )}
      {s.syncError && (
        <tr>
          <td colSpan={5} className="pb-2 text-sm text-stressed">
            The service refused this scenario: {s.syncError}. Fix it in Sketch and it is sent again.
          </td>
        </tr>
      )}
    </>
  );
}
