/**
 * Log characteristic functions of Y = ln(S_T / F_T) (the log-return over the forward, so that
 * E[e^Y] = 1) for every model, at complex arguments. Everything is written in w = iu, i.e.
 * ln E[e^{wY}]: w = i·u for the Fourier transform (COS), w = ½ + i·u for the Lewis integral,
 * real w for moments. Complex arithmetic is inlined on (re, im) pairs: this is the hot loop.
 */
import { expectedJumps, type Diffusion, type JumpLaw, type ModelSpec } from '../core/model-spec';
import {
  intensityAt,
  touches,
  twoPointOutcomes,
  type ScheduledMove,
} from '../core/scheduled-moves';
import {
  intensitySegments,
  priceVarianceRate,
  priceVarianceTerm,
  type PriceVarianceRate,
  type PriceVarianceTerm,
} from './svcj';

export { modelSpec } from '../core/models';
export type { Diffusion, JumpLaw, ModelSpec } from '../core/model-spec';

/**
 * Where the time slope of ln φ goes: ∂/∂τ ln E[e^{wY}] when the valuation moves back by τ with
 * the expiry, dated risk and the intensity schedule held at their calendar dates (so −∂/∂t, the
 * calendar theta's direction). For an affine model ln φ = C + D·v0 solves the backward equation,
 * so this slope is the generator at the valuation date applied to e^{wY + C + Dv} (Duffie, Pan &
 * Singleton 2000, section 2):
 *   v0·(½(w² − w) − βD + ½ξ²D²) + κθD + λ(0)·(E[e^{wZ_S + D·Z_V}] − 1 − w·m̄),
 * with the scheduled moves (still ahead) contributing nothing.
 */
export interface TimeSlopeOut {
  re: Float64Array;
  im: Float64Array;
}

/**
 * Writes ln E[e^{wY}] for w = wr[j] + i·wi[j], j < count, into (outRe, outIm), and when `slope`
 * is given its time slope (see `TimeSlopeOut`) too.
 */
export function logCharacteristic(
  spec: ModelSpec,
  T: number,
  wr: Float64Array,
  wi: Float64Array,
  outRe: Float64Array,
  outIm: Float64Array,
  count: number,
  slope?: TimeSlopeOut,
): void {
  const d = spec.diffusion;
  if (d.type === 'constant') {
    const half = 0.5 * d.variance * T;
    for (let j = 0; j < count; j++) {
      const a = wr[j];
      const b = wi[j];
      // ½σ²T (w² − w)
      outRe[j] = half * (a * a - b * b - a);
      outIm[j] = half * (2 * a * b - b);
      if (slope) {
        slope.re[j] = (half / T) * (a * a - b * b - a);
        slope.im[j] = (half / T) * (2 * a * b - b);
      }
    }
  }
  const jl = spec.jumps;
  // a time-varying intensity enters European prices only through Λ(T) = ∫₀ᵀ λ(s) ds
  const lt = expectedJumps(spec, T);
  // and their time slope through the intensity now
  const lambdaNow =
    jl.type === 'none' ? 0 : intensityAt(jl.jumpIntensity, spec.intensitySchedule, 0);
  if (d.type === 'heston') {
    // SVCJ's jump term needs the Heston kernel's quantities at each w: computed alongside
    const withJumps =
      jl.type === 'price-variance' && lt > 0
        ? priceVarianceTerm(
            jl,
            intensitySegments(jl.jumpIntensity, spec.intensitySchedule, T),
            lt,
            T,
          )
        : null;
    // it reads θ0 from the jump term, so it runs only beside it
    const jumpRate =
      slope && withJumps && jl.type === 'price-variance' && lambdaNow > 0
        ? priceVarianceRate(jl, lambdaNow)
        : null;
    hestonLogCf(d, T, wr, wi, outRe, outIm, count, withJumps, slope, jumpRate);
  }
  const rate = slope ? { out: slope, lambda: lambdaNow } : undefined;
  if (jl.type === 'lognormal' && (lt > 0 || lambdaNow > 0)) {
    addLognormalJumps(jl, lt, wr, wi, outRe, outIm, count, rate);
  }
  if (jl.type === 'double-exponential' && (lt > 0 || lambdaNow > 0)) {
    addDoubleExponentialJumps(jl, lt, wr, wi, outRe, outIm, count, rate);
  }
  if (spec.events) {
    for (const e of spec.events)
      if (touches(e.time, T)) addScheduledMove(e, wr, wi, outRe, outIm, count);
  }
}

