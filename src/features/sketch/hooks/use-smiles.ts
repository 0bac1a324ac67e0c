/** Smiles and Greeks for the current scenario, computed in the engine worker. */
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import type { ScenarioDocument, Market, Model, OptionSpec } from '../../../engine/core';
import { engineWorker } from '../../../workers/engine-client';
import type { SmileRequest } from '../../../workers/engine-api';

export function smileRequest(doc: ScenarioDocument, densityExpiry: number): SmileRequest {
  return {
    market: doc.market as Market,
    model: doc.model as Model,
    stress: doc.stress,
    expiries: doc.grid.expiries,
    moneyness: doc.grid.moneyness,
    densityExpiry,
  };
}

export function useSmiles(request: SmileRequest | null) {
  return useQuery({
    queryKey: ['engine', 'smiles', request],
    queryFn: () => engineWorker().smiles(request!),
    enabled: request !== null,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
    gcTime: 60_000,
  });
}

export function useGreeks(
  market: Market | null,
  model: Model | null,
  options: OptionSpec[] | null,
) {
  return useQuery({
    queryKey: ['engine', 'price', market, model, options],
    queryFn: () => engineWorker().price({ market: market!, model: model!, options: options! }),
    enabled: market !== null && model !== null && options !== null,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
    gcTime: 60_000,
  });
}

export function useSensitivities(
  market: Market | null,
  model: Model | null,
  expiry: number | null,
  moneyness: number[] | null,
) {
  return useQuery({
    queryKey: ['engine', 'sensitivities', market, model, expiry, moneyness],
    queryFn: () =>
      engineWorker().sensitivities({
        market: market!,
        model: model!,
        expiry: expiry!,
        moneyness: moneyness!,
      }),
    enabled: market !== null && model !== null && expiry !== null && moneyness !== null,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
    gcTime: 60_000,
  });
}
