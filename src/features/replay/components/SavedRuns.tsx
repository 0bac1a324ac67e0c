/** The replay runs saved in a scenario, each with Open and Replay, and the last check's verdict. */
import {
  type ReplayCheck,
  type SavedReplayRun,
  runRequests,
  runtimeName,
} from '../../../engine/replay';
import { hedgeName } from './ReplayStats';
import { formatDateTime } from '../../../components/format';

export function SavedRuns({
  runs,
  busy,
  check,
  onOpen,
  onReplay,
}: {
  runs: SavedReplayRun[];
  busy: boolean;
  check: { id: string; result: ReplayCheck } | null;
  onOpen: (run: SavedReplayRun) => void;
  onReplay: (run: SavedReplayRun) => void;
}) {
  if (runs.length === 0)
    return (
      <p className="text-sm text-muted">
        No replay runs saved in this scenario yet. Save one to replay it later, bit for bit.
      </p>
    );
  return (
    <ul className="space-y-2" data-testid="saved-runs">
      {runs.map((run) => (
        <li key={run.id} className="rounded border border-rule bg-panel px-3 py-2 text-sm">
          <div className="flex flex-wrap items-baseline gap-x-3">
            <span className="font-semibold">{formatDateTime(run.savedAt)}</span>
            <span>
              {run.request.position.length} leg{run.request.position.length > 1 ? 's' : ''} ·{' '}
              {runRequests(run).map(hedgeName).join(' vs ')} · {run.request.paths.toLocaleString()}{' '}
              paths · seed {run.seed} · engine {run.engineVersion}
              {run.runtime ? ` · ${runtimeName(run.runtime)}` : ''}
            </span>
            <span className="ml-auto flex gap-3">
              <button type="button" className="text-teal" onClick={() => onOpen(run)}>
                Open
              </button>
              <button
                type="button"
                className="font-semibold text-teal disabled:opacity-50"
                disabled={busy}
                onClick={() => onReplay(run)}
              >
                Replay
              </button>
            </span>
          </div>
          {check?.id === run.id && (
            <p
              data-testid="replay-check"
              data-matches={check.result.matches ? 'yes' : 'no'}
              className={check.result.matches ? 'text-teal' : 'text-stressed'}
            >
              {check.result.matches ? '✓ ' : '✗ '}
              {check.result.message}
            </p>
          )}
        </li>
      ))}
    </ul>
  );
}