/**
 * A scheduled move X, independent of the rest, multiplies the characteristic function by
 * E[e^{wX}] (common practice for a deterministic-time jump):
 * normal, X ~ N(−s²/2, s²): ln E[e^{wX}] = ½s²(w² − w);
 * two-point, X = x₊ w.p. p else x₋: ln(p e^{w x₊} + (1 − p) e^{w x₋}). Only e^{ln φ} is ever
 * used, so the branch of the complex logarithm does not matter.
 */
function addScheduledMove(
  e: ScheduledMove,
  wr: Float64Array,
  wi: Float64Array,
  outRe: Float64Array,
  outIm: Float64Array,
  count: number,
): void {
  if (e.law === 'normal') {
    const half = 0.5 * e.stdev * e.stdev;
    for (let j = 0; j < count; j++) {
      const a = wr[j];
      const b = wi[j];
      outRe[j] += half * (a * a - b * b - a);
      outIm[j] += half * (2 * a * b - b);
    }
    return;
  }
  const { up, down, p } = twoPointOutcomes(e);
  for (let j = 0; j < count; j++) {
    const a = wr[j];
    const b = wi[j];
    // factor out the larger real exponent so neither term overflows
    const top = p === 0 ? a * down : p === 1 ? a * up : Math.max(a * up, a * down);
    const mu = p * Math.exp(a * up - top);
    const md = (1 - p) * Math.exp(a * down - top);
    const sr = mu * Math.cos(b * up) + md * Math.cos(b * down);
    const si = mu * Math.sin(b * up) + md * Math.sin(b * down);
    outRe[j] += top + 0.5 * Math.log(sr * sr + si * si);
    outIm[j] += Math.atan2(si, sr);
  }
}

/** Where SVCJ's jump term writes its four values for one w (each is read before the next call). */
const JUMP_TERM_OUT = new Float64Array(4);

/**
 * Heston in the "little Heston trap" form (Albrecher, Mayer, Schoutens & Tistaert 2007), with
 * the ξ² divisions cancelled analytically so ξ → 0 (and ξ = 0) is exact:
 *   β = κ − ρξw, q = w − w², d = √(β² + ξ²q), g = (β − d)/(β + d) = −ξ²q/(β + d)²,
 *   D = −q/(β + d) · (1 − e^{−dT})/(1 − g e^{−dT}),
 *   C = κθ [−qT/(β + d) − (2/ξ²) ln(1 + g(1 − e^{−dT})/(1 − g))],   ln φ = C + D·v0.
 */
