/**
 * The jump part of ln E[e^{wY}] for SVCJ (Duffie, Pan & Singleton 2000, "Transform analysis and
 * asset pricing for affine jump-diffusions", Econometrica 68, section 3): jumps arrive at rate λ,
 * the variance gains Z_V ~ Exp(mean μV) and ln S gains Z_S | Z_V ~ N(μS + ρJ·Z_V, σS²). With D(τ)
 * Heston's variance coefficient at time to go τ, the jump term is
 *   Σ_k λ_k ∫ (E[e^{w Z_S + D(τ) Z_V}] − 1) dτ − w·m·Λ(T),
 *   E[e^{w Z_S + D Z_V}] = e^{wμS + ½w²σS²} / (a₀ − μV·D),   a₀ = 1 − wρJμV,
 *   m = e^{μS + ½σS²}/(1 − ρJμV) − 1.
 * With D(τ) = A(1 − e^{−dτ})/(1 − g e^{−dτ}) (the "little trap" form of `characteristic.ts`),
 * 1/(a₀ − μV·D) = (1 − g e^{−dτ})/(P − Q e^{−dτ}), P = a₀ − μV·A, Q = a₀g − μV·A, whose integral
 * is, in closed form (DPS 2000 integrate the same rational function of e^{−dτ}),
 *   J(τ) = τ/P − (μV·A/(a₀ d P))·(1 − e^{−dτ})·L(z),   z = Q(1 − e^{−dτ})/(a₀(1 − g)),
 * with L(z) = ln(1 + z)/z (1 at z = 0). Written this way the logarithm is ln(1 + z) on its
 * principal branch, every division that could vanish at w = 0 has cancelled, and ρJ·μV → 0 or
 * μV → 0 reduce smoothly to Bates.
 */
import type { JumpLaw } from '../core/model-spec';

type PriceVariance = Extract<JumpLaw, { type: 'price-variance' }>;

/** A stretch of time to go (τ from lo to hi) at one intensity. */
export interface IntensitySegment {
  lo: number;
  hi: number;
  rate: number;
}

/** ln(1 + z)/z for complex z, written to (out[0], out[1]). */
function log1pOverZ(zr: number, zi: number, out: Float64Array): void {
  const m = zr * zr + zi * zi;
  if (m < 1e-16) {
    out[0] = 1 - 0.5 * zr + (zr * zr - zi * zi) / 3;
    out[1] = -0.5 * zi + (2 * zr * zi) / 3;
    return;
  }
  const lr = 0.5 * Math.log1p(2 * zr + m);
  const li = Math.atan2(zi, 1 + zr);
  out[0] = (lr * zr + li * zi) / m;
  out[1] = (li * zr - lr * zi) / m;
}

/**
 * The SVCJ jump term at one w, given the Heston quantities the Heston kernel has just computed
 * for that w (A = −q/(β + d), g, d and 1 − e^{−dT}), so nothing is computed twice; writes
 * (re, im) into `out`, and θ0 = e^{wμS + ½w²σS²} after them.
 */
export type PriceVarianceTerm = (
  a: number,
  b: number,
  Ar: number,
  Ai: number,
  gr: number,
  gi: number,
  dr: number,
  di: number,
  omTr: number,
  omTi: number,
  out: Float64Array,
) => void;

