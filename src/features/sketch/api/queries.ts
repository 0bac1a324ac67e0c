/** The Sketch feature's query keys and options: smiles, Greeks and sensitivities in the worker. */
import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import type { Market, Model, OptionSpec } from '../../../engine/core';
import { engineWorker } from '../../../workers/engine-client';
import { latestWins } from '../../../workers/latest-wins';
import type { SensitivityRequest, SmileRequest } from '../../../workers/engine-api';

export const sketchKeys = {
  smiles: (request: SmileRequest | null) => ['engine', 'smiles', request] as const,
  greeks: (market: Market | null, model: Model | null, options: OptionSpec[] | null) =>
    ['engine', 'price', market, model, options] as const,
  sensitivities: (request: Partial<SensitivityRequest> | null) =>
    ['engine', 'sensitivities', request] as const,
};

// engine answers depend on their inputs only: never stale, dropped a minute after last use
const ENGINE_QUERY = { placeholderData: keepPreviousData, staleTime: Infinity, gcTime: 60_000 };

// a slider drag asks for many smiles: those it has moved past are never computed
const smileChannel = latestWins((request: SmileRequest) => engineWorker().smiles(request));

export const smilesQuery = (request: SmileRequest | null) =>
  queryOptions({
    queryKey: sketchKeys.smiles(request),
    queryFn: ({ signal }) => smileChannel(request!, signal),
    enabled: request !== null,
    ...ENGINE_QUERY,
  });

export const greeksQuery = (
  market: Market | null,
  model: Model | null,
  options: OptionSpec[] | null,
) =>
  queryOptions({
    queryKey: sketchKeys.greeks(market, model, options),
    queryFn: () => engineWorker().price({ market: market!, model: model!, options: options! }),
    enabled: market !== null && model !== null && options !== null,
    ...ENGINE_QUERY,
  });

export const sensitivitiesQuery = (request: SensitivityRequest | null) =>
  queryOptions({
    queryKey: sketchKeys.sensitivities(request),
    queryFn: () => engineWorker().sensitivities(request!),
    enabled: request !== null,
    ...ENGINE_QUERY,
  });
