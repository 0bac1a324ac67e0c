/** Discounting and forwards from flat rates or zero curves. */
import type { Curve, Market } from './types';

/** Zero rate at t, linear in t between nodes, flat beyond the ends. */
export function zeroRate(curve: Curve, t: number): number {
  const n = curve.length;
  if (n === 0) return 0;
  if (t <= curve[0][0]) return curve[0][1];
  if (t >= curve[n - 1][0]) return curve[n - 1][1];
  let i = 1;
  while (curve[i][0] < t) i++;
  const [t0, r0] = curve[i - 1];
  const [t1, r1] = curve[i];
  return r0 + ((r1 - r0) * (t - t0)) / (t1 - t0);
}

export function riskFreeRate(market: Market, t: number): number {
  return market.rateCurve && market.rateCurve.length > 0
    ? zeroRate(market.rateCurve, t)
    : (market.rate ?? 0);
}

export function dividendRate(market: Market, t: number): number {
  return market.dividendCurve && market.dividendCurve.length > 0
    ? zeroRate(market.dividendCurve, t)
    : (market.dividendYield ?? 0);
}

/** Discount factor e^{−r(t)·t}. */
export function discountFactor(market: Market, t: number): number {
  return Math.exp(-riskFreeRate(market, t) * t);
}

/** Forward F(t) = S·e^{(r(t) − q(t))·t}. */
export function forwardPrice(market: Market, t: number): number {
  return market.spot * Math.exp((riskFreeRate(market, t) - dividendRate(market, t)) * t);
}

/** r′(t) of the piecewise-linear zero curve (flat beyond its ends); a node takes the mean of its two sides. */
function zeroRateSlope(curve: Curve, t: number): number {
  const n = curve.length;
  const side = (i: number) =>
    i < 1 || i >= n ? 0 : (curve[i][1] - curve[i - 1][1]) / (curve[i][0] - curve[i - 1][0]);
  for (let i = 0; i < n; i++) {
    if (curve[i][0] === t) return 0.5 * (side(i) + side(i + 1));
    if (curve[i][0] > t) return side(i);
  }
  return 0;
}

/** d/dt of r(t)·t for a flat rate or a zero curve. */
function rateTimeSlope(flat: number | undefined, curve: Curve | undefined, t: number): number {
  if (!curve || curve.length === 0) return flat ?? 0;
  return zeroRate(curve, t) + t * zeroRateSlope(curve, t);
}

/** d/dt ln D(t) and d/dt ln F(t): the market's share of a calendar theta. */
export function marketLogSlopes(market: Market, t: number): { discount: number; forward: number } {
  const r = rateTimeSlope(market.rate, market.rateCurve, t);
  const q = rateTimeSlope(market.dividendYield, market.dividendCurve, t);
  return { discount: -r, forward: r - q };
}
