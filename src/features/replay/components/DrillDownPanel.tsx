/** Picks a path of the last replay (the worst by default) and follows it in a worker. */
import { useEffect, useState } from 'react';
import type { ReplayRequest } from '../../../engine/replay';
import { usePathTrace } from '../hooks/use-path-trace';
import { PathDrillDown } from './PathDrillDown';
import { legendName } from './ReplayCharts';

export function DrillDownPanel({
  requests,
  worstPaths,
}: {
  requests: ReplayRequest[];
  worstPaths: number[];
}) {
  const [path, setPath] = useState(String(worstPaths[0]));
  const { trace: show, traces, error, busy } = usePathTrace(requests);
  useEffect(() => {
    setPath(String(worstPaths[0]));
    show(String(worstPaths[0]));
    // a new replay: start from its worst path
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [requests]);

  return (
    <section className="space-y-2">
      <h2 className="text-lg font-semibold">One path</h2>
      <form
        className="flex flex-wrap items-center gap-3 text-sm"
        onSubmit={(e) => {
          e.preventDefault();
          show(path);
        }}
      >
        <label className="flex items-center gap-2">
          Path
          <input
            aria-label="Path number"
            value={path}
            onChange={(e) => setPath(e.target.value)}
            className="tabular w-24 rounded border border-rule bg-panel px-2 py-1 text-right"
          />
        </label>
        <button type="submit" className="text-teal" disabled={busy}>
          Show
        </button>
        {worstPaths.map((w, k) => (
          <button
            key={k}
            type="button"
            className="text-teal"
            onClick={() => {
              setPath(String(w));
              show(String(w));
            }}
          >
            worst path, {legendName(requests[k])} ({w})
          </button>
        ))}
        {busy && <span className="text-muted">following the path…</span>}
      </form>
      {error && (
        <p role="alert" className="text-sm text-stressed">
          {error}
        </p>
      )}
      {traces && <PathDrillDown traces={traces} requests={requests} />}
    </section>
  );
}