/** The SVCJ jump term for one expiry T, its intensity segments and total Λ(T). */
export function priceVarianceTerm(
  jl: PriceVariance,
  segments: readonly IntensitySegment[],
  totalIntensity: number,
  T: number,
): PriceVarianceTerm {
  const { jumpMean: muS, jumpStdev: sS, varianceJumpMean: muV, jumpCorrelation: rhoJ } = jl;
  const hv = 0.5 * sS * sS;
  const kbar = Math.exp(muS + hv) / (1 - rhoJ * muV) - 1;
  const L = new Float64Array(2);
  const live = segments.filter((seg) => seg.rate > 0 && seg.hi > seg.lo);
  return (a, b, Ar, Ai, gr, gi, dr, di, omTr, omTi, out) => {
    // a₀ = 1 − wρJμV, P = a₀ − μV A, Q = a₀ g − μV A
    const a0r = 1 - a * rhoJ * muV;
    const a0i = -b * rhoJ * muV;
    const Pr = a0r - muV * Ar;
    const Pi = a0i - muV * Ai;
    const Qr = a0r * gr - a0i * gi - muV * Ar;
    const Qi = a0r * gi + a0i * gr - muV * Ai;
    // 1/P, and c = μV A/(a₀ d P)
    const pm = Pr * Pr + Pi * Pi;
    const iPr = Pr / pm;
    const iPi = -Pi / pm;
    const denr0 = a0r * dr - a0i * di;
    const deni0 = a0r * di + a0i * dr;
    const denr = denr0 * Pr - deni0 * Pi;
    const deni = denr0 * Pi + deni0 * Pr;
    const dm = denr * denr + deni * deni;
    const nr = muV * Ar;
    const ni = muV * Ai;
    const cr = (nr * denr + ni * deni) / dm;
    const ci = (ni * denr - nr * deni) / dm;
    // Q/(a₀(1 − g)), for z
    const er0 = a0r * (1 - gr) + a0i * gi;
    const ei0 = a0i * (1 - gr) - a0r * gi;
    const em = er0 * er0 + ei0 * ei0;
    const qer = (Qr * er0 + Qi * ei0) / em;
    const qei = (Qi * er0 - Qr * ei0) / em;
    // θ0 = e^{wμS + ½w²σS²}
    const tr0 = muS * a + hv * (a * a - b * b);
    const ti0 = muS * b + hv * 2 * a * b;
    const tm = Math.exp(tr0);
    const thr = tm * Math.cos(ti0);
    const thi = tm * Math.sin(ti0);
    let sumR = 0;
    let sumI = 0;
    for (const seg of live) {
      // J(hi) − J(lo)
      let Jr = 0;
      let Ji = 0;
      for (let side = 0; side < 2; side++) {
        const tau = side === 0 ? seg.hi : seg.lo;
        if (tau === 0) continue;
        const sign = side === 0 ? 1 : -1;
        // om = 1 − e^{−dτ}: the Heston kernel's at τ = T; else with expm1 and
        // 1 − cos x = 2 sin²(x/2) against cancellation
        let omr: number;
        let omi: number;
        if (tau === T) {
          omr = omTr;
          omi = omTi;
        } else {
          const sHalf = Math.sin(0.5 * di * tau);
          omr = -(Math.expm1(-dr * tau) * Math.cos(di * tau) - 2 * sHalf * sHalf);
          omi = Math.exp(-dr * tau) * Math.sin(di * tau);
        }
        const zr = qer * omr - qei * omi;
        const zi = qer * omi + qei * omr;
        log1pOverZ(zr, zi, L);
        // c·om·L
        const t1r = cr * omr - ci * omi;
        const t1i = cr * omi + ci * omr;
        const t2r = t1r * L[0] - t1i * L[1];
        const t2i = t1r * L[1] + t1i * L[0];
        Jr += sign * (tau * iPr - t2r);
        Ji += sign * (tau * iPi - t2i);
      }
      // λ_k (θ0·ΔJ − Δτ)
      sumR += seg.rate * (thr * Jr - thi * Ji - (seg.hi - seg.lo));
      sumI += seg.rate * (thr * Ji + thi * Jr);
    }
    out[0] = sumR - a * kbar * totalIntensity;
    out[1] = sumI - b * kbar * totalIntensity;
    // θ0, for the time slope's jump share (`PriceVarianceRate`)
    out[2] = thr;
    out[3] = thi;
  };
}

/**
 * λ(0)·(E[e^{wZ_S + D·Z_V}] − 1 − w·m), the jump share of ln φ's time slope, at one w and D,
 * given θ0 = e^{wμS + ½w²σS²} as the jump term has just computed it.
 */
export type PriceVarianceRate = (
  a: number,
  b: number,
  Dr: number,
  Di: number,
  thr: number,
  thi: number,
  out: Float64Array,
) => void;

export function priceVarianceRate(jl: PriceVariance, lambdaNow: number): PriceVarianceRate {
  const { jumpMean: muS, jumpStdev: sS, varianceJumpMean: muV, jumpCorrelation: rhoJ } = jl;
  const kbar = Math.exp(muS + 0.5 * sS * sS) / (1 - rhoJ * muV) - 1;
  return (a, b, Dr, Di, thr, thi, out) => {
    // θ0 / (1 − wρJμV − μV·D)
    const pr = 1 - a * rhoJ * muV - muV * Dr;
    const pi = -b * rhoJ * muV - muV * Di;
    const pm = pr * pr + pi * pi;
    out[0] = lambdaNow * ((thr * pr + thi * pi) / pm - 1 - a * kbar);
    out[1] = lambdaNow * ((thi * pr - thr * pi) / pm - b * kbar);
  };
}

/** The intensity schedule over [0, T] as stretches of time to go τ = T − s, each at one rate. */
export function intensitySegments(
  base: number,
  schedule: ReadonlyArray<readonly [number, number]> | undefined,
  T: number,
): IntensitySegment[] {
  if (!schedule || schedule.length === 0) return [{ lo: 0, hi: T, rate: base }];
  const out: IntensitySegment[] = [];
  let start = 0;
  for (const [end, rate] of schedule) {
    if (start >= T) break;
    const stop = Math.min(end, T);
    out.push({ lo: T - stop, hi: T - start, rate });
    start = stop;
  }
  if (start < T) out.push({ lo: 0, hi: T - start, rate: base });
  return out;
}