function hestonLogCf(
  h: Extract<Diffusion, { type: 'heston' }>,
  T: number,
  wr: Float64Array,
  wi: Float64Array,
  outRe: Float64Array,
  outIm: Float64Array,
  count: number,
  jumpTerm: PriceVarianceTerm | null = null,
  slope?: TimeSlopeOut,
  jumpRate: PriceVarianceRate | null = null,
): void {
  const { v0, kappa, theta, volOfVol: xi, rho } = h;
  const extra = JUMP_TERM_OUT;
  const xi2 = xi * xi;
  const kt = kappa * theta;
  const twoOverXi2 = 2 / xi2;
  for (let j = 0; j < count; j++) {
    const a = wr[j];
    const b = wi[j];
    if (a === 0 && b === 0) {
      outRe[j] = 0;
      outIm[j] = 0;
      if (slope) {
        slope.re[j] = 0;
        slope.im[j] = 0;
      }
      continue;
    }
    // q = w − w²
    const qr = a - (a * a - b * b);
    const qi = b - 2 * a * b;
    // β = κ − ρξw
    const br = kappa - rho * xi * a;
    const bi = -rho * xi * b;
    // d = √(β² + ξ² q), principal branch (Re d ≥ 0)
    const zr = br * br - bi * bi + xi2 * qr;
    const zi = 2 * br * bi + xi2 * qi;
    const mod = Math.sqrt(zr * zr + zi * zi);
    let dr: number, di: number;
    if (zr >= 0) {
      dr = Math.sqrt(0.5 * (mod + zr));
      di = dr > 0 ? zi / (2 * dr) : 0;
    } else {
      di = Math.sqrt(0.5 * (mod - zr));
      if (zi < 0) di = -di;
      dr = zi / (2 * di);
    }
    // s = β + d and its inverse
    const sr = br + dr;
    const si = bi + di;
    const invSm = 1 / (sr * sr + si * si);
    const isr = sr * invSm;
    const isi = -si * invSm;
    // m = −q/s
    const mr = -(qr * isr - qi * isi);
    const mi = -(qr * isi + qi * isr);
    // gHat = g/ξ² = m/s
    const ghr = mr * isr - mi * isi;
    const ghi = mr * isi + mi * isr;
    const gr = xi2 * ghr;
    const gi = xi2 * ghi;
    // e = e^{−dT}; om = 1 − e = −expm1(−dT)
    const er0 = Math.exp(-dr * T);
    const c = Math.cos(di * T);
    const sn = Math.sin(di * T);
    const er = er0 * c;
    const ei = -er0 * sn;
    let omr: number;
    if (dr * T < 1e-3 && Math.abs(di * T) < 1e-3) {
      // near dT = 0, 1 − Re e^{−dT} cancels: use expm1 and 1 − cos x = 2 sin²(x/2)
      const sHalf = Math.sin(0.5 * di * T);
      omr = -(Math.expm1(-dr * T) * c - 2 * sHalf * sHalf);
    } else {
      omr = 1 - er;
    }
    const omi = -ei;
    // den = 1 − g e
    const denr = 1 - (gr * er - gi * ei);
    const deni = -(gr * ei + gi * er);
    const invDm = 1 / (denr * denr + deni * deni);
    // D = m · om / den
    const nr = mr * omr - mi * omi;
    const ni = mr * omi + mi * omr;
    const Dr = (nr * denr + ni * deni) * invDm;
    const Di = (ni * denr - nr * deni) * invDm;
    // zHat = gHat · om / (1 − g)
    const ogr = 1 - gr;
    const ogi = -gi;
    const invOgm = 1 / (ogr * ogr + ogi * ogi);
    const tr = ghr * omr - ghi * omi;
    const ti = ghr * omi + ghi * omr;
    const zhr = (tr * ogr + ti * ogi) * invOgm;
    const zhi = (ti * ogr - tr * ogi) * invOgm;
    // (2/ξ²) ln(1 + u), u = ξ² zHat; where u is so small that 2/ξ² would amplify ln's
    // rounding, 2 zHat (1 − u/2 + u²/3) instead
    const ur = xi2 * zhr;
    const ui = xi2 * zhi;
    const um = ur * ur + ui * ui;
    let logr: number, logi: number;
    if (um < 1e-16) {
      const Lr = 1 - 0.5 * ur + (ur * ur - ui * ui) / 3;
      const Li = -0.5 * ui + (2 * ur * ui) / 3;
      logr = 2 * (zhr * Lr - zhi * Li);
      logi = 2 * (zhr * Li + zhi * Lr);
    } else {
      logr = twoOverXi2 * 0.5 * Math.log1p(2 * ur + um);
      logi = twoOverXi2 * Math.atan2(ui, 1 + ur);
    }
    // C = κθ (m T − (2/ξ²) ln(1 + ξ² zHat))
    const Cr = kt * (mr * T - logr);
    const Ci = kt * (mi * T - logi);
    outRe[j] = Cr + v0 * Dr;
    outIm[j] = Ci + v0 * Di;
    if (jumpTerm) {
      jumpTerm(a, b, mr, mi, gr, gi, dr, di, omr, omi, extra);
      outRe[j] += extra[0];
      outIm[j] += extra[1];
    }
    if (slope) {
      // dD/dτ = −½q − βD + ½ξ²D² (the Riccati equation D solves), dC/dτ = κθD
      const bdr = br * Dr - bi * Di;
      const bdi = br * Di + bi * Dr;
      const d2r = Dr * Dr - Di * Di;
      const d2i = 2 * Dr * Di;
      slope.re[j] = v0 * (-0.5 * qr - bdr + 0.5 * xi2 * d2r) + kt * Dr;
      slope.im[j] = v0 * (-0.5 * qi - bdi + 0.5 * xi2 * d2i) + kt * Di;
      if (jumpRate) {
        // the jump term just left θ0 in extra[2], extra[3]
        jumpRate(a, b, Dr, Di, extra[2], extra[3], extra);
        slope.re[j] += extra[0];
        slope.im[j] += extra[1];
      }
    }
  }
}

/** A jump law's share of the time slope: λ(0)·(E[e^{wZ}] − 1 − w·m̄), added to `out`. */
interface JumpRateOut {
  out: TimeSlopeOut;
  lambda: number;
}

/** Below this, e^x − 1 rounds to −1 in double precision (e^x < 2^−54). */
const EXPM1_IS_MINUS_ONE = -38;

