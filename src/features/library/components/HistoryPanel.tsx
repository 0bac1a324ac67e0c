/** A scenario's revisions on the service: who and when; open one, or restore it as a new edit. */
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { revisionsQuery } from '../api/queries';
import type { ScenarioDocument } from '../../../engine/core';
import { formatDateTime } from '../../../components/format';

export function HistoryPanel({
  scenarioId,
  canWrite,
  onRestore,
}: {
  scenarioId: string;
  canWrite: boolean;
  onRestore: (doc: ScenarioDocument, revision: number) => void;
}) {
  const q = useQuery(revisionsQuery(scenarioId));
  const [open, setOpen] = useState<number | null>(null);
  if (q.isPending) return <p className="text-sm text-muted">Loading the history…</p>;
  if (q.isError)
    return (
      <p className="text-sm text-stressed">The history cannot be read now: {q.error.message}</p>
    );
  return (
    <div className="space-y-2 rounded-md border border-rule bg-panel p-3" data-testid="history">
      <ol className="space-y-1 text-sm">
        {q.data.revisions.map((r) => (
          <li key={r.revision} className="flex flex-wrap items-baseline gap-3">
            <span className="tabular font-semibold">r{r.revision}</span>
            <span>{r.deleted ? 'deleted' : ((r.document as ScenarioDocument).name ?? '')}</span>
            <span className="text-muted">
              {r.author ?? 'someone'} · {formatDateTime(r.createdAt)}
            </span>
            {!r.deleted && (
              <>
                <button
                  type="button"
                  className="text-teal"
                  onClick={() => setOpen(open === r.revision ? null : r.revision)}
                >
                  {open === r.revision ? 'Close' : 'Open'}
                </button>
                {canWrite && r.revision !== q.data.revisions[0].revision && (
                  <button
                    type="button"
                    className="text-teal"
                    onClick={() => onRestore(r.document as ScenarioDocument, r.revision)}
                  >
                    Restore as new
                  </button>
                )}
              </>
            )}
          </li>
        ))}
      </ol>
      {open !== null && (
        <pre className="max-h-80 overflow-auto rounded bg-paper p-2 text-xs">
          {JSON.stringify(q.data.revisions.find((r) => r.revision === open)?.document, null, 2)}
        </pre>
      )}
    </div>
  );
}
