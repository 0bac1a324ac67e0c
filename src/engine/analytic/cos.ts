/**
 * COS method (Fang & Oosterlee 2008, "A novel pricing method for European options based on
 * Fourier-cosine series expansions", SIAM J. Sci. Comput. 31(2)) for a strip of strikes sharing
 * one expiry. The density of Y = ln(S_T/F) on [a, b] is expanded in cosines; the coefficients
 * A_n = (2/(b−a)) Re[φ(u_n) e^{−i u_n a}], u_n = nπ/(b−a), are computed once per expiry and
 * reused for every strike. Out-of-the-money options are priced directly (puts below the
 * forward, calls at and above it, unless the range reaches so far up that e^b would swamp the
 * call coefficients); the other side follows from put-call parity.
 */
import { logCharacteristic, type ModelSpec } from './characteristic';
import { cumulants, diffusionVariance } from './cumulants';
import { expectedJumps } from '../core/model-spec';
import { touches, twoPointOutcomes } from '../core/scheduled-moves';
import { slopeSums, stripSums } from './cos-sums';

export interface CosSettings {
  /** truncation width in units of √(c2 + √c4) (Fang & Oosterlee section 5.1) */
  width: number;
  /** stop adding terms once |φ(u_n)|/(1 + u_n²) stays below this over a whole block */
  tailTolerance: number;
  minTerms: number;
  maxTerms: number;
}

export const DEFAULT_COS_SETTINGS: CosSettings = {
  width: 12,
  tailTolerance: 1e-14,
  minTerms: 64,
  maxTerms: 1 << 16,
};

export interface CosExpiry {
  expiry: number;
  a: number;
  b: number;
  terms: number;
  /** u_n = nπ/(b − a) */
  u: Float64Array;
  /** A_n with the n = 0 term halved */
  coef: Float64Array;
  /** A_n / u_n (0 for n = 0) and A_n / (1 + u_n²), shared by every strike */
  coefOverU: Float64Array;
  coefOverU2: Float64Array;
  /** Σ_{n≥1} A_n/(1 + u_n²) and Σ_{n≥1} (−1)^n A_n/(1 + u_n²), strike-independent */
  sumOverU2Tail: number;
  sumAltTail: number;
  /** true when maxTerms was reached before the characteristic function decayed */
  capped: boolean;
  /** the coefficients' time slopes ∂A_n/∂τ on the same [a, b], when asked for */
  slope: CosSlope | null;
  /** variance of Y (second cumulant) and of its diffusive part alone */
  variance: number;
  diffusionVariance: number;
}

/** ∂/∂τ of the series' coefficients and of their strike-independent sums (see `CosExpiry`). */
export interface CosSlope {
  coef: Float64Array;
  coefOverU: Float64Array;
  coefOverU2: Float64Array;
  sumOverU2Tail: number;
  sumAltTail: number;
}

const BLOCK = 64;
/**
 * Above this upper bound the call coefficients carry e^b and cancel badly (Fang & Oosterlee
 * section 3.3), so calls are priced from puts by parity instead.
 */
const DIRECT_CALL_LIMIT = 5;

/** Extra half-width so the range also holds one jump's tail (c2/c4 alone understate it). */
function jumpExtent(spec: ModelSpec, T: number): number {
  const j = spec.jumps;
  if (j.type === 'none' || !(expectedJumps(spec, T) > 0)) return 0;
  if (j.type === 'lognormal') return Math.abs(j.jumpMean) + 8.5 * j.jumpStdev;
  // the exponential variance jump reaches ln S through ρJ: 37 of its means, as for Kou's tails
  if (j.type === 'price-variance')
    return (
      Math.abs(j.jumpMean) +
      8.5 * j.jumpStdev +
      37 * Math.abs(j.jumpCorrelation) * j.varianceJumpMean
    );
  return 37 * Math.max(j.upMean, j.downMean);
}

/**
 * Extra half-width for the two-point scheduled moves before T: the sum of their outcomes'
 * largest distances from 0 bounds their joint support, which a bimodal law's c2 and c4 can
 * understate. Normal moves are Gaussian: the cumulants already hold them.
 */
function eventExtent(spec: ModelSpec, T: number): number {
  let extent = 0;
  if (!spec.events) return 0;
  for (const e of spec.events) {
    if (e.law !== 'two-point' || !touches(e.time, T)) continue;
    const { up, down } = twoPointOutcomes(e);
    extent += Math.max(Math.abs(up), Math.abs(down));
  }
  return extent;
}

/**
 * Prepares one expiry's series. With `withSlope`, the coefficients' time slopes come from the
 * same characteristic-function values (∂A_n/∂τ = (2/(b − a)) Re[φ(u_n)·∂τ ln φ(u_n)·e^{−i u_n a}],
 * the range held), so a calendar theta needs no second or third strip.
 */
