/** One Monte Carlo run on the Paths page: from the cache when the same inputs ran before. */
import { useCallback, useRef, useState } from 'react';
import { forwardPrice, type Market, type Model } from '../../../engine/core';
import {
  terminalBins,
  type SimulationResult,
  type SimulationSettings,
  type HistogramSpec,
  type PathsView,
} from '../../../engine/paths';
import { appDb } from '../../../store/db';
import { cacheKey, getCached, putCached } from '../../../store/result-cache';
import { engineWorker } from '../../../workers/engine-client';
import { CancelledError } from '../../../workers/cancellation';
import { runPaths } from '../../../workers/paths-pool';

export interface PathsRunView {
  summary: SimulationResult;
  view: PathsView | null;
  histogram: number[] | null;
  spec: HistogramSpec;
  density: number[] | null;
  analytic: number[];
  fromCache: boolean;
  workers: number;
}

export function usePathsRun() {
  const [progress, setProgress] = useState<number | null>(null);
  const [lastProgress, setLastProgress] = useState(0);
  const [run, setRun] = useState<PathsRunView | null>(null);
  const [error, setError] = useState<string | null>(null);
  const current = useRef<AbortController | null>(null);

  const start = useCallback(
    async (
      market: Market,
      model: Model,
      settings: Omit<SimulationSettings, 'recordTimes' | 'histogram'>,
    ) => {
      setError(null);
      const spec = terminalBins(model, settings.horizon);
      const full: SimulationSettings = { ...settings, recordTimes: 60, histogram: spec };
      const key = await cacheKey('paths', { market, model, settings: full });
      const cached = await getCached<PathsRunView>(appDb(), key);
      if (cached) {
        setRun({ ...cached, fromCache: true });
        return;
      }
      setProgress(0);
      const controller = new AbortController();
      current.current = controller;
      const job = runPaths(
        market,
        model,
        full,
        (f) => {
          setProgress(f);
          setLastProgress(f);
        },
        controller.signal,
      );
      try {
        const out = await job.result;
        const lnF = Math.log(forwardPrice(market, settings.horizon) / market.spot);
        const centres = Array.from(
          { length: spec.bins },
          (_, i) => spec.lo + ((i + 0.5) * (spec.hi - spec.lo)) / spec.bins,
        );
        const engine = engineWorker();
        const [density, priced] = await Promise.all([
          engine.density(
            model,
            settings.horizon,
            centres.map((c) => c - lnF),
          ),
          settings.options.length
            ? engine.price({ market, model, options: settings.options })
            : Promise.resolve({ results: [] }),
        ]);
        const result: PathsRunView = {
          summary: out.summary,
          view: out.view,
          histogram: out.histogram,
          spec,
          density,
          analytic: priced.results.map((r) => r.price),
          fromCache: false,
          workers: out.workers,
        };
        setRun(result);
        const bytes = JSON.stringify(result).length;
        await putCached(appDb(), key, 'paths', result, bytes);
      } catch (e) {
        setError(
          e instanceof CancelledError
            ? 'Cancelled: nothing was kept.'
            : `The simulation failed: ${(e as Error).message}`,
        );
      } finally {
        setProgress(null);
        current.current = null;
      }
    },
    [],
  );

  const cancel = useCallback(() => current.current?.abort(), []);
  return { start, cancel, progress, lastProgress, run, error };
}
