/**
 * European option prices and Greeks for any model: grouped by expiry, each expiry priced as a
 * COS strip (closed form for Black-Scholes). Greeks from the same strip: with the model
 * invariant to the scale of spot, S·Δ = V − K ∂V/∂K and S²Γ = K² ∂²V/∂K², where ∂V/∂K and
 * ∂²V/∂K² come from the COS CDF and density of the log-return; theta from the time slopes of
 * the same strip's coefficients (see `prepareCos`).
 */
import { blackScholesGreeks, blackVegaAt } from './black';
import { modelSpec, type ModelSpec } from './characteristic';
import { cosStrip, prepareCos, type CosSettings, DEFAULT_COS_SETTINGS } from './cos';
import { TableArena, type TableAllocator } from './cos-series';
import { normalisedImpliedSigma } from './implied-vol';
import { discountFactor, forwardPrice, marketLogSlopes } from '../core/market';
import { normCdf, normPdf } from './normal';
import { isBlackScholes, parameterValue } from '../core/models';
import type { Market, Model, OptionSpec } from '../core/types';

export interface OptionResult {
  price: number;
  /** Black-Scholes vol of `price`; null outside no-arbitrage bounds or when undetermined */
  impliedVol: number | null;
  /** ∂V/∂S */
  delta: number;
  /** ∂²V/∂S² */
  gamma: number;
  /** ∂V/∂σ at the option's own implied vol, per unit of vol (divide by 100 for a vol point) */
  vega: number;
  /** ∂V/∂t per year of calendar time, model parameters held fixed */
  theta: number;
  /** why a figure is missing or limited, if it is */
  note?: string;
}

/** Smallest normalised time value for which an implied vol is reported. */
export const MIN_NORMALISED_TIME_VALUE = 1e-12;

export interface StripValues {
  forward: number;
  discount: number;
  /** undiscounted OTM price per unit forward, and call/put per unit forward */
  call: Float64Array;
  put: Float64Array;
  cdf: Float64Array;
  density: Float64Array;
  /** ∂/∂T of call and put per unit forward at fixed ln(K/F), when asked for */
  timeSlope: Float64Array | null;
}

/**
 * Prices one expiry's strikes (as log-moneyness ln(K/F)) per unit forward. The five arrays are
 * views on `buffer` (5 × the strikes long) when given, so that a caller pricing many expiries
 * makes one allocation: each typed array's own costs microseconds. `allocate` places the
 * series' tables, which the strip drops once priced (see `TableArena`).
 */
export function priceStrip(
  spec: ModelSpec,
  market: Market,
  expiry: number,
  logMoneyness: ArrayLike<number>,
  settings: CosSettings = DEFAULT_COS_SETTINGS,
  withTimeSlope = false,
  buffer: Float64Array = new Float64Array(5 * logMoneyness.length),
  allocate?: TableAllocator,
): StripValues {
  const n = logMoneyness.length;
  const part = (i: number) => buffer.subarray(i * n, (i + 1) * n);
  const out: StripValues = {
    forward: forwardPrice(market, expiry),
    discount: discountFactor(market, expiry),
    call: part(0),
    put: part(1),
    cdf: part(2),
    density: part(3),
    timeSlope: withTimeSlope ? part(4) : null,
  };
  const prep = prepareCos(spec, expiry, settings, withTimeSlope, allocate);
  cosStrip(prep, logMoneyness, out.call, out.put, out.cdf, out.density, out.timeSlope ?? undefined);
  return out;
}

/**
 * Implied vol from an out-of-the-money undiscounted price per unit forward at k = ln(K/F):
 * the normalised Black price is otm·e^{−k/2} at x = −|k|. `guessSigma` (a σ√T) is where the
 * root search starts, when known; `exact` as in `normalisedImpliedSigma`.
 */
export function impliedVolFromOtm(
  otm: number,
  k: number,
  expiry: number,
  guessSigma = NaN,
  exact = false,
): number | null {
  const beta = otm * Math.exp(-0.5 * k);
  const bMax = Math.exp(-0.5 * Math.abs(k));
  if (!(beta > MIN_NORMALISED_TIME_VALUE) || !(beta < bMax)) return null;
  return normalisedImpliedSigma(-Math.abs(k), beta, guessSigma, exact) / Math.sqrt(expiry);
}

/**
 * Implied vols of one expiry's out-of-the-money prices per unit forward (`put` below the
 * forward, `call` at and above), strike by strike in the order given. Each root search starts
 * on the cubic through the four strikes solved before it (fewer at the start of the strip), in
 * σ√T against ln(K/F): on a smooth smile that start is within about 1e-4 of the root for half
 * the strikes, where one Householder step finishes the search (see `STEP_CONVERGED`); fits ask
 * for `exact` roots.
 */