export function prepareCos(
  spec: ModelSpec,
  T: number,
  settings: CosSettings = DEFAULT_COS_SETTINGS,
  withSlope = false,
): CosExpiry {
  const { c1, c2, c4 } = cumulants(spec, T);
  const half =
    settings.width * Math.sqrt(c2 + Math.sqrt(c4)) + jumpExtent(spec, T) + eventExtent(spec, T);
  const a = c1 - half;
  const b = c1 + half;
  const step = Math.PI / (b - a);
  let capacity = Math.max(settings.minTerms, 4 * BLOCK);
  let wr: Float64Array = new Float64Array(capacity);
  let wi: Float64Array = new Float64Array(capacity);
  let re: Float64Array = new Float64Array(capacity);
  let im: Float64Array = new Float64Array(capacity);
  let slopeRe: Float64Array = new Float64Array(withSlope ? capacity : 0);
  let slopeIm: Float64Array = new Float64Array(withSlope ? capacity : 0);
  let n = 0;
  let capped = false;
  for (;;) {
    if (n + BLOCK > capacity) {
      capacity = Math.min(settings.maxTerms, capacity * 2);
      if (n + BLOCK > capacity) {
        capped = true;
        break;
      }
      wr = grow(wr, capacity);
      wi = grow(wi, capacity);
      re = grow(re, capacity);
      im = grow(im, capacity);
      if (withSlope) {
        slopeRe = grow(slopeRe, capacity);
        slopeIm = grow(slopeIm, capacity);
      }
    }
    for (let k = n; k < n + BLOCK; k++) wi[k] = k * step;
    logCharacteristic(
      spec,
      T,
      wr.subarray(n),
      wi.subarray(n),
      re.subarray(n),
      im.subarray(n),
      BLOCK,
      withSlope ? { re: slopeRe.subarray(n), im: slopeIm.subarray(n) } : undefined,
    );
    let blockMax = -Infinity;
    for (let k = n; k < n + BLOCK; k++) blockMax = Math.max(blockMax, re[k]);
    // The payoff coefficients fall like 1/(1 + u²), so that is the weight a neglected
    // characteristic-function value carries into a price (per unit forward).
    const uStart = n * step;
    n += BLOCK;
    if (
      n >= settings.minTerms &&
      Math.exp(blockMax) / (1 + uStart * uStart) < settings.tailTolerance
    )
      break;
  }
  const u = new Float64Array(n);
  const coef = new Float64Array(n);
  const scale = 2 / (b - a);
  for (let k = 0; k < n; k++) {
    const uk = k * step;
    u[k] = uk;
    // Re[e^{lnφ} e^{−i u a}] = e^{Re lnφ} cos(Im lnφ − u a)
    coef[k] = scale * Math.exp(re[k]) * Math.cos(im[k] - uk * a);
  }
  coef[0] *= 0.5;
  let slope: CosSlope | null = null;
  if (withSlope) {
    const coefSlope = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      // Re[φ·(s_r + i s_i)·e^{−iua}] = e^{Re lnφ}(s_r cos ϑ − s_i sin ϑ), ϑ = Im lnφ − u a
      const angle = im[k] - u[k] * a;
      coefSlope[k] =
        scale * Math.exp(re[k]) * (slopeRe[k] * Math.cos(angle) - slopeIm[k] * Math.sin(angle));
    }
    coefSlope[0] *= 0.5;
    slope = { coef: coefSlope, ...derivedSums(u, coefSlope) };
  }
  return {
    expiry: T,
    a,
    b,
    terms: n,
    u,
    coef,
    ...derivedSums(u, coef),
    capped,
    slope,
    variance: c2,
    diffusionVariance: diffusionVariance(spec, T),
  };
}

/** A_n/u_n, A_n/(1 + u_n²) and their strike-independent sums, for one set of coefficients. */
function derivedSums(u: Float64Array, coef: Float64Array) {
  const n = coef.length;
  const coefOverU = new Float64Array(n);
  const coefOverU2 = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    coefOverU[k] = k === 0 ? 0 : coef[k] / u[k];
    coefOverU2[k] = coef[k] / (1 + u[k] * u[k]);
  }
  let sumOverU2Tail = 0;
  let sumAltTail = 0;
  for (let k = 1; k < n; k++) {
    sumOverU2Tail += coefOverU2[k];
    sumAltTail += k % 2 === 1 ? -coefOverU2[k] : coefOverU2[k];
  }
  return { coefOverU, coefOverU2, sumOverU2Tail, sumAltTail };
}

