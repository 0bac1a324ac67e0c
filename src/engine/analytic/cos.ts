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
import { stripSums, stripSumsWithSlope } from './cos-sums';
import { cosSeries, type CosSeries, type TableAllocator } from './cos-series';
import { jumpSplitParts, type MixturePart } from './cos-jump-split';
import { lawRange } from './cos-range';

export type { CosSeries, CosSlope } from './cos-series';

export interface CosSettings {
  /** probability left below the range and forward above it (see `truncation-range.ts`) */
  tailMass: number;
  /**
   * the price's neglected terms, Σ|φ(u_n)|/(1 + u_n²), below this (with `trimTerms: false`:
   * every term of the last whole block below it)
   */
  tailTolerance: number;
  /** and the density's neglected terms, Σ (2/(b − a))|φ(u_n)|, below this */
  densityTolerance: number;
  minTerms: number;
  maxTerms: number;
  /**
   * Whether a series ends at the term its tolerances ask for (true), or at the end of the block
   * of terms in which they were met. Whole blocks change the count less often as parameters move,
   * which keeps finite-difference derivatives of coarse trial prices smooth.
   */
  trimTerms: boolean;
}

export const DEFAULT_COS_SETTINGS: CosSettings = {
  tailMass: 1e-14,
  tailTolerance: 1e-14,
  densityTolerance: 1e-10,
  minTerms: 32,
  maxTerms: 1 << 16,
  trimTerms: true,
};

/**
 * One expiry's prepared series or, at short expiries with jumps, two weighted parts: with and
 * without a jump before T (see `cos-jump-split.ts`).
 */
export interface CosExpiry extends CosSeries {
  expiry: number;
  /** variance of Y (second cumulant) and of its diffusive part alone */
  variance: number;
  diffusionVariance: number;
  /** when set, Y's law is Σ weight·part and the top-level series is empty */
  parts: MixturePart[] | null;
}

/**
 * Above this upper bound the call coefficients carry e^b and cancel badly (Fang & Oosterlee
 * section 3.3), so calls are priced from puts by parity instead.
 */
const DIRECT_CALL_LIMIT = 5;

/** A mixture's top-level series holds no terms. */
const EMPTY = new Float64Array(0);

/**
 * Prepares one expiry's series. With `withSlope`, the coefficients' time slopes come from the
 * same characteristic-function values (∂A_n/∂τ = (2/(b − a)) Re[φ(u_n)·∂τ ln φ(u_n)·e^{−i u_n a}],
 * the range held), so a calendar theta needs no second or third strip. `allocate` places the
 * series' tables (see `TableArena`), for a caller that drops the preparation after use.
 */
export function prepareCos(
  spec: ModelSpec,
  T: number,
  settings: CosSettings = DEFAULT_COS_SETTINGS,
  withSlope = false,
  allocate?: TableAllocator,
): CosExpiry {
  const cum = cumulants(spec, T);
  const { a, b } = lawRange(spec, T, settings.tailMass, cum);
  const parts = jumpSplitParts(spec, T, settings, withSlope, { a, b }, allocate);
  if (parts) {
    return {
      // the range a single series would take: where the law lives, for callers that grid it
      a,
      b,
      terms: parts.reduce((sum, p) => sum + p.series.terms, 0),
      table: EMPTY,
      stride: 4,
      a0: 0,
      sumOverU2Tail: 0,
      sumAltTail: 0,
      capped: parts.some((p) => p.series.capped),
      slope: null,
      mean: 1,
      meanSlope: 0,
      expiry: T,
      variance: cum.c2,
      diffusionVariance: diffusionVariance(spec, T),
      parts,
    };
  }
  const series = cosSeries(
    a,
    b,
    settings,
    withSlope,
    (wr, wi, re, im, count, slope) => logCharacteristic(spec, T, wr, wi, re, im, count, slope),
    { allocate },
  );
  return {
    ...series,
    expiry: T,
    variance: cum.c2,
    diffusionVariance: diffusionVariance(spec, T),
    parts: null,
  };
}

/**
 * Undiscounted prices per unit forward, E[(e^Y − e^k)^+] (call) and E[(e^k − e^Y)^+] (put), with
 * the CDF and density of Y at k, for each log-moneyness k = ln(K/F). Writes into the arrays given.
 * With `timeSlope` (and a prep made with slopes) also ∂/∂τ of those prices at fixed k, the same
 * for the call and the put since parity holds at every τ (E[e^Y] = 1).
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
  if (prep.parts) mixtureStrip(prep.parts, logMoneyness, call, put, cdf, density, timeSlope);
  else seriesStrip(prep, logMoneyness, call, put, cdf, density, timeSlope);
}

/**
 * Working arrays for a strip's strikes, kept between calls (each engine runs in one thread) and
 * grown when a strip has more strikes; every value read is written first in the same call.
 */
interface Scratch {
  values: Float64Array[];
  indices: Int32Array;
}
const SERIES_SCRATCH: Scratch = { values: [], indices: new Int32Array(0) };
const MIXTURE_SCRATCH: Scratch = { values: [], indices: new Int32Array(0) };