export function stripImpliedVols(
  call: ArrayLike<number>,
  put: ArrayLike<number>,
  logMoneyness: ArrayLike<number>,
  expiry: number,
  exact = false,
): (number | null)[] {
  const rootT = Math.sqrt(expiry);
  const out: (number | null)[] = new Array(logMoneyness.length);
  const solved = SOLVED;
  solved.count = 0;
  for (let j = 0; j < logMoneyness.length; j++) {
    const k = logMoneyness[j];
    const otm = k < 0 ? put[j] : call[j];
    const vol = impliedVolFromOtm(otm, k, expiry, extrapolated(solved, k), exact);
    out[j] = vol;
    if (vol !== null) remember(solved, k, vol * rootT);
  }
  return out;
}

/** The last four roots of a strip, newest first (one strip at a time: each engine is one thread). */
const SOLVED = { k: [NaN, NaN, NaN, NaN], s: [NaN, NaN, NaN, NaN], count: 0 };

function remember(solved: typeof SOLVED, k: number, s: number): void {
  for (let i = 3; i > 0; i--) {
    solved.k[i] = solved.k[i - 1];
    solved.s[i] = solved.s[i - 1];
  }
  solved.k[0] = k;
  solved.s[0] = s;
  solved.count = Math.min(4, solved.count + 1);
}

/**
 * The polynomial through the remembered roots at k, in Newton's divided differences; NaN (no
 * start) when none is remembered or the value is not a positive number.
 */
function extrapolated(solved: typeof SOLVED, k: number): number {
  const { k: ks, s: ss, count } = solved;
  if (count === 0) return NaN;
  // d[i] becomes the divided difference s[0..i], built in place over the points
  const d0 = ss[0];
  let value = d0;
  let basis = 1;
  const d = DIFFERENCES;
  for (let i = 0; i < count; i++) d[i] = ss[i];
  for (let order = 1; order < count; order++) {
    for (let i = count - 1; i >= order; i--) d[i] = (d[i - 1] - d[i]) / (ks[i - order] - ks[i]);
    basis *= k - ks[order - 1];
    value += d[order] * basis;
  }
  return value > 0 && Number.isFinite(value) ? value : d0;
}
const DIFFERENCES = [0, 0, 0, 0];

export function priceOptions(
  market: Market,
  model: Model,
  options: readonly OptionSpec[],
  settings: CosSettings = DEFAULT_COS_SETTINGS,
): OptionResult[] {
  const n = options.length;
  const byExpiry = new Map<number, number[]>();
  options.forEach((o, i) => {
    const list = byExpiry.get(o.expiry);
    if (list) list.push(i);
    else byExpiry.set(o.expiry, [i]);
  });
  // figures first, objects last: results made while later expiries are still being priced
  // would outlive the young generation's collections, and the allocator would then place
  // every later one straight in the old generation. One buffer holds the five figures and,
  // per expiry, its log-moneyness and strip values (6 per option).
  TABLES.reset();
  const work = TABLES.allocate(11 * n);
  const [price, delta, gamma, vega, theta] = [0, 1, 2, 3, 4].map((f) =>
    work.subarray(f * n, (f + 1) * n),
  );
  let free = 5 * n;
  const take = (size: number) => work.subarray(free, (free += size));
  const vols: (number | null)[] = new Array(n);
  const spec = modelSpec(model);
  for (const [expiry, indices] of byExpiry) {
    const strikes = indices.map((i) => options[i].strike);
    const m = strikes.length;
    const v = valueAt(spec, model, market, expiry, strikes, settings, take(m), take(5 * m));
    const { forward: F, discount: df } = v;
    const slopes = marketLogSlopes(market, expiry);
    const rootT = Math.sqrt(expiry);
    for (let j = 0; j < indices.length; j++) {
      const i = indices[j];
      const o = options[i];
      const isCall = o.type === 'call';
      const p = isCall ? v.call[j] : v.put[j];
      const cdf = v.cdf[j];
      // calendar theta −dV/dT of V = D·F·P(k, T), k = ln(K/F): the price's own time slope
      // at fixed k, the strike's drift in k as F moves, and the discounted forward's drift
      const ek = o.strike / F;
      const slopeInK = isCall ? -ek * (1 - cdf) : ek * cdf;
      theta[i] = -(
        p * (slopes.discount + slopes.forward) +
        df * F * (v.timeSlope[j] - slopeInK * slopes.forward)
      );
      const deltaK = isCall ? -df * (1 - cdf) : df * cdf;
      price[i] = p;
      delta[i] = (p - o.strike * deltaK) / market.spot;
      gamma[i] = (df * o.strike * v.density[j]) / (market.spot * market.spot);
      const impliedVol = v.vols[j];
      vols[i] = impliedVol;
      // Black's vega D·F·φ(d1)·√T at the option's own implied vol, d1 = −k/s + s/2
      const s = impliedVol === null ? 0 : impliedVol * rootT;
      vega[i] = blackVegaAt(F, df, -v.logMoneyness[j], s, rootT);
    }
  }
  const results: OptionResult[] = new Array(n);
  for (let i = 0; i < n; i++) {
    const impliedVol = vols[i];
    const result: OptionResult = {
      price: price[i],
      impliedVol,
      delta: delta[i],
      gamma: gamma[i],
      vega: vega[i],
      theta: theta[i],
    };
    if (impliedVol === null) {
      result.note = 'time value below 1e-12 of the forward: implied vol not defined';
    }
    results[i] = result;
  }
  return results;
}

