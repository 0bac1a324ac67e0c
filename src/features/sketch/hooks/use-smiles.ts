/** Smiles and Greeks for the current scenario, computed in the engine worker. */
import { useQuery } from '@tanstack/react-query';
import type { ScenarioDocument, Market, Model, OptionSpec } from '../../../engine/core';
import type { SmileRequest } from '../../../workers/engine-api';
import { greeksQuery, sensitivitiesQuery, smilesQuery } from '../api/queries';

export function smileRequest(doc: ScenarioDocument, densityExpiry: number): SmileRequest {
  return {
    market: doc.market,
    model: doc.model,
    stress: doc.stress,
    expiries: doc.grid.expiries,
    moneyness: doc.grid.moneyness,
    ...(doc.grid.strikeSpacing ? { strikeSpacing: doc.grid.strikeSpacing } : {}),
    densityExpiry,
    ...(typeof doc.eventBaseVol === 'number' ? { eventBaseVol: doc.eventBaseVol } : {}),
  };
}

export function useSmiles(request: SmileRequest | null) {
  return useQuery(smilesQuery(request));
}

export function useGreeks(
  market: Market | null,
  model: Model | null,
  options: OptionSpec[] | null,
) {
  return useQuery(greeksQuery(market, model, options));
}

export function useSensitivities(
  market: Market | null,
  model: Model | null,
  expiry: number | null,
  moneyness: number[] | null,
) {
  const ready = market !== null && model !== null && expiry !== null && moneyness !== null;
  return useQuery(sensitivitiesQuery(ready ? { market, model, expiry, moneyness } : null));
}
