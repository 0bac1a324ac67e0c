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
  /** variance of Y (second cumulant) and of its diffusive part alone */
  variance: number;
  diffusionVariance: number;
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

export function prepareCos(
  spec: ModelSpec,
  T: number,
  settings: CosSettings = DEFAULT_COS_SETTINGS,
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
  return {
    expiry: T,
    a,
    b,
    terms: n,
    u,
    coef,
    coefOverU,
    coefOverU2,
    sumOverU2Tail,
    sumAltTail,
    capped,
    variance: c2,
    diffusionVariance: diffusionVariance(spec, T),
  };
}

function grow(arr: Float64Array, size: number): Float64Array {
  const out = new Float64Array(size);
  out.set(arr);
  return out;
}

/**
 * Undiscounted prices per unit forward, E[(e^Y − e^k)^+] (call) and E[(e^k − e^Y)^+] (put), with
 * the CDF and density of Y at k, for each log-moneyness k = ln(K/F). Writes into the arrays given.
 */
/**
 * The strike-dependent sums of the COS series for angles Δ_j = π(k_j − a)/(b − a):
 * S_j = Σ_{n≥1} (A_n/u_n) sin nΔ_j, C_j = Σ_{n≥1} A_n cos nΔ_j and
 * R_j = Σ_{n≥1} A_n (cos nΔ_j + u_n sin nΔ_j)/(1 + u_n²). cos/sin of nΔ come from a rotation
 * recurrence; four strikes advance together so their dependency chains overlap in the CPU.
 */
function stripSums(
  prep: CosExpiry,
  deltas: Float64Array,
  count: number,
  S: Float64Array,
  C: Float64Array,
  R: Float64Array,
): void {
  const { terms, u, coef, coefOverU, coefOverU2 } = prep;
  let j = 0;
  for (; j + 4 <= count; j += 4) {
    const cd0 = Math.cos(deltas[j]),
      sd0 = Math.sin(deltas[j]);
    const cd1 = Math.cos(deltas[j + 1]),
      sd1 = Math.sin(deltas[j + 1]);
    const cd2 = Math.cos(deltas[j + 2]),
      sd2 = Math.sin(deltas[j + 2]);
    const cd3 = Math.cos(deltas[j + 3]),
      sd3 = Math.sin(deltas[j + 3]);
    let c0 = 1,
      s0 = 0,
      c1 = 1,
      s1 = 0,
      c2 = 1,
      s2 = 0,
      c3 = 1,
      s3 = 0;
    let S0 = 0,
      S1 = 0,
      S2 = 0,
      S3 = 0,
      C0 = 0,
      C1 = 0,
      C2 = 0,
      C3 = 0,
      R0 = 0,
      R1 = 0,
      R2 = 0,
      R3 = 0;
    for (let n = 1; n < terms; n++) {
      const an = coef[n],
        au = coefOverU[n],
        a2 = coefOverU2[n],
        un = u[n];
      let t = c0 * cd0 - s0 * sd0;
      s0 = s0 * cd0 + c0 * sd0;
      c0 = t;
      t = c1 * cd1 - s1 * sd1;
      s1 = s1 * cd1 + c1 * sd1;
      c1 = t;
      t = c2 * cd2 - s2 * sd2;
      s2 = s2 * cd2 + c2 * sd2;
      c2 = t;
      t = c3 * cd3 - s3 * sd3;
      s3 = s3 * cd3 + c3 * sd3;
      c3 = t;
      S0 += au * s0;
      S1 += au * s1;
      S2 += au * s2;
      S3 += au * s3;
      C0 += an * c0;
      C1 += an * c1;
      C2 += an * c2;
      C3 += an * c3;
      R0 += a2 * (c0 + un * s0);
      R1 += a2 * (c1 + un * s1);
      R2 += a2 * (c2 + un * s2);
      R3 += a2 * (c3 + un * s3);
    }
    S[j] = S0;
    S[j + 1] = S1;
    S[j + 2] = S2;
    S[j + 3] = S3;
    C[j] = C0;
    C[j + 1] = C1;
    C[j + 2] = C2;
    C[j + 3] = C3;
    R[j] = R0;
    R[j + 1] = R1;
    R[j + 2] = R2;
    R[j + 3] = R3;
  }
  for (; j < count; j++) {
    const cd = Math.cos(deltas[j]);
    const sd = Math.sin(deltas[j]);
    let cn = 1,
      sn = 0,
      sS = 0,
      sC = 0,
      sR = 0;
    for (let n = 1; n < terms; n++) {
      const t = cn * cd - sn * sd;
      sn = sn * cd + cn * sd;
      cn = t;
      sS += coefOverU[n] * sn;
      sC += coef[n] * cn;
      sR += coefOverU2[n] * (cn + u[n] * sn);
    }
    S[j] = sS;
    C[j] = sC;
    R[j] = sR;
  }
}

/**
 * Undiscounted prices per unit forward, E[(e^Y − e^k)^+] (call) and E[(e^k − e^Y)^+] (put), with
 * the CDF and density of Y at k, for each log-moneyness k = ln(K/F). Writes into the arrays given.
 */
export function cosStrip(
  prep: CosExpiry,
  logMoneyness: ArrayLike<number>,
  call: Float64Array,
  put: Float64Array,
  cdf: Float64Array,
  density: Float64Array,
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
    } else if (k >= b) {
      call[j] = 0;
      put[j] = ek - 1;
      cdf[j] = 1;
      density[j] = 0;
    } else inside.push(j);
  }
  const m = inside.length;
  const deltas = new Float64Array(m);
  for (let i = 0; i < m; i++) deltas[i] = step * (logMoneyness[inside[i]] - a);
  const S = new Float64Array(m);
  const C = new Float64Array(m);
  const R = new Float64Array(m);
  stripSums(prep, deltas, m, S, C, R);
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
    } else {
      // call on [k, b]: V_n = χ_n(k, b) − e^k ψ_n(k, b), with ψ_0(k, b) = b − k, ψ_n = −sin_n/u_n
      const sumAlt = eb * (a0 + prep.sumAltTail); // Σ A_n (−1)^n e^b / (1 + u²)
      const psiKB = a0 * (b - k) - S[i];
      const c = sumAlt - sumChiK - ek * psiKB;
      call[j] = Math.max(c, 0);
      put[j] = call[j] - 1 + ek;
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
