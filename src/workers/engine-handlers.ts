/** The engine work behind each worker command, as plain functions (also used by tests). */
import { revalueSet } from '../engine/book';
import {
  priceOptions,
  smileSensitivities,
  logReturnDensity,
  smileSurface,
} from '../engine/analytic';
import { applyStress, isIdentityStress, ENGINE_VERSION } from '../engine/core';
import { demoChainCsv } from '../engine/fit';
import type {
  EngineApi,
  PriceRequest,
  PriceResponse,
  SmileRequest,
  SmileResponse,
} from './engine-api';

export function computeSmiles(req: SmileRequest): SmileResponse {
  const started = performance.now();
  const base = smileSurface(req.market, req.model, req.expiries, req.moneyness);
  let stressed = null;
  let stressIssues: SmileResponse['stressIssues'] = [];
  let stressedModel = null;
  if (!isIdentityStress(req.stress)) {
    const s = applyStress(req.market, req.model, req.stress ?? {});
    stressIssues = s.issues;
    if (s.issues.length === 0) {
      stressed = smileSurface(s.market, s.model, req.expiries, req.moneyness);
      stressedModel = s.model;
    }
  }
  let density = null;
  if (req.densityExpiry !== undefined) {
    const points = Array.from({ length: 161 }, (_, i) => -0.4 + (0.6 * i) / 160);
    density = {
      points,
      base: logReturnDensity(req.model, req.densityExpiry, points),
      stressed: stressedModel ? logReturnDensity(stressedModel, req.densityExpiry, points) : null,
    };
  }
  return {
    base,
    stressed,
    stressIssues,
    density,
    elapsedMs: performance.now() - started,
    engineVersion: ENGINE_VERSION,
  };
}

export function computePrices(req: PriceRequest): PriceResponse {
  const started = performance.now();
  const results = priceOptions(req.market, req.model, req.options);
  return { results, elapsedMs: performance.now() - started };
}

export const engineHandlers: EngineApi = {
  info: () => ({ engineVersion: ENGINE_VERSION }),
  smiles: computeSmiles,
  price: computePrices,
  sensitivities: (req) => smileSensitivities(req.market, req.model, req.expiry, req.moneyness),
  book: (req) => revalueSet(req.base, req.scenarios, req.positions, req.ladder),
  demoChain: demoChainCsv,
  density: (model, expiry, points) => logReturnDensity(model, expiry, points),
};