/** Merton (1976) jumps: Λ(e^{wμ + ½δ²w²} − 1) − wΛ(e^{μ + ½δ²} − 1), Λ = λT for a constant λ. */
function addLognormalJumps(
  jl: Extract<JumpLaw, { type: 'lognormal' }>,
  lt: number,
  wr: Float64Array,
  wi: Float64Array,
  outRe: Float64Array,
  outIm: Float64Array,
  count: number,
  rate?: JumpRateOut,
): void {
  const mu = jl.jumpMean;
  const hv = 0.5 * jl.jumpStdev * jl.jumpStdev;
  const kbar = Math.expm1(mu + hv);
  for (let j = 0; j < count; j++) {
    const a = wr[j];
    const b = wi[j];
    const er = mu * a + hv * (a * a - b * b);
    const ei = mu * b + hv * 2 * a * b;
    let xr: number, xi: number;
    if (er < EXPM1_IS_MINUS_ONE) {
      // far out in u the jump's own term has vanished: e^{e} − 1 is −1
      xr = -1;
      xi = 0;
    } else {
      // e^{e} − 1 = (e^{er} − 1)cos ei − (1 − cos ei) + i e^{er} sin ei, from expm1 and the
      // half angle so that neither part cancels when e is small
      const sHalf = Math.sin(0.5 * ei);
      const twoS2 = 2 * sHalf * sHalf;
      const em1 = Math.expm1(er);
      xr = em1 * (1 - twoS2) - twoS2;
      xi = (1 + em1) * (2 * sHalf * Math.cos(0.5 * ei));
    }
    outRe[j] += lt * (xr - a * kbar);
    outIm[j] += lt * (xi - b * kbar);
    if (rate) {
      rate.out.re[j] += rate.lambda * (xr - a * kbar);
      rate.out.im[j] += rate.lambda * (xi - b * kbar);
    }
  }
}

/**
 * Kou (2002) double-exponential jumps with up probability p, mean sizes m1 = 1/η1, m2 = 1/η2:
 * Λ(p/(1 − w m1) + (1 − p)/(1 + w m2) − 1) − wΛζ, ζ = p/(1 − m1) + (1 − p)/(1 + m2) − 1.
 */
function addDoubleExponentialJumps(
  jl: Extract<JumpLaw, { type: 'double-exponential' }>,
  lt: number,
  wr: Float64Array,
  wi: Float64Array,
  outRe: Float64Array,
  outIm: Float64Array,
  count: number,
  rate?: JumpRateOut,
): void {
  const { upProbability: p, upMean: m1, downMean: m2 } = jl;
  const zeta = p / (1 - m1) + (1 - p) / (1 + m2) - 1;
  for (let j = 0; j < count; j++) {
    const a = wr[j];
    const b = wi[j];
    // p/(1 − w m1) − p = p w m1 / (1 − w m1)
    const d1r = 1 - a * m1;
    const d1i = -b * m1;
    const d1m = d1r * d1r + d1i * d1i;
    const n1r = p * m1 * a;
    const n1i = p * m1 * b;
    const t1r = (n1r * d1r + n1i * d1i) / d1m;
    const t1i = (n1i * d1r - n1r * d1i) / d1m;
    // (1 − p)/(1 + w m2) − (1 − p) = −(1 − p) w m2 / (1 + w m2)
    const d2r = 1 + a * m2;
    const d2i = b * m2;
    const d2m = d2r * d2r + d2i * d2i;
    const n2r = -(1 - p) * m2 * a;
    const n2i = -(1 - p) * m2 * b;
    const t2r = (n2r * d2r + n2i * d2i) / d2m;
    const t2i = (n2i * d2r - n2r * d2i) / d2m;
    outRe[j] += lt * (t1r + t2r - a * zeta);
    outIm[j] += lt * (t1i + t2i - b * zeta);
    if (rate) {
      rate.out.re[j] += rate.lambda * (t1r + t2r - a * zeta);
      rate.out.im[j] += rate.lambda * (t1i + t2i - b * zeta);
    }
  }
}

/** Scalar convenience (not for hot loops): ln E[e^{wY}] at one complex w. */
export function logCharacteristicAt(
  spec: ModelSpec,
  T: number,
  wRe: number,
  wIm: number,
): [number, number] {
  const wr = new Float64Array([wRe]);
  const wi = new Float64Array([wIm]);
  const re = new Float64Array(1);
  const im = new Float64Array(1);
  logCharacteristic(spec, T, wr, wi, re, im, 1);
  return [re[0], im[0]];
}
