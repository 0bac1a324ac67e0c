/** The scenario a tool page runs on (the chosen one, else the newest) and its stressed inputs. */
import { useQuery } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { applyStress } from '../engine/core';
import { localScenariosQuery } from './hooks';

export function useScenarioSource() {
  const scenarios = useQuery(localScenariosQuery);
  const [sourceId, setSourceId] = useState<string | null>(null);
  const source = scenarios.data?.find((s) => s.id === sourceId) ?? scenarios.data?.[0];
  const stressed = useMemo(
    () =>
      source
        ? applyStress(source.document.market, source.document.model, source.document.stress ?? {})
        : null,
    [source],
  );
  return { scenarios, source, stressed, setSourceId };
}