function grow(arr: Float64Array, size: number): Float64Array {
  const out = new Float64Array(size);
  out.set(arr);
  return out;
}

/**
 * Undiscounted prices per unit forward, E[(e^Y − e^k)^+] (call) and E[(e^k − e^Y)^+] (put), with
 * the CDF and density of Y at k, for each log-moneyness k = ln(K/F). Writes into the arrays given.
 * With `timeSlope` (and a prep made with slopes) also ∂/∂τ of those prices at fixed k, the same
 * for the call and the put since parity holds at every τ.
 */
export function cosStrip(
  prep: CosExpiry,
  logMoneyness: ArrayLike<number>,
  call: Float64Array,
  put: Float64Array,
  cdf: Float64Array,
  density: Float64Array,
  timeSlope?: Float64Array,
): void {
  const { a, b } = prep;
  const a0 = prep.coef[0];
  const ea = Math.exp(a);
  const eb = Math.exp(b);
  const step = Math.PI / (b - a);
  // strikes inside (a, b) go through the series; the rest are settled here
  const inside: number[] = [];
  for (let j = 0; j < logMoneyness.length; j++) {
    const k = logMoneyness[j];
    const ek = Math.exp(k);
    if (k <= a) {
      put[j] = 0;
      call[j] = 1 - ek;
      cdf[j] = 0;
      density[j] = 0;
      if (timeSlope) timeSlope[j] = 0;
    } else if (k >= b) {
      call[j] = 0;
      put[j] = ek - 1;
      cdf[j] = 1;
      density[j] = 0;
      if (timeSlope) timeSlope[j] = 0;
    } else inside.push(j);
  }
  const m = inside.length;
  const deltas = new Float64Array(m);
  for (let i = 0; i < m; i++) deltas[i] = step * (logMoneyness[inside[i]] - a);
  const S = new Float64Array(m);
  const C = new Float64Array(m);
  const R = new Float64Array(m);
  stripSums(prep, deltas, m, S, C, R);
  const slope = timeSlope ? prep.slope : null;
  if (timeSlope && !slope) throw new Error('cosStrip: time slopes need prepareCos(..., true)');
  const dS = slope ? new Float64Array(m) : S;
  const dR = slope ? new Float64Array(m) : R;
  if (slope) slopeSums(prep, slope, deltas, m, dS, dR);
  for (let i = 0; i < m; i++) {
    const j = inside[i];
    const k = logMoneyness[j];
    const ek = Math.exp(k);
    const sumPsi = a0 * (k - a) + S[i]; // Σ A_n ψ_n(a, k)
    const sumChiK = ek * (a0 + R[i]); // Σ A_n (cos_n + u sin_n) e^k / (1 + u²)
    const sumChi = sumChiK - ea * (a0 + prep.sumOverU2Tail); // Σ A_n χ_n(a, k)
    if (k < 0 || b > DIRECT_CALL_LIMIT) {
      // put on [a, k]: V_n = e^k ψ_n(a, k) − χ_n(a, k)
      const p = ek * sumPsi - sumChi;
      put[j] = Math.max(p, 0);
      call[j] = put[j] + 1 - ek;
      if (slope && timeSlope) {
        const d0 = slope.coef[0];
        timeSlope[j] =
          ek * (d0 * (k - a) + dS[i]) - ek * (d0 + dR[i]) + ea * (d0 + slope.sumOverU2Tail);
      }
    } else {
      // call on [k, b]: V_n = χ_n(k, b) − e^k ψ_n(k, b), with ψ_0(k, b) = b − k, ψ_n = −sin_n/u_n
      const sumAlt = eb * (a0 + prep.sumAltTail); // Σ A_n (−1)^n e^b / (1 + u²)
      const psiKB = a0 * (b - k) - S[i];
      const c = sumAlt - sumChiK - ek * psiKB;
      call[j] = Math.max(c, 0);
      put[j] = call[j] - 1 + ek;
      if (slope && timeSlope) {
        const d0 = slope.coef[0];
        timeSlope[j] =
          eb * (d0 + slope.sumAltTail) - ek * (d0 + dR[i]) - ek * (d0 * (b - k) - dS[i]);
      }
    }
    cdf[j] = Math.min(1, Math.max(0, sumPsi));
    density[j] = Math.max(0, a0 + C[i]);
  }
}

/** Density of Y at y from the cosine series, f(y) = Σ' A_n cos(u_n (y − a)). */
export function cosDensity(prep: CosExpiry, y: number): number {
  if (y <= prep.a || y >= prep.b) return 0;
  let sum = 0;
  for (let n = 0; n < prep.terms; n++) sum += prep.coef[n] * Math.cos(prep.u[n] * (y - prep.a));
  return Math.max(0, sum);
}
