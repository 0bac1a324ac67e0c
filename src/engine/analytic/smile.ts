/**
 * Implied-vol smiles over a grid of expiries × log-moneyness, with the usual summaries quoted
 * in forward (undiscounted) Black-Scholes deltas: ATM at the forward,
 * RR25 = σ(25Δ call) − σ(25Δ put), BF25 = (σ(25Δ call) + σ(25Δ put))/2 − σ(ATM).
 */
import { modelSpec, type ModelSpec } from './characteristic';
import { cosStrip, prepareCos, type CosExpiry, DEFAULT_COS_SETTINGS } from './cos';
import { TableArena } from './cos-series';
import { forwardPrice } from '../core/market';
import { normCdf, normInv } from './normal';
import { impliedVolFromOtm, stripImpliedVols } from './pricing';
import { expiryGrid, type StrikeSpacing } from './strike-grid';
import type { Market, Model } from '../core/types';

export interface SmileSlice {
  expiry: number;
  forward: number;
  strikes: number[];
  logMoneyness: number[];
  impliedVols: (number | null)[];
  /** forward call delta Φ(d1) at each strike (null where the vol is undefined) */
  callDeltas: (number | null)[];
  atm: number | null;
  rr25: number | null;
  bf25: number | null;
  /** strikes of the 25-delta call and put, where found */
  strike25Call: number | null;
  strike25Put: number | null;
  /** the same at 10 delta: the wings a short-dated desk quotes */
  rr10: number | null;
  bf10: number | null;
  strike10Call: number | null;
  strike10Put: number | null;
}

export interface SmileSurface {
  slices: SmileSlice[];
}

/** One-strike working arrays, reused: the delta-strike searches call `volAt` many times. */
const ONE = { k: new Float64Array(1), c: new Float64Array(1), p: new Float64Array(1) };
const ONE_CDF = new Float64Array(1);
const ONE_DENSITY = new Float64Array(1);

/**
 * Preparations used within one call of this module and dropped: their tables share one buffer,
 * so each takes the space of the one before it (one is alive at a time).
 */
const TABLES = new TableArena();
function transientPrep(spec: ModelSpec, expiry: number): CosExpiry {
  TABLES.reset();
  return prepareCos(spec, expiry, DEFAULT_COS_SETTINGS, false, TABLES.allocate);
}

/** Vol at one log-moneyness from a prepared expiry. */
function volAt(prep: CosExpiry, k: number): number | null {
  ONE.k[0] = k;
  cosStrip(prep, ONE.k, ONE.c, ONE.p, ONE_CDF, ONE_DENSITY);
  return impliedVolFromOtm(k < 0 ? ONE.p[0] : ONE.c[0], k, prep.expiry);
}

/**
 * Log-moneyness of the strike whose forward call delta is `delta`, with the smile's own vol:
 * the fixed point of k = s·(−Φ⁻¹(Δ)) + s²/2, s = σ(k)√T.
 */
export function strikeForDelta(prep: CosExpiry, delta: number, start: number): number | null {
  const z = normInv(delta);
  const rootT = Math.sqrt(prep.expiry);
  let sigma: number | null = start;
  let k = 0;
  for (let i = 0; i < 60 && sigma !== null; i++) {
    const s = sigma * rootT;
    const next = -z * s + 0.5 * s * s;
    if (Math.abs(next - k) < 1e-12) return next;
    k = i < 20 ? next : 0.5 * (k + next); // damp if it has not settled
    sigma = volAt(prep, k);
  }
  return sigma === null ? null : k;
}

/**
 * Risk reversal and butterfly at one delta (forward call delta Δ for the call, 1 − Δ for the
 * put, each at the smile's own vol), with their strikes as log-moneyness.
 */
function deltaWings(
  prep: CosExpiry,
  atm: number,
  delta: number,
): { rr: number | null; bf: number | null; kCall: number | null; kPut: number | null } {
  const kCall = strikeForDelta(prep, delta, atm);
  const kPut = strikeForDelta(prep, 1 - delta, atm);
  const vc = kCall === null ? null : volAt(prep, kCall);
  const vp = kPut === null ? null : volAt(prep, kPut);
  if (vc === null || vp === null) return { rr: null, bf: null, kCall, kPut };
  return { rr: vc - vp, bf: 0.5 * (vc + vp) - atm, kCall, kPut };
}

/**
 * One expiry's smile on the given ln(K/F) list, or with `spacing` "standard-deviations" on the
 * expiry's own grid around that list's ATM vol (see `strike-grid.ts`), from one preparation.
 */
