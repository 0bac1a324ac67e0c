/** The engine work behind each worker command, as plain functions (also used by tests). */
import { bookJumpExposure, revalueSet, suggestWingHedge, wingLadder } from '../engine/book';
import {
  atmTermStructure,
  impliedEventMoves,
  priceOptions,
  smileSensitivities,
  logReturnDensity,
  smileSurface,
  surfaceGrids,
  termStructureExpiries,
  type SmileSurface,
} from '../engine/analytic';
import {
  applyStress,
  isIdentityStress,
  ENGINE_VERSION,
  hasDatedRisk,
  modelSpec,
  type Model,
} from '../engine/core';
import { demoChainCsv } from '../engine/fit';
import type {
  EngineApi,
  PriceRequest,
  PriceResponse,
  SmileRequest,
  SmileResponse,
} from './engine-api';

/**
 * The last base surface and base density, kept while only the stress changes (a slider drag
 * recomputes the stressed side alone). The same computation either way: bit-identical.
 */
const lastBase = { key: '', surface: null as SmileSurface | null, grids: [] as number[][] };
const lastDensity = { key: '', values: null as number[] | null };

/** The base surface and its strikes per expiry (the stressed side is drawn on the same ones). */
function baseSurface(req: SmileRequest): { surface: SmileSurface; grids: number[][] } {
  const key = JSON.stringify([
    req.market,
    req.model,
    req.expiries,
    req.moneyness,
    req.strikeSpacing,
  ]);
  if (key !== lastBase.key || !lastBase.surface) {
    lastBase.surface = smileSurface(
      req.market,
      req.model,
      req.expiries,
      req.moneyness,
      req.strikeSpacing,
    );
    lastBase.grids = surfaceGrids(lastBase.surface);
    lastBase.key = key;
  }
  return { surface: lastBase.surface, grids: lastBase.grids };
}

function baseDensity(model: Model, expiry: number, points: number[]): number[] {
  const key = JSON.stringify([model, expiry, points]);
  if (key !== lastDensity.key || !lastDensity.values) {
    lastDensity.values = logReturnDensity(model, expiry, points);
    lastDensity.key = key;
  }
  return lastDensity.values;
}

export function computeSmiles(req: SmileRequest): SmileResponse {
  const started = performance.now();
  const { surface: base, grids } = baseSurface(req);
  let stressed = null;
  let stressIssues: SmileResponse['stressIssues'] = [];
  let stressedModel = null;
  if (!isIdentityStress(req.stress)) {
    const s = applyStress(req.market, req.model, req.stress ?? {});
    stressIssues = s.issues;
    if (s.issues.length === 0) {
      stressed = smileSurface(s.market, s.model, req.expiries, grids);
      stressedModel = s.model;
    }
  }
  let density = null;
  if (req.densityExpiry !== undefined) {
    const points = Array.from({ length: 161 }, (_, i) => -0.4 + (0.6 * i) / 160);
    density = {
      points,
      base: baseDensity(req.model, req.densityExpiry, points),
      stressed: stressedModel ? logReturnDensity(stressedModel, req.densityExpiry, points) : null,
    };
  }
  const eventTimes = (req.model.events ?? []).map((e) => e.time);
  const term = atmTerm(req.model, stressedModel, base, stressed, eventTimes);
  const eventMoves =
    eventTimes.length > 0
      ? impliedEventMoves(eventTimes, term.expiries, term.base, req.eventBaseVol)
      : [];
  return {
    base,
    stressed,
    stressIssues,
    density,
    term,
    eventMoves,
    elapsedMs: performance.now() - started,
    engineVersion: ENGINE_VERSION,
  };
}

/**
 * The ATM term structure for the chart: the grid's own ATM vols, or with dated risk a denser
 * curve that brackets every scheduled move.
 */
function atmTerm(
  model: Model,
  stressedModel: Model | null,
  base: SmileSurface,
  stressed: SmileSurface | null,
  eventTimes: number[],
): SmileResponse['term'] {
  if (!hasDatedRisk(modelSpec(model))) {
    return {
      expiries: base.slices.map((s) => s.expiry),
      base: base.slices.map((s) => s.atm),
      stressed: stressed ? stressed.slices.map((s) => s.atm) : null,
    };
  }
  const expiries = termStructureExpiries(
    base.slices.map((s) => s.expiry),
    eventTimes,
  );
  return {
    expiries,
    base: atmTermStructure(model, expiries),
    stressed: stressedModel ? atmTermStructure(stressedModel, expiries) : null,
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
  book: (req) => revalueSet(req.base, req.scenarios, req.positions, req.ladder, req.volReaction),
  bookJumpExposure: (req) => bookJumpExposure(req.base, req.positions, req.ladder, req.volReaction),
  wingHedge: (req) => suggestWingHedge(req.market, req.model, req.positions, req.wingHedge),
  wingLadder: (req) =>
    wingLadder(req.market, req.model, req.positions, req.wingHedge.instruments, req.quantities),
  demoChain: demoChainCsv,
  density: (model, expiry, points) => logReturnDensity(model, expiry, points),
};
