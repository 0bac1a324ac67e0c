/**
 * Black-Scholes / Black-76 in normalised form (Jäckel 2015, "Let's Be Rational", section 2):
 * with x = ln(F/K) and s = σ√T, the undiscounted price divided by √(FK) is
 *   b(x, s, θ) = θ [e^{x/2} Φ(θ(x/s + s/2)) − e^{−x/2} Φ(θ(x/s − s/2))],  θ = +1 call, −1 put.
 * Out-of-the-money prices are computed through the Mills ratio so that tiny prices keep their
 * relative precision.
 */
import { millsCentralDifference, millsRatioAnywhere, normCdf, normPdf } from './normal';

const INV_SQRT_2PI = 1 / Math.sqrt(2 * Math.PI);

/** Normalised price of the out-of-the-money call at x = ln(F/K) ≤ 0 (or its put twin at −x). */
export function normalisedOtmCall(x: number, s: number): number {
  if (s <= 0) return 0;
  const h = x / s;
  const t = 0.5 * s;
  // e^{x/2} φ(h + t) = e^{−x/2} φ(h − t) = φ_c; b = φ_c [R(−h − t) − R(−h + t)]
  const logPhiC = -0.5 * (h * h + t * t);
  if (logPhiC < -745) {
    // φ_c underflows: far out of the money (|h| > t) the price is below any double; at a vol so
    // large that t > |h| the call is near its bound e^{x/2} and the direct form has no cancellation
    return t > -h
      ? Math.max(0, Math.exp(0.5 * x) * normCdf(h + t) - Math.exp(-0.5 * x) * normCdf(h - t))
      : 0;
  }
  const phiC = Math.exp(logPhiC) * INV_SQRT_2PI;
  // For s ≤ 1 the difference is summed as a series in t (no cancellation for small s).
  const diff =
    t <= 0.5
      ? millsCentralDifference(-h, t)
      : millsRatioAnywhere(-h - t) - millsRatioAnywhere(-h + t);
  return Math.max(0, phiC * diff);
}

/** Normalised Black price b(x, s, θ); x = ln(F/K), s = σ√T, θ = +1 call / −1 put. */
export function normalisedBlack(x: number, s: number, theta: 1 | -1): number {
  const xOtm = theta * x > 0 ? -theta * x : theta * x; // ≤ 0
  const otm = normalisedOtmCall(xOtm, s);
  if (theta * x > 0) {
    // in the money: add intrinsic value in normalised units
    return otm + theta * (Math.exp(0.5 * x) - Math.exp(-0.5 * x));
  }
  return otm;
}

export interface BlackInputs {
  forward: number;
  strike: number;
  /** annualised volatility */
  sigma: number;
  /** year fraction */
  expiry: number;
  /** discount factor to expiry */
  discount: number;
  isCall: boolean;
}

/** Discounted Black price DF·√(FK)·b. */
export function blackPrice(p: BlackInputs): number {
  const { forward: F, strike: K, sigma, expiry: T, discount } = p;
  if (T <= 0 || sigma <= 0) {
    return discount * Math.max(0, p.isCall ? F - K : K - F);
  }
  const x = Math.log(F / K);
  return discount * Math.sqrt(F * K) * normalisedBlack(x, sigma * Math.sqrt(T), p.isCall ? 1 : -1);
}

export interface BlackGreeks {
  price: number;
  /** ∂V/∂S with S the spot, F = S e^{(r−q)T} */
  delta: number;
  gamma: number;
  /** ∂V/∂σ, per unit of volatility (1.0 = 100 vol points) */
  vega: number;
}

/**
 * Price and spot Greeks of a European option under Black-Scholes with forward F = S·e^{(r−q)T}
 * and discount DF; `spot` is needed for delta and gamma.
 */
export function blackScholesGreeks(p: BlackInputs & { spot: number }): BlackGreeks {
  const { forward: F, strike: K, sigma, expiry: T, discount: df, spot } = p;
  const price = blackPrice(p);
  const sqrtT = Math.sqrt(T);
  const s = sigma * sqrtT;
  if (!(s > 0)) {
    const itm = p.isCall ? F > K : F < K;
    return { price, delta: itm ? ((p.isCall ? 1 : -1) * df * F) / spot : 0, gamma: 0, vega: 0 };
  }
  const d1 = Math.log(F / K) / s + 0.5 * s;
  const carry = (df * F) / spot; // e^{−qT}
  const delta = p.isCall ? carry * normCdf(d1) : -carry * normCdf(-d1);
  const gamma = (carry * normPdf(d1)) / (spot * s);
  const vega = blackVega(p);
  return { price, delta, gamma, vega };
}

/** ∂V/∂σ of a discounted Black price, D·F·φ(d1)·√T (0 at zero vol or expiry). */
export function blackVega(p: Omit<BlackInputs, 'isCall'>): number {
  const { forward: F, strike: K, sigma, expiry: T, discount: df } = p;
  const sqrtT = Math.sqrt(T);
  return blackVegaAt(F, df, Math.log(F / K), sigma * sqrtT, sqrtT);
}

/** `blackVega` from x = ln(F/K) and s = σ√T, for callers that have them. */
export function blackVegaAt(
  forward: number,
  discount: number,
  x: number,
  s: number,
  sqrtT: number,
): number {
  if (!(s > 0)) return 0;
  const d1 = x / s + 0.5 * s;
  return discount * forward * normPdf(d1) * sqrtT;
}

/**
 * ∂b/∂s of the normalised Black price at |x| = ax: φ_c = e^{−(h² + t²)/2}/√(2π), h = ax/s,
 * t = s/2 (Jäckel 2015, "Let's Be Rational", section 2).
 */
export function normalisedVega(ax: number, s: number): number {
  const h = ax / s;
  const t = 0.5 * s;
  return Math.exp(-0.5 * (h * h + t * t)) * INV_SQRT_2PI;
}
