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

/** ∂/∂τ of the series' first coefficient and of its strike-independent sums. */
export interface CosSlope {
  /** ∂A_0/∂τ, halved as A_0 is */
  a0: number;
  sumOverU2Tail: number;
  sumAltTail: number;
}

export interface CosSeries {
  a: number;
  b: number;
  terms: number;
  /**
   * Term n's values at n·stride, interleaved so that the strike sums read them from one place:
   * A_n/u_n (0 for n = 0), A_n/(1 + u_n²), A_n, u_n = nπ/(b − a) and, with time slopes,
   * ∂A_n/∂τ/u_n and ∂A_n/∂τ/(1 + u_n²).
   */
  table: Float64Array;
  /** 6 with time slopes, else 4 */
  stride: number;
  /** A_0, halved as the series takes it */
  a0: number;
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

/**
 * Where a series' table goes: by default an array of its own; a caller that uses its series
 * and drops them (one pricing call, say) can hand out space in a buffer it reuses instead.
 */
export type TableAllocator = (size: number) => Float64Array;

export interface SeriesOptions {
  /** characteristic-function values computed at a time until the series has decayed */
  block?: number;
  /** a bound on |φ| that plans the terms before any is computed */
  envelope?: Envelope;
  allocate?: TableAllocator;
}

/**
 * Space for the tables of series used within one call and then dropped, in a buffer kept
 * between calls: each typed array of its own costs microseconds to make. `reset` at the start
 * of each call hands the space out again; only the tables of the calls since then are valid.
 */
export class TableArena {
  private buffer = new Float64Array(1 << 14);
  private used = 0;

  reset(): void {
    this.used = 0;
  }

