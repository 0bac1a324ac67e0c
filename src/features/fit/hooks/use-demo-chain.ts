/** The invented demo chain for a scenario, priced by its model in the engine worker. */
import { useCallback } from 'react';
import type { ScenarioDocument } from '../../../engine/core';
import { engineWorker } from '../../../workers/engine-client';

export function useDemoChain(source: ScenarioDocument | undefined) {
  return useCallback(async () => {
    if (!source) return '';
    return engineWorker().demoChain({
      market: source.market,
      model: source.model,
      valuationDate: source.valuationDate,
    });
  }, [source]);
}
