/**
 * The solve of a scenario's jumps to target vols, in a fit worker: on success the solved
 * scenario is saved as a new one and opened in Sketch.
 */
import { useCallback, useRef, useState } from 'react';
import { useNavigate } from 'react-router';
import type { ScenarioDocument } from '../../../engine/core';
import type { TargetVol } from '../../../engine/fit';
import { useSaveScenario } from '../../../store/hooks';
import { CancelledError, runFit } from '../../../workers/fit-client';

export function useTargetSolve() {
  const [error, setError] = useState<string | null>(null);
  const [progress, setProgress] = useState<number | null>(null);
  const current = useRef<AbortController | null>(null);
  const save = useSaveScenario();
  const navigate = useNavigate();

  const solve = useCallback(
    async (doc: ScenarioDocument, targets: TargetVol[], also: { rho: boolean; v0: boolean }) => {
      setError(null);
      setProgress(0);
      const controller = new AbortController();
      current.current = controller;
      try {
        const solution = await runFit(
          (api, p) =>
            api.solveTargets(
              { market: doc.market, model: doc.model, stress: doc.stress ?? {}, targets, also },
              p,
            ),
          setProgress,
          controller.signal,
        );
        const id = crypto.randomUUID();
        await save.mutateAsync({
          ...doc,
          id,
          name: `${doc.name} — solved to targets`,
          model: solution.model,
          stress: solution.stress,
          runs: [],
          targets,
          notes: `Jumps solved to ${targets.length} target vols (RMSE ${solution.fit.rmseVolPoints.toFixed(2)} vol points).`,
        });
        navigate(`/?scenario=${id}`);
      } catch (e) {
        setError(
          e instanceof CancelledError ? 'Cancelled.' : `The solve failed: ${(e as Error).message}`,
        );
      } finally {
        setProgress(null);
        current.current = null;
      }
    },
    [save, navigate],
  );

  const cancel = useCallback(() => current.current?.abort(), []);
  return { solve, cancel, progress, error, setError };
}