  readonly allocate: TableAllocator = (size) => {
    if (this.used + size > this.buffer.length) {
      // the tables handed out so far keep the old buffer
      this.buffer = new Float64Array(Math.max(2 * this.buffer.length, size));
      this.used = 0;
    }
    const table = this.buffer.subarray(this.used, this.used + size);
    this.used += size;
    return table;
  };
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
  { block = BLOCK, envelope, allocate }: SeriesOptions = {},
): CosSeries {
  const step = Math.PI / (b - a);
  // with a bound on |φ| the terms are known before any is computed, and come in one call
  const planned = envelope && settings.trimTerms ? plannedTerms(envelope, step, settings) : 0;
  let capacity = Math.min(settings.maxTerms, scratch.wr.length);
  let { wr, wi, re, im, slopeRe, slopeIm } = scratch;
  let n = 0;
  let capped = false;
  const defaultBlock = block;
  let trimmed = -1;
  for (;;) {
    if (planned > 0) block = planned;
    while (n + block > capacity) {
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
    if (capped) break;
    for (let k = n; k < n + block; k++) {
      wr[k] = 0;
      wi[k] = k * step;
    }
    logCf(
      wr.subarray(n),
      wi.subarray(n),
      re.subarray(n),
      im.subarray(n),
      block,
      withSlope ? { re: slopeRe.subarray(n), im: slopeIm.subarray(n) } : undefined,
    );
    n += block;
    if (planned > 0) break;
    if (n < settings.minTerms) continue;
    if (!settings.trimTerms) {
      if (blockBelowTolerance(re, n - block, n, step, settings.tailTolerance)) break;
      continue;
    }
    // trimmed series stop as soon as their last terms are below the tolerance and the
    // neglected ones, extrapolated, allow an end among the computed terms; the next block
    // is sized to reach that point
    if (blockBelowTolerance(re, Math.max(0, n - STOP_SPAN), n, step, settings.tailTolerance)) {
      const end = trimmedLength(re, n, step, settings);
      if (end < n) {
        trimmed = end;
        break;
      }
    }
    block = Math.min(defaultBlock, Math.max(FINAL_BLOCK, termsToTolerance(re, n, step, settings)));
  }
  // the cut the stop found, or else (planned, capped) the one the computed terms allow
  if (settings.trimTerms) n = trimmed >= 0 ? trimmed : trimmedLength(re, n, step, settings);
  const stride = withSlope ? 6 : 4;
  const table = allocate ? allocate(n * stride) : new Float64Array(n * stride);
  const scale = 2 / (b - a);
  let sum = 0;
  let alt = 0;
  let slopeSum = 0;
  let slopeAlt = 0;
  let a0 = 0;
  let slopeA0 = 0;
  for (let k = 0, i = 0; k < n; k++, i += stride) {
    const uk = k * step;
    // the n = 0 term is halved
    const weight = k === 0 ? 0.5 * scale : scale;
    // Re[e^{lnφ} e^{−i u a}] = e^{Re lnφ} cos ϑ, ϑ = Im lnφ − u a
    const modulus = weight * Math.exp(re[k]);
    const angle = im[k] - uk * a;
    const cosine = Math.cos(angle);
    const overU = k === 0 ? 0 : 1 / uk;
    const overU2 = 1 / (1 + uk * uk);
    const value = modulus * cosine;
    const v2 = value * overU2;
    table[i] = value * overU;
    table[i + 1] = v2;
    table[i + 2] = value;
    table[i + 3] = uk;
    // Σ_{n≥1} A_n/(1 + u_n²) and Σ_{n≥1} (−1)^n A_n/(1 + u_n²)
    const odd = (k & 1) === 1;
    if (k === 0) a0 = value;
    else {
      sum += v2;
      alt += odd ? -v2 : v2;
    }
    if (!withSlope) continue;
    // Re[φ·(s_r + i s_i)·e^{−iua}] = e^{Re lnφ}(s_r cos ϑ − s_i sin ϑ)
    const slopeValue = modulus * (slopeRe[k] * cosine - slopeIm[k] * Math.sin(angle));
    const s2 = slopeValue * overU2;
    table[i + 4] = slopeValue * overU;
    table[i + 5] = s2;
    if (k === 0) slopeA0 = slopeValue;
    else {
      slopeSum += s2;
      slopeAlt += odd ? -s2 : s2;
    }
  }
  const slope = withSlope ? { a0: slopeA0, sumOverU2Tail: slopeSum, sumAltTail: slopeAlt } : null;
  return {
    a,
    b,
    terms: n,
    table,
    stride,
    a0,
    sumOverU2Tail: sum,
    sumAltTail: alt,
    capped,
    slope,
    mean: 1,
    meanSlope: 0,
  };
}

/**
 * A trimmed series stops only when its last STOP_SPAN terms are all below the price tolerance
 * (a law whose |φ| oscillates cannot end on one small value), and computes at least
 * FINAL_BLOCK terms at a time.
 */
const STOP_SPAN = 16;
const FINAL_BLOCK = 16;
/** The last terms whose rate of decay extrapolates a series' tail. */
const RATE_SPAN = 32;

/** Whether every term in [from, to) is below `tolerance` in the weight it carries into a price. */
function blockBelowTolerance(
  re: Float64Array,
  from: number,
  to: number,
  step: number,
  tolerance: number,
): boolean {
  let blockMax = -Infinity;
  for (let k = from; k < to; k++) blockMax = Math.max(blockMax, re[k]);
  // The payoff coefficients fall like 1/(1 + u²), so that is the weight a neglected
  // characteristic-function value carries into a price (per unit forward).
  const uStart = from * step;
  return Math.exp(blockMax) / (1 + uStart * uStart) < tolerance;
}

/**
 * How many more terms the last 32 terms' rate of decay says the series needs before its tail
 * is below both tolerances, with a few to spare; Infinity without a decay to extrapolate.
 */
function termsToTolerance(
  re: Float64Array,
  n: number,
  step: number,
  settings: CosSettings,
): number {
  const back = Math.min(RATE_SPAN, n - 1);
  const logRate = (re[n - 1] - re[n - 1 - back]) / back;
  if (!(logRate < 0)) return Infinity;
  const uEnd = (n - 1) * step;
  const tailFactor = -Math.log1p(-Math.exp(logRate)); // ln 1/(1 − r)
  const scale = (2 * step) / Math.PI;
  // ln of the tails after n − 1 + m terms: re + m·logRate + ln 1/(1 − r) + the weight
  const priceExcess =
    re[n - 1] + tailFactor - Math.log1p(uEnd * uEnd) - Math.log(settings.tailTolerance);
  const densityExcess =
    re[n - 1] + tailFactor + Math.log(scale) - Math.log(settings.densityTolerance);
  const terms = Math.ceil(Math.max(priceExcess, densityExcess, 0) / -logRate) + 4;
  // a value that is not a number (a characteristic function gone NaN) asks for a whole block
  return terms > 0 ? terms : Infinity;
}

/** An upper bound on |φ(u)| for u ≥ 0 that falls as u grows. */
export type Envelope = (u: number) => number;

/**
 * The terms an envelope asks for: the fewest n ≥ minTerms whose neglected terms, bounded by the
 * envelope, stay below both tolerances (see `trimmedLength`). The sums start where the
 * envelope has fallen to a thousandth of the tolerances, found by doubling, and run back from
 * there; a bound that falls like a Gaussian leaves nothing of weight beyond that point.
 */
function plannedTerms(envelope: Envelope, step: number, settings: CosSettings): number {
  const scale = (2 * step) / Math.PI;
  const { tailTolerance, densityTolerance, minTerms, maxTerms } = settings;
  // the bound at term k, and what it carries into a price
  const priceWeight = (k: number, bound: number) => bound / (1 + k * k * step * step);
  let end = minTerms;
  for (; end < maxTerms; end *= 2) {
    const bound = envelope(end * step);
    if (priceWeight(end, bound) < 1e-3 * tailTolerance && scale * bound < 1e-3 * densityTolerance)
      break;
  }
  if (end >= maxTerms) return maxTerms;
  let priceTail = 0;
  let densityTail = 0;
  for (let k = end - 1; k >= minTerms; k--) {
    const bound = envelope(k * step);
    priceTail += priceWeight(k, bound);
    densityTail += scale * bound;
    if (!(priceTail < tailTolerance && densityTail < densityTolerance)) return k + 1;
  }
  return minTerms;
}

/**
 * Where the computed terms can end: the fewest n ≥ minTerms whose neglected terms stay below
 * both tolerances, counted as the computed ones plus a geometric tail beyond them at the last
 * block's rate of decay. A price carries Σ_{m≥n} |φ(u_m)|/(1 + u_m²) of them (the payoff
 * coefficients fall like 1/(1 + u²)), the density (so gamma) Σ_{m≥n} (2/(b − a))|φ(u_m)|.
 * Without a decay to extrapolate, all stay.
 */
function trimmedLength(re: Float64Array, n: number, step: number, settings: CosSettings): number {
  const scale = (2 * step) / Math.PI;
  const density = (k: number) => scale * Math.exp(re[k]);
  const back = Math.min(RATE_SPAN, n - 1);
  const ratio = Math.pow(density(n - 1) / density(n - 1 - back), 1 / back);
  if (!(ratio < 1)) return n;
  const beyond = ratio / (1 - ratio);
  const uEnd = (n - 1) * step;
  let priceTail = (density(n - 1) / scale / (1 + uEnd * uEnd)) * beyond;
  let densityTail = density(n - 1) * beyond;
  let end = n;
  while (end > settings.minTerms) {
    const k = end - 1;
    const d = density(k);
    const nextPrice = priceTail + d / scale / (1 + k * k * step * step);
    const nextDensity = densityTail + d;
    if (!(nextPrice < settings.tailTolerance && nextDensity < settings.densityTolerance)) break;
    priceTail = nextPrice;
    densityTail = nextDensity;
    end = k;
  }
  return end;
}

function grow(arr: Float64Array, size: number): Float64Array {
  if (arr.length >= size) return arr;
  const out = new Float64Array(size);
  out.set(arr);
  return out;
}