export function smileSlice(
  spec: ModelSpec,
  market: Market,
  expiry: number,
  moneyness: readonly number[],
  spacing: StrikeSpacing = 'log-moneyness',
): SmileSlice {
  const prep = transientPrep(spec, expiry);
  const atm = volAt(prep, 0);
  const logMoneyness = expiryGrid(spec, expiry, atm, moneyness, spacing);
  const F = forwardPrice(market, expiry);
  const n = logMoneyness.length;
  const call = new Float64Array(n);
  const put = new Float64Array(n);
  const cdf = new Float64Array(n);
  const dens = new Float64Array(n);
  cosStrip(prep, logMoneyness, call, put, cdf, dens);
  const rootT = Math.sqrt(expiry);
  const impliedVols = stripImpliedVols(call, put, logMoneyness, expiry);
  const callDeltas = impliedVols.map((v, j) => {
    if (v === null) return null;
    const s = v * rootT;
    return normCdf(-logMoneyness[j] / s + 0.5 * s);
  });
  const none = { rr: null, bf: null, kCall: null, kPut: null };
  const w25 = atm === null ? none : deltaWings(prep, atm, 0.25);
  const w10 = atm === null ? none : deltaWings(prep, atm, 0.1);
  const strike = (k: number | null) => (k === null ? null : F * Math.exp(k));
  return {
    expiry,
    forward: F,
    strikes: logMoneyness.map((k) => F * Math.exp(k)),
    logMoneyness: [...logMoneyness],
    impliedVols,
    callDeltas,
    atm,
    rr25: w25.rr,
    bf25: w25.bf,
    strike25Call: strike(w25.kCall),
    strike25Put: strike(w25.kPut),
    rr10: w10.rr,
    bf10: w10.bf,
    strike10Call: strike(w10.kCall),
    strike10Put: strike(w10.kPut),
  };
}

/**
 * Smiles at each expiry: on one ln(K/F) list shared by all of them (spaced by `spacing`, see
 * `smileSlice`), or on one given list per expiry (a stressed side drawn on its base's strikes).
 */
export function smileSurface(
  market: Market,
  model: Model,
  expiries: readonly number[],
  logMoneyness: readonly number[] | ReadonlyArray<readonly number[]>,
  spacing: StrikeSpacing = 'log-moneyness',
): SmileSurface {
  const spec = modelSpec(model);
  const first = logMoneyness[0];
  const shared = typeof first === 'number' || first === undefined;
  return {
    slices: expiries.map((t, i) =>
      shared
        ? smileSlice(spec, market, t, logMoneyness as readonly number[], spacing)
        : smileSlice(spec, market, t, (logMoneyness as ReadonlyArray<readonly number[]>)[i]),
    ),
  };
}

/** The ln(K/F) list of each slice: what a stressed side is drawn on. */
export const surfaceGrids = (surface: SmileSurface): number[][] =>
  surface.slices.map((s) => s.logMoneyness);

/**
 * Density of the log-return ln(S_T/F) at the given points: the COS strip's density output, whose
 * cosines come from the strip's rotation recurrence rather than one cosine per term and point.
 */
export function logReturnDensity(
  model: Model,
  expiry: number,
  points: readonly number[],
): number[] {
  const prep = transientPrep(modelSpec(model), expiry);
  const n = points.length;
  const scratch = () => new Float64Array(n);
  const density = scratch();
  cosStrip(prep, points, scratch(), scratch(), scratch(), density);
  return Array.from(density);
}

/**
 * Expiries for an ATM term-structure curve: log-spaced from one day to `last`, the given
 * expiries, and around each scheduled move its date (which it does not touch) and one day
 * after, so the curve shows the step the move puts into total variance.
 */
export function termStructureExpiries(
  expiries: readonly number[],
  eventTimes: readonly number[],
  last = Math.max(...expiries),
  points = 36,
): number[] {
  const day = 1 / 365;
  const first = Math.min(day, last);
  const set = new Set<number>(expiries);
  for (let i = 0; i < points; i++) set.add(first * (last / first) ** (i / (points - 1)));
  for (const t of eventTimes) {
    if (t >= last) continue;
    set.add(t);
    set.add(Math.min(last, t + day));
  }
  return [...set].filter((t) => t > 0 && t <= last).sort((a, b) => a - b);
}

/** ATM (at the forward) implied vol at one expiry; null where it is not defined. */
export const atmVolAt = (spec: ModelSpec, expiry: number): number | null =>
  volAt(transientPrep(spec, expiry), 0);

/** ATM (at the forward) implied vols at the given expiries. */
export function atmTermStructure(model: Model, expiries: readonly number[]): (number | null)[] {
  const spec = modelSpec(model);
  return expiries.map((t) => volAt(transientPrep(spec, t), 0));
}
