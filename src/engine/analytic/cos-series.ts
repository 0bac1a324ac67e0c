/**
 * One COS series (Fang & Oosterlee 2008, see `cos.ts`) on a range [a, b]: the characteristic
 * function is evaluated in blocks until it has decayed, then turned into the cosine coefficients
 * and the sums every strike shares.
 */
import type { TimeSlopeOut } from './characteristic';
import type { CosSettings } from './cos';

/** ln φ at w = wr + i·wi (and its time slope when asked), as `logCharacteristic` writes it. */
export type LogCf = (
  wr: Float64Array,
  wi: Float64Array,
  re: Float64Array,
  im: Float64Array,
  count: number,
  slope?: TimeSlopeOut,
) => void;

/** ∂/∂τ of the series' coefficients and of their strike-independent sums. */
export interface CosSlope {
  coef: Float64Array;
  coefOverU: Float64Array;
  coefOverU2: Float64Array;
  sumOverU2Tail: number;
  sumAltTail: number;
}

export interface CosSeries {
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
  /** E[e^Y] under this series' law (1 unless it is one part of a mixture) and its τ-slope */
  mean: number;
  meanSlope: number;
}

/** Characteristic-function values are computed, and the tail tested, this many at a time. */
const BLOCK = 64;

/**
 * Working arrays for the characteristic-function values, kept between calls (each engine runs
 * in one thread) and grown when a series needs more terms; only the coefficients are allocated.
 */
const SCRATCH_START = 1024;
let scratch: Record<'wr' | 'wi' | 're' | 'im' | 'slopeRe' | 'slopeIm', Float64Array> = {
  wr: new Float64Array(SCRATCH_START),
  wi: new Float64Array(SCRATCH_START),
  re: new Float64Array(SCRATCH_START),
  im: new Float64Array(SCRATCH_START),
  slopeRe: new Float64Array(SCRATCH_START),
  slopeIm: new Float64Array(SCRATCH_START),
};

/**
 * The series of a law on [a, b]. With `withSlope`, the coefficients' time slopes come from the
 * same characteristic-function values (∂A_n/∂τ = (2/(b − a)) Re[φ(u_n)·∂τ ln φ(u_n)·e^{−i u_n a}],
 * the range held), so a calendar theta needs no second or third strip.
 */
export function cosSeries(
  a: number,
  b: number,
  settings: CosSettings,
  withSlope: boolean,
  logCf: LogCf,
  block = BLOCK,
): CosSeries {
  const step = Math.PI / (b - a);
  let capacity = Math.min(settings.maxTerms, scratch.wr.length);
  let { wr, wi, re, im, slopeRe, slopeIm } = scratch;
  wr.fill(0);
  let n = 0;
  let capped = false;
  for (;;) {
    if (n + block > capacity) {
      if (capacity >= settings.maxTerms) {
        capped = true;
        break;
      }
      capacity = Math.min(settings.maxTerms, capacity * 2);
      wr = grow(wr, capacity);
      wi = grow(wi, capacity);
      re = grow(re, capacity);
      im = grow(im, capacity);
      slopeRe = grow(slopeRe, capacity);
      slopeIm = grow(slopeIm, capacity);
      scratch = { wr, wi, re, im, slopeRe, slopeIm };
    }
    for (let k = n; k < n + block; k++) wi[k] = k * step;
    logCf(
      wr.subarray(n),
      wi.subarray(n),
      re.subarray(n),
      im.subarray(n),
      block,
      withSlope ? { re: slopeRe.subarray(n), im: slopeIm.subarray(n) } : undefined,
    );
    let blockMax = -Infinity;
    for (let k = n; k < n + block; k++) blockMax = Math.max(blockMax, re[k]);
    // The payoff coefficients fall like 1/(1 + u²), so that is the weight a neglected
    // characteristic-function value carries into a price (per unit forward).
    const uStart = n * step;
    n += block;
    if (
      n >= settings.minTerms &&
      Math.exp(blockMax) / (1 + uStart * uStart) < settings.tailTolerance
    )
      break;
  }
  const u = new Float64Array(n);
  const coef = new Float64Array(n);
  const coefSlope = withSlope ? new Float64Array(n) : null;
  const scale = 2 / (b - a);
  for (let k = 0; k < n; k++) {
    const uk = k * step;
    u[k] = uk;
    // Re[e^{lnφ} e^{−i u a}] = e^{Re lnφ} cos ϑ, ϑ = Im lnφ − u a
    const modulus = Math.exp(re[k]);
    const angle = im[k] - uk * a;
    const cosine = Math.cos(angle);
    coef[k] = scale * modulus * cosine;
    // Re[φ·(s_r + i s_i)·e^{−iua}] = e^{Re lnφ}(s_r cos ϑ − s_i sin ϑ)
    if (coefSlope)
      coefSlope[k] = scale * modulus * (slopeRe[k] * cosine - slopeIm[k] * Math.sin(angle));
  }
  coef[0] *= 0.5;
  let slope: CosSlope | null = null;
  if (coefSlope) {
    coefSlope[0] *= 0.5;
    slope = { coef: coefSlope, ...derivedSums(u, coefSlope) };
  }
  return {
    a,
    b,
    terms: n,
    u,
    coef,
    ...derivedSums(u, coef),
    capped,
    slope,
    mean: 1,
    meanSlope: 0,
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
  if (arr.length >= size) return arr;
  const out = new Float64Array(size);
  out.set(arr);
  return out;
}
