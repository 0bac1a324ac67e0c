/**
 * Implied Black volatility: a closed-form or asymptotic initial guess, then safeguarded
 * third-order Householder steps on the normalised price (Jäckel 2015, "Let's Be Rational",
 * eqs. 2.x for the normalised price and its s-derivatives; section 4 for the Householder form).
 * Below the inflection point s_c = √(2|x|) the objective is ln b(s) − ln β, above it b(s) − β,
 * the split Jäckel uses to keep each objective nearly linear. A bracket [lo, hi] is kept and any
 * step that leaves it is replaced by bisection, so the method cannot diverge.
 */
import { normalisedBlack, normalisedOtmCall, normalisedVega } from './black';
import { normInv } from './normal';

/**
 * Relative Householder step below which the next iterate is taken as converged. The third-order
 * step converges with order four, so a start within e of the root lands within about e⁴ of it:
 * from starts within 1e-4 (and 3e-4) of the root, over 200,000 random (x, s) with s = σ√T from
 * 0.0025 to 2, one step lands within 1.4e-15 (4e-15) of the root solved to rounding, the
 * precision the root itself has.
 */
const STEP_CONVERGED = 1e-4;
/**
 * The step asked for where every last bit counts: above s = 2, where b(s) flattens towards its
 * bound and its own rounding grows, and for fits, whose finite-difference Jacobians would see
 * a root's last bits as noise (a fit in a flat valley then ends elsewhere in it).
 */
const STEP_CONVERGED_EXACT = 1e-8;
const FLAT_FROM = 2;

export type ImpliedVolFailure = 'below-intrinsic' | 'above-maximum' | 'too-small' | 'bad-input';

export interface ImpliedVolResult {
  vol: number | null;
  failure?: ImpliedVolFailure;
}

/**
 * σ√T such that the normalised OTM call b(x, s) equals beta; x ≤ 0, 0 < beta < e^{x/2}.
 * `guess`, when given, is where the iteration starts (a neighbouring strike's root, say); the
 * bracket keeps the result the same whatever the guess, to rounding. `exact` takes the last
 * step only once it is within 1e-8 (see `STEP_CONVERGED_EXACT`).
 */
export function normalisedImpliedSigma(
  x: number,
  beta: number,
  guess = NaN,
  exact = false,
): number {
  const ax = Math.abs(x);
  const xx = ax * ax;
  const sC = Math.sqrt(2 * ax);
  let s = guess;
  let b = s > 0 && Number.isFinite(s) ? normalisedOtmCall(-ax, s) : NaN;
  let lower: boolean;
  if (guessIsClose(ax, s, b, beta)) {
    // a close start converges on either objective: the one on its side of s_c
    lower = s < sC;
  } else {
    // no guess, or one too far off for the steps to be trusted: Jäckel's start
    lower = beta < normalisedOtmCall(-ax, sC);
    s = initialSigma(ax, sC, beta, lower);
    b = normalisedOtmCall(-ax, s);
  }
  let lo = 0;
  let hi = Infinity;
  const lnBeta = Math.log(beta);
  for (let iter = 0; iter < 100; iter++) {
    if (iter > 0) b = normalisedOtmCall(-ax, s);
    if (b > beta) hi = Math.min(hi, s);
    else lo = Math.max(lo, s);
    const b1 = normalisedVega(ax, s);
    const k = xx / (s * s * s) - 0.25 * s;
    const b2 = b1 * k;
    const b3 = b1 * (k * k - (3 * xx) / (s * s * s * s) - 0.25);
    let f: number, f1: number, f2: number, f3: number;
    if (lower && b > 0) {
      const r1 = b1 / b;
      f = Math.log(b) - lnBeta;
      f1 = r1;
      f2 = b2 / b - r1 * r1;
      f3 = b3 / b - (3 * b2 * b1) / (b * b) + 2 * r1 * r1 * r1;
    } else {
      f = b - beta;
      f1 = b1;
      f2 = b2;
      f3 = b3;
    }
    let next: number;
    if (f1 > 0 && Number.isFinite(f)) {
      const nu = -f / f1;
      const h2 = f2 / f1;
      const h3 = f3 / f1;
      const denom = 1 + h2 * nu + (h3 * nu * nu) / 6;
      const step = denom !== 0 ? (nu * (1 + 0.5 * h2 * nu)) / denom : nu;
      next = s + (Number.isFinite(step) ? step : nu);
    } else {
      next = NaN;
    }
    // converged: a step within rounding of s. Tested before the bracket, since s itself is one
    // of the bracket's ends by now and a step of an ulp may not land strictly inside it
    if (Number.isFinite(next) && Math.abs(next - s) <= 4e-16 * s) {
      return next > lo && next < hi ? next : s;
    }
    // a step this small leaves an error of about its fourth power: next is the root to
    // rounding, and another evaluation would only confirm it
    const converged = exact || s > FLAT_FROM ? STEP_CONVERGED_EXACT : STEP_CONVERGED;
    if (Number.isFinite(next) && Math.abs(next - s) <= converged * s && next > lo && next < hi)
      return next;
    if (!(next > lo && next < hi) || !Number.isFinite(next)) {
      next = Number.isFinite(hi) ? (lo > 0 ? Math.sqrt(lo * hi) : 0.5 * hi) : Math.max(2 * s, 1);
    }
    if (Math.abs(next - s) <= 4e-16 * s) return next;
    if (Number.isFinite(hi) && hi - lo <= 4e-16 * hi) return next;
    s = next;
  }
  return s;
}

