/**
 * Runs hedge replays on the worker pool for the Replay page: from the cache when the same
 * requests ran before, never from the cache when a saved run is being checked.
 */
import { useCallback, useRef, useState } from 'react';
import type { ReplayRequest, ReplayResult, PnlHistogram } from '../../../engine/replay';
import { appDb } from '../../../store/db';
import { cacheKey, getCached, putCached } from '../../../store/result-cache';
import { CancelledError } from '../../../workers/cancellation';
import { runReplays } from '../../../workers/replay-pool';

export interface ReplayView {
  requests: ReplayRequest[];
  results: ReplayResult[];
  /** one histogram per hedge, on shared bins */
  histograms: PnlHistogram[];
  fromCache: boolean;
  workers: number;
}

export function useReplayRun() {
  const [progress, setProgress] = useState<number | null>(null);
  const [view, setView] = useState<ReplayView | null>(null);
  const [error, setError] = useState<string | null>(null);
  const current = useRef<AbortController | null>(null);

  const start = useCallback(
    async (requests: ReplayRequest[], fresh = false): Promise<ReplayView | null> => {
      setError(null);
      const key = await cacheKey('replay', requests);
      if (!fresh) {
        const cached = await getCached<ReplayView>(appDb(), key);
        if (cached) {
          const v = { ...cached, fromCache: true };
          setView(v);
          return v;
        }
      }
      setProgress(0);
      const controller = new AbortController();
      current.current = controller;
      const job = runReplays(requests, setProgress, controller.signal);
      try {
        const outcome = await job.result;
        const result: ReplayView = {
          requests,
          results: outcome.results,
          histograms: outcome.histograms,
          fromCache: false,
          workers: outcome.workers,
        };
        setView(result);
        await putCached(appDb(), key, 'replay', result, JSON.stringify(result).length);
        return result;
      } catch (e) {
        setError(
          e instanceof CancelledError
            ? 'Cancelled: nothing was kept.'
            : `The replay failed: ${(e as Error).message}`,
        );
        return null;
      } finally {
        setProgress(null);
        current.current = null;
      }
    },
    [],
  );

  const cancel = useCallback(() => current.current?.abort(), []);
  return { start, cancel, progress, view, error };
}
