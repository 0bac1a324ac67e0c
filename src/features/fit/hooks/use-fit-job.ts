/** One calibration job of the Fit page: a fit or the jumps verdict, with progress and cancel. */
import { useCallback, useRef, useState } from 'react';
import { expiryYears, parametersOf, type Market, type Model } from '../../../engine/core';
import {
  anchorFor,
  completeGuess,
  entryModel,
  type FitHistoryEntry,
  type CalibrationResult,
  type JumpsVerdict,
  type VolQuote,
} from '../../../engine/fit';
import { CancelledError, runFit } from '../../../workers/fit-client';
import type { FitSettings } from '../fit-settings';

export type FitOutcome =
  { kind: 'fit'; result: CalibrationResult } | { kind: 'verdict'; verdict: JumpsVerdict };

export interface FitInputs {
  market: Market;
  /** the scenario's model, whose values start the fit where the kinds share parameters */
  startFrom: Model;
  quotes: VolQuote[];
  settings: FitSettings;
  /** the source scenario's valuation date, for the comparison's move date */
  valuationDate: string;
  /** the source scenario's fit history, for the anchor */
  history: FitHistoryEntry[];
}

export function useFitJob() {
  const [progress, setProgress] = useState<number | null>(null);
  const [outcome, setOutcome] = useState<FitOutcome | null>(null);
  const [error, setError] = useState<string | null>(null);
  const current = useRef<AbortController | null>(null);

  const start = useCallback(async (what: FitOutcome['kind'], inputs: FitInputs) => {
    const { market, startFrom, quotes, settings, valuationDate, history } = inputs;
    const previous = anchorFor(history, settings.kind, valuationDate);
    const anchor =
      settings.anchorWeight > 0 && previous
        ? {
            model: entryModel(previous, completeGuess(settings.kind, startFrom)),
            weight: settings.anchorWeight,
          }
        : undefined;
    const eventCount = startFrom.events?.length ?? 0;
    const moveTime = settings.moveDate ? expiryYears(settings.moveDate, valuationDate) : null;
    setError(null);
    setOutcome(null);
    setProgress(0);
    const controller = new AbortController();
    current.current = controller;
    const base = {
      market,
      quotes,
      fixed: settings.fixed.filter((f) => (parametersOf(settings.kind) as string[]).includes(f)),
      weights: settings.weights,
      ...(settings.fitEventSizes && eventCount > 0
        ? { fitEventSizes: Array.from({ length: eventCount }, (_, i) => i) }
        : {}),
    };
    if (typeof moveTime === 'number' && !(moveTime > 0)) {
      setError('The comparison move must be dated after the valuation date.');
      setProgress(null);
      return;
    }
    try {
      if (what === 'fit') {
        const model = completeGuess(settings.kind, startFrom);
        const result = await runFit(
          (api, p) => api.calibrate({ ...base, model, ...(anchor ? { anchor } : {}) }, p),
          setProgress,
          controller.signal,
        );
        setOutcome({ kind: 'fit', result });
      } else {
        const hestonGuess = completeGuess('heston', startFrom) as Extract<
          Model,
          { kind: 'heston' }
        >;
        const verdict = await runFit(
          (api, p) =>
            api.verdict(
              { ...base, hestonGuess, ...(typeof moveTime === 'number' ? { moveTime } : {}) },
              p,
            ),
          setProgress,
          controller.signal,
        );
        setOutcome({ kind: 'verdict', verdict });
      }
    } catch (e) {
      setError(
        e instanceof CancelledError
          ? 'Cancelled.'
          : `The calibration failed: ${(e as Error).message}`,
      );
    } finally {
      setProgress(null);
      current.current = null;
    }
  }, []);

  const cancel = useCallback(() => current.current?.abort(), []);
  const fitted =
    outcome?.kind === 'fit'
      ? outcome.result
      : outcome?.kind === 'verdict'
        ? outcome.verdict.bates
        : null;
  return { start, cancel, progress, outcome, fitted, error };
}
