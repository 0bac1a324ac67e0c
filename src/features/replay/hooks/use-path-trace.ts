/** One path of the last replay, followed step by step in the tracer worker, for each hedge. */
import { useCallback, useState } from 'react';
import type { PathTrace, ReplayRequest } from '../../../engine/replay';
import { tracePathInWorker } from '../../../workers/replay-pool';

export function usePathTrace(requests: ReplayRequest[]) {
  const [traces, setTraces] = useState<PathTrace[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const paths = requests[0].paths;

  const trace = useCallback(
    (text: string) => {
      const p = Number(text);
      if (!Number.isInteger(p) || p < 0 || p >= paths)
        return setError(`path must be a whole number from 0 to ${paths - 1}`);
      setError(null);
      setBusy(true);
      Promise.all(requests.map((r) => tracePathInWorker(r, p)))
        .then(setTraces, (e: Error) => setError(`could not follow the path: ${e.message}`))
        .finally(() => setBusy(false));
    },
    [requests, paths],
  );
  return { trace, traces, error, busy, paths };
}