/** One expiry's values for its strikes: discounted prices, the law's CDF, density and slope. */
interface ExpiryValues {
  forward: number;
  discount: number;
  logMoneyness: Float64Array;
  /** discounted call and put prices */
  call: Float64Array;
  put: Float64Array;
  cdf: Float64Array;
  density: Float64Array;
  /** ∂/∂T of the undiscounted price per unit forward at fixed ln(K/F) */
  timeSlope: Float64Array;
  vols: (number | null)[];
}

/**
 * The figures and series tables of one `priceOptions` call, in a buffer kept between calls (each
 * engine runs in one thread): the results are copied out before the call returns.
 */
const TABLES = new TableArena();

function valueAt(
  spec: ModelSpec,
  model: Model,
  market: Market,
  expiry: number,
  strikes: number[],
  settings: CosSettings,
  ks: Float64Array,
  stripBuffer: Float64Array,
): ExpiryValues {
  const F = forwardPrice(market, expiry);
  const df = discountFactor(market, expiry);
  strikes.forEach((K, j) => (ks[j] = Math.log(K / F)));
  if (isBlackScholes(spec)) return blackScholesValues(model, market, expiry, strikes, ks);
  const v = priceStrip(spec, market, expiry, ks, settings, true, stripBuffer, TABLES.allocate);
  const vols = stripImpliedVols(v.call, v.put, ks, expiry);
  // discounted in place: the strip's arrays are this call's own
  for (let j = 0; j < ks.length; j++) {
    v.call[j] *= df * F;
    v.put[j] *= df * F;
  }
  return {
    forward: F,
    discount: df,
    logMoneyness: ks,
    call: v.call,
    put: v.put,
    cdf: v.cdf,
    density: v.density,
    timeSlope: v.timeSlope!,
    vols,
  };
}

/** `valueAt` in closed form for Black-Scholes. */
function blackScholesValues(
  model: Model,
  market: Market,
  expiry: number,
  strikes: number[],
  ks: Float64Array,
): ExpiryValues {
  const F = forwardPrice(market, expiry);
  const df = discountFactor(market, expiry);
  const sigma = parameterValue(model, 'sigma');
  const n = strikes.length;
  const [call, put, cdf, density, timeSlope] = Array.from({ length: 5 }, () => new Float64Array(n));
  const vols: (number | null)[] = new Array(n);
  const s = sigma * Math.sqrt(expiry);
  strikes.forEach((K, j) => {
    const base = { forward: F, strike: K, sigma, expiry, discount: df, spot: market.spot };
    call[j] = blackScholesGreeks({ ...base, isCall: true }).price;
    put[j] = blackScholesGreeks({ ...base, isCall: false }).price;
    const d2 = -ks[j] / s - 0.5 * s;
    // Y ~ N(−s²/2, s²): P(Y ≤ k) = Φ(−d2), density φ(d2)/s
    cdf[j] = normCdf(-d2);
    density[j] = Math.exp(-0.5 * d2 * d2) / (Math.sqrt(2 * Math.PI) * s);
    // ∂P/∂s = φ(d1) per unit forward, ∂s/∂T = σ²/(2s)
    timeSlope[j] = normPdf(d2 + s) * ((sigma * sigma) / (2 * s));
    const k = ks[j];
    vols[j] = impliedVolFromOtm((k < 0 ? put[j] : call[j]) / (df * F), k, expiry);
  });
  return { forward: F, discount: df, logMoneyness: ks, call, put, cdf, density, timeSlope, vols };
}
