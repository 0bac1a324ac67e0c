/** The demo fit history: invented chains over the last days, fitted in a calibration worker. */
import { useCallback, useRef, useState } from 'react';
import type { ScenarioDocument } from '../../../engine/core';
import type { FitHistoryEntry } from '../../../engine/fit';
import { runFit } from '../../../workers/fit-client';

export function useDemoHistory() {
  const [progress, setProgress] = useState<number | null>(null);
  const current = useRef<AbortController | null>(null);
  const run = useCallback(async (doc: ScenarioDocument): Promise<FitHistoryEntry[] | null> => {
    const controller = new AbortController();
    current.current = controller;
    setProgress(0);
    try {
      return await runFit(
        (api, p) =>
          api.demoHistory(
            { market: doc.market, model: doc.model, valuationDate: doc.valuationDate, days: 5 },
            p,
          ),
        setProgress,
        controller.signal,
      );
    } catch {
      return null;
    } finally {
      setProgress(null);
      current.current = null;
    }
  }, []);
  const cancel = useCallback(() => current.current?.abort(), []);
  return { run, cancel, progress };
}