function workingArrays(scratch: Scratch, n: number): Scratch {
  if (scratch.indices.length < n) {
    const size = Math.max(64, n);
    scratch.values = Array.from({ length: 7 }, () => new Float64Array(size));
    scratch.indices = new Int32Array(size);
  }
  return scratch;
}

/** `cosStrip` for weighted parts: each part's strip, weighted; the weights move with τ too. */
function mixtureStrip(
  parts: readonly MixturePart[],
  logMoneyness: ArrayLike<number>,
  call: Float64Array,
  put: Float64Array,
  cdf: Float64Array,
  density: Float64Array,
  timeSlope?: Float64Array,
): void {
  const n = logMoneyness.length;
  // one part's values (seriesStrip's own working arrays are another set)
  const [c, p, f, d, partSlope] = workingArrays(MIXTURE_SCRATCH, n).values;
  const s = timeSlope ? partSlope : undefined;
  for (const out of [call, put, cdf, density, timeSlope]) out?.fill(0);
  for (const part of parts) {
    seriesStrip(part.series, logMoneyness, c, p, f, d, s);
    const w = part.weight;
    for (let j = 0; j < n; j++) {
      call[j] += w * c[j];
      put[j] += w * p[j];
      cdf[j] += w * f[j];
      density[j] += w * d[j];
      if (timeSlope && s) {
        // the put's slope; the call's is the same since Σ weight·mean = 1 at every τ
        timeSlope[j] += w * s[j] + part.weightSlope * p[j];
      }
    }
  }
}

/**
 * `cosStrip` for one series, whose law need not be a martingale's: parity and the settled
 * strikes use its E[e^Y] (`mean`), and `timeSlope` gets the put's slope.
 */
export function seriesStrip(
  prep: CosSeries,
  logMoneyness: ArrayLike<number>,
  call: Float64Array,
  put: Float64Array,
  cdf: Float64Array,
  density: Float64Array,
  timeSlope?: Float64Array,
): void {
  const { a, b, mean } = prep;
  const a0 = prep.a0;
  const ea = Math.exp(a);
  const eb = Math.exp(b);
  const step = Math.PI / (b - a);
  const work = workingArrays(SERIES_SCRATCH, logMoneyness.length);
  const [deltas, S, C, R, dS, dR, expK] = work.values;
  const insideAt = work.indices;
  // strikes inside (a, b) go through the series; the rest are settled here
  let m = 0;
  for (let j = 0; j < logMoneyness.length; j++) {
    const k = logMoneyness[j];
    const ek = Math.exp(k);
    if (k <= a) {
      put[j] = 0;
      call[j] = mean - ek;
      cdf[j] = 0;
      density[j] = 0;
      if (timeSlope) timeSlope[j] = 0;
    } else if (k >= b) {
      call[j] = 0;
      put[j] = ek - mean;
      cdf[j] = 1;
      density[j] = 0;
      if (timeSlope) timeSlope[j] = -prep.meanSlope;
    } else {
      deltas[m] = step * (k - a);
      expK[m] = ek;
      insideAt[m++] = j;
    }
  }
  const slope = timeSlope ? prep.slope : null;
  if (timeSlope && !slope) throw new Error('cosStrip: time slopes need prepareCos(..., true)');
  if (slope) stripSumsWithSlope(prep, deltas, m, S, C, R, dS, dR);
  else stripSums(prep, deltas, m, S, C, R);
  for (let i = 0; i < m; i++) {
    const j = insideAt[i];
    const k = logMoneyness[j];
    const ek = expK[i];
    const sumPsi = a0 * (k - a) + S[i]; // Σ A_n ψ_n(a, k)
    const sumChiK = ek * (a0 + R[i]); // Σ A_n (cos_n + u sin_n) e^k / (1 + u²)
    const sumChi = sumChiK - ea * (a0 + prep.sumOverU2Tail); // Σ A_n χ_n(a, k)
    if (k < 0 || b > DIRECT_CALL_LIMIT) {
      // put on [a, k]: V_n = e^k ψ_n(a, k) − χ_n(a, k)
      const p = ek * sumPsi - sumChi;
      put[j] = Math.max(p, 0);
      call[j] = put[j] + mean - ek;
      if (slope && timeSlope) {
        const d0 = slope.a0;
        timeSlope[j] =
          ek * (d0 * (k - a) + dS[i]) - ek * (d0 + dR[i]) + ea * (d0 + slope.sumOverU2Tail);
      }
    } else {
      // call on [k, b]: V_n = χ_n(k, b) − e^k ψ_n(k, b), with ψ_0(k, b) = b − k, ψ_n = −sin_n/u_n
      const sumAlt = eb * (a0 + prep.sumAltTail); // Σ A_n (−1)^n e^b / (1 + u²)
      const psiKB = a0 * (b - k) - S[i];
      const c = sumAlt - sumChiK - ek * psiKB;
      call[j] = Math.max(c, 0);
      put[j] = call[j] - mean + ek;
      if (slope && timeSlope) {
        const d0 = slope.a0;
        timeSlope[j] =
          eb * (d0 + slope.sumAltTail) -
          ek * (d0 + dR[i]) -
          ek * (d0 * (b - k) - dS[i]) -
          prep.meanSlope;
      }
    }
    cdf[j] = Math.min(1, Math.max(0, sumPsi));
    density[j] = Math.max(0, a0 + C[i]);
  }
}
