/**
 * European option prices and Greeks for any model: grouped by expiry, each expiry priced as a
 * COS strip (closed form for Black-Scholes). Greeks from the same strip: with the model
 * invariant to the scale of spot, S·Δ = V − K ∂V/∂K and S²Γ = K² ∂²V/∂K², where ∂V/∂K and
 * ∂²V/∂K² come from the COS CDF and density of the log-return; theta from the time slopes of
 * the same strip's coefficients (see `prepareCos`).
 */
import { blackScholesGreeks, blackVega } from './black';
import { modelSpec, type ModelSpec } from './characteristic';
import { cosStrip, prepareCos, type CosSettings, DEFAULT_COS_SETTINGS } from './cos';
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

/** Prices one expiry's strikes (as log-moneyness ln(K/F)) per unit forward. */
export function priceStrip(
  spec: ModelSpec,
  market: Market,
  expiry: number,
  logMoneyness: ArrayLike<number>,
  settings: CosSettings = DEFAULT_COS_SETTINGS,
  withTimeSlope = false,
): StripValues {
  const n = logMoneyness.length;
  const out: StripValues = {
    forward: forwardPrice(market, expiry),
    discount: discountFactor(market, expiry),
    call: new Float64Array(n),
    put: new Float64Array(n),
    cdf: new Float64Array(n),
    density: new Float64Array(n),
    timeSlope: withTimeSlope ? new Float64Array(n) : null,
  };
  const prep = prepareCos(spec, expiry, settings, withTimeSlope);
  cosStrip(prep, logMoneyness, out.call, out.put, out.cdf, out.density, out.timeSlope ?? undefined);
  return out;
}

/**
 * Implied vol from an out-of-the-money undiscounted price per unit forward at k = ln(K/F):
 * the normalised Black price is otm·e^{−k/2} at x = −|k|.
 */
export function impliedVolFromOtm(otm: number, k: number, expiry: number): number | null {
  const beta = otm * Math.exp(-0.5 * k);
  const bMax = Math.exp(-0.5 * Math.abs(k));
  if (!(beta > MIN_NORMALISED_TIME_VALUE) || !(beta < bMax)) return null;
  return normalisedImpliedSigma(-Math.abs(k), beta) / Math.sqrt(expiry);
}

export function priceOptions(
  market: Market,
  model: Model,
  options: readonly OptionSpec[],
  settings: CosSettings = DEFAULT_COS_SETTINGS,
): OptionResult[] {
  const results: OptionResult[] = new Array(options.length);
  const byExpiry = new Map<number, number[]>();
  options.forEach((o, i) => {
    const list = byExpiry.get(o.expiry);
    if (list) list.push(i);
    else byExpiry.set(o.expiry, [i]);
  });
  const spec = modelSpec(model);
  for (const [expiry, indices] of byExpiry) {
    const strikes = indices.map((i) => options[i].strike);
    const values = valueAt(spec, model, market, expiry, strikes, settings);
    const slopes = marketLogSlopes(market, expiry);
    indices.forEach((optionIndex, j) => {
      const o = options[optionIndex];
      const isCall = o.type === 'call';
      const v = values[j];
      const price = isCall ? v.call : v.put;
      // calendar theta −dV/dT of V = D·F·P(k, T), k = ln(K/F): the price's own time slope
      // at fixed k, the strike's drift in k as F moves, and the discounted forward's drift
      const ek = o.strike / v.forward;
      const slopeInK = isCall ? -ek * (1 - v.cdf) : ek * v.cdf;
      const theta = -(
        price * (slopes.discount + slopes.forward) +
        v.discount * v.forward * (v.timeSlope - slopeInK * slopes.forward)
      );
      const deltaK = isCall ? -v.discount * (1 - v.cdf) : v.discount * v.cdf;
      const delta = (price - o.strike * deltaK) / market.spot;
      const gamma = (v.discount * o.strike * v.density) / (market.spot * market.spot);
      const vega =
        v.impliedVol === null
          ? 0
          : blackVega({
              forward: v.forward,
              strike: o.strike,
              sigma: v.impliedVol,
              expiry,
              discount: v.discount,
            });
      const result: OptionResult = { price, impliedVol: v.impliedVol, delta, gamma, vega, theta };
      if (v.impliedVol === null) {
        result.note = 'time value below 1e-12 of the forward: implied vol not defined';
      }
      results[optionIndex] = result;
    });
  }
  return results;
}

interface StrikeValue {
  call: number;
  put: number;
  cdf: number;
  density: number;
  /** ∂/∂T of the undiscounted price per unit forward at fixed ln(K/F) */
  timeSlope: number;
  forward: number;
  discount: number;
  impliedVol: number | null;
}

function valueAt(
  spec: ModelSpec,
  model: Model,
  market: Market,
  expiry: number,
  strikes: number[],
  settings: CosSettings,
): StrikeValue[] {
  const F = forwardPrice(market, expiry);
  const df = discountFactor(market, expiry);
  if (isBlackScholes(spec)) {
    const sigma = parameterValue(model, 'sigma');
    return strikes.map((K) => {
      const base = {
        forward: F,
        strike: K,
        sigma,
        expiry,
        discount: df,
        spot: market.spot,
      };
      const c = blackScholesGreeks({ ...base, isCall: true });
      const p = blackScholesGreeks({ ...base, isCall: false });
      const s = sigma * Math.sqrt(expiry);
      const d2 = Math.log(F / K) / s - 0.5 * s;
      const k = Math.log(K / F);
      return {
        call: c.price,
        put: p.price,
        // Y ~ N(−s²/2, s²): P(Y ≤ k) = Φ(−d2), density φ(d2)/s
        cdf: normCdf(-d2),
        density: Math.exp(-0.5 * d2 * d2) / (Math.sqrt(2 * Math.PI) * s),
        // ∂P/∂s = φ(d1) per unit forward, ∂s/∂T = σ²/(2s)
        timeSlope: normPdf(d2 + s) * ((sigma * sigma) / (2 * s)),
        forward: F,
        discount: df,
        impliedVol: impliedVolFromOtm((k < 0 ? p.price : c.price) / (df * F), k, expiry),
      };
    });
  }
  const ks = strikes.map((K) => Math.log(K / F));
  const v = priceStrip(spec, market, expiry, ks, settings, true);
  return strikes.map((_, j) => ({
    call: df * F * v.call[j],
    put: df * F * v.put[j],
    cdf: v.cdf[j],
    density: v.density[j],
    timeSlope: v.timeSlope ? v.timeSlope[j] : 0,
    forward: F,
    discount: df,
    impliedVol: impliedVolFromOtm(ks[j] < 0 ? v.put[j] : v.call[j], ks[j], expiry),
  }));
}
