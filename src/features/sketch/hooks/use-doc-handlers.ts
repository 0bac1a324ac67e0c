/**
 * The Sketch page's edits as callbacks that keep their identity: each reads the latest document
 * through a ref, so the memoised forms beside the smiles do not re-render on a stress step.
 */
import { useCallback, useMemo, useRef } from 'react';
import type { StrikeSpacing } from '../../../engine/analytic';
import type { Model, ScenarioDocument, ScheduledMove, Stress } from '../../../engine/core';
import type { TargetVol } from '../../../engine/fit';

type ModelLists = Partial<Record<'events' | 'jumpIntensitySchedule', unknown>>;

export function useDocHandlers(
  doc: ScenarioDocument | null,
  update: (next: ScenarioDocument) => void,
) {
  const docRef = useRef(doc);
  docRef.current = doc;
  const patch = useCallback(
    (change: (d: ScenarioDocument) => ScenarioDocument) => {
      if (docRef.current) update(change(docRef.current));
    },
    [update],
  );
  return useMemo(() => {
    // an emptied list is dropped from the model rather than kept as []
    const setModel = (change: ModelLists) =>
      patch((d) => {
        const model: Record<string, unknown> = { ...d.model, ...change };
        for (const key of Object.keys(change))
          if (Array.isArray(model[key]) && (model[key] as unknown[]).length === 0)
            delete model[key];
        return { ...d, model: model as Model };
      });
    return {
      name: (name: string) => patch((d) => ({ ...d, name })),
      market: (market: ScenarioDocument['market']) => patch((d) => ({ ...d, market })),
      model: (model: Model) => patch((d) => ({ ...d, model })),
      events: (events: ScheduledMove[]) => setModel({ events }),
      schedule: (schedule: unknown) => setModel({ jumpIntensitySchedule: schedule }),
      targets: (targets: TargetVol[]) => patch((d) => ({ ...d, targets })),
      stress: (stress: Stress) => patch((d) => ({ ...d, stress })),
      expiries: (expiries: number[]) => patch((d) => ({ ...d, grid: { ...d.grid, expiries } })),
      spacing: (strikeSpacing: StrikeSpacing) =>
        patch((d) => ({ ...d, grid: { ...d.grid, strikeSpacing } })),
      eventBaseVol: (v: number | undefined) =>
        patch((d) => {
          const next: Record<string, unknown> = { ...d, eventBaseVol: v };
          if (v === undefined) delete next.eventBaseVol;
          return next as ScenarioDocument;
        }),
      getDoc: () => docRef.current as ScenarioDocument,
    };
  }, [patch]);
}