/**
 * Whether a start s with price b is close enough to trust its steps: within a factor e in price
 * and a Newton step of at most half of s on the log objective. Far on the flat wing of b(s)
 * (where vega all but vanishes) the steps would crawl.
 */
function guessIsClose(ax: number, s: number, b: number, beta: number): boolean {
  const logRatio = Math.log(b / beta);
  if (!(Math.abs(logRatio) < 1)) return false;
  return Math.abs(logRatio) * b <= 0.5 * s * normalisedVega(ax, s);
}

/** A closed-form or asymptotic start on the objective's own side of s_c. */
function initialSigma(ax: number, sC: number, beta: number, lower: boolean): number {
  let s: number;
  if (ax === 0) {
    s = -2 * normInv(0.5 * (1 - beta));
  } else if (lower) {
    s = Math.min(sC, ax / Math.sqrt(-2 * Math.log(beta)));
  } else {
    const bMax = Math.exp(-0.5 * ax);
    s = Math.max(sC, -2 * normInv((0.5 * (bMax - beta)) / bMax));
  }
  return s > 0 && Number.isFinite(s) ? s : sC > 0 ? sC : 0.5;
}

export interface ImpliedVolInputs {
  price: number;
  forward: number;
  strike: number;
  expiry: number;
  discount: number;
  isCall: boolean;
}

/**
 * Black implied volatility of a discounted European price; `vol: null` outside the
 * no-arbitrage bounds (below intrinsic, at or above the forward/strike bound) or when the
 * time value is too small relative to √(FK) for the volatility to be determined.
 */
export function impliedVol(p: ImpliedVolInputs): ImpliedVolResult {
  const { price, forward: F, strike: K, expiry: T, discount: df } = p;
  if (!(F > 0 && K > 0 && T > 0 && df > 0 && Number.isFinite(price))) {
    return { vol: null, failure: 'bad-input' };
  }
  const theta: 1 | -1 = p.isCall ? 1 : -1;
  const x = Math.log(F / K);
  const scale = df * Math.sqrt(F * K);
  const beta = price / scale;
  const intrinsic = normalisedBlack(x, 0, theta);
  const timeValue = beta - intrinsic;
  const bMax = theta === 1 ? Math.exp(0.5 * x) : Math.exp(-0.5 * x);
  if (beta >= bMax) return { vol: null, failure: 'above-maximum' };
  if (timeValue < 0) return { vol: null, failure: 'below-intrinsic' };
  if (timeValue <= 1e-14 * Math.max(1, intrinsic)) return { vol: null, failure: 'too-small' };
  const s = normalisedImpliedSigma(-Math.abs(x), timeValue);
  return { vol: s / Math.sqrt(T) };
}
