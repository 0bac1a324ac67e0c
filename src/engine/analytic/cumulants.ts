/**
 * Cumulants of Y = ln(S_T/F) from the log moment-generating function ψ(w) = ln E[e^{wY}] on
 * the real line, by central differences at ±h, ±2h (ψ(0) = 0). They only set the COS
 * truncation range, so a few digits suffice; h is scaled to the distribution's width.
 */
import { logCharacteristic, logCharacteristicAt, type ModelSpec } from './characteristic';
import { expectedJumps } from '../core/model-spec';
import { moveVariance, touches } from '../core/scheduled-moves';

export interface Cumulants {
  c1: number;
  c2: number;
  c4: number;
}

/** Expected integrated variance of the diffusive part over [0, T]. */
export function diffusionVariance(spec: ModelSpec, T: number): number {
  const d = spec.diffusion;
  if (d.type === 'constant') return d.variance * T;
  const kt = d.kappa * T;
  const decay = kt > 1e-8 ? -Math.expm1(-kt) / d.kappa : T;
  // variance jumps lift the long-run level to θ + λ̄μV/κ (λ̄ the average intensity to T)
  const j = spec.jumps;
  const theta =
    j.type === 'price-variance'
      ? d.theta + (expectedJumps(spec, T) / T) * (j.varianceJumpMean / d.kappa)
      : d.theta;
  return theta * T + (d.v0 - theta) * decay;
}

/** Variance of the scheduled moves that touch an expiry T. */
export function scheduledVariance(spec: ModelSpec, T: number): number {
  let v = 0;
  if (spec.events) for (const e of spec.events) if (touches(e.time, T)) v += moveVariance(e);
  return v;
}

/**
 * A rough variance of Y that needs no moments: expected integrated variance plus jump variance
 * plus the scheduled moves' variance.
 */
export function roughVariance(spec: ModelSpec, T: number): number {
  let v = diffusionVariance(spec, T);
  const j = spec.jumps;
  const lt = expectedJumps(spec, T);
  if (j.type === 'lognormal') v += lt * (j.jumpMean * j.jumpMean + j.jumpStdev * j.jumpStdev);
  if (j.type === 'price-variance') {
    // E[Z_S²] = σS² + (μS + ρJμV)² + ρJ²μV²
    const m = j.jumpMean + j.jumpCorrelation * j.varianceJumpMean;
    v += lt * (j.jumpStdev ** 2 + m * m + (j.jumpCorrelation * j.varianceJumpMean) ** 2);
  }
  if (j.type === 'double-exponential') {
    v += lt * (2 * j.upProbability * j.upMean ** 2 + 2 * (1 - j.upProbability) * j.downMean ** 2);
  }
  return Math.max(v + scheduledVariance(spec, T), 1e-16);
}

/**
 * Whether E[e^{wY}] is finite at real w for every T. For Heston the log-MGF is a real,
 * finite function of T when β = κ − ρξw > 0 and d² = β² + ξ²(w − w²) ≥ 0 (then |g| < 1 and
 * 1 − g e^{−dT} stays positive); d² is concave in w, so checking the ends of [−2h, 2h]
 * covers the interval.
 */
function momentsFinite(spec: ModelSpec, T: number, w: number): boolean {
  const d = spec.diffusion;
  if (d.type === 'heston') {
    const beta = d.kappa - d.rho * d.volOfVol * w;
    if (!(beta > 0) || beta * beta + d.volOfVol * d.volOfVol * (w - w * w) < 0) return false;
  }
  const j = spec.jumps;
  if (j.type === 'double-exponential') {
    if (w * j.upMean >= 1 || -w * j.downMean >= 1) return false;
  }
  if (j.type === 'price-variance' && d.type === 'heston') {
    // E[e^{(D + wρJ)Z_V}] needs (D + wρJ)μV < 1; D(w, τ) is monotone in τ for real w, so the
    // largest is at τ = T: D is ln φ of the variance part alone with v0 = 1 and θ = 0
    const D = logCharacteristicAt(
      { diffusion: { ...d, v0: 1, theta: 0 }, jumps: { type: 'none' } },
      T,
      w,
      0,
    )[0];
    if (!((Math.max(D, 0) + w * j.jumpCorrelation) * j.varianceJumpMean < 1)) return false;
  }
  return true;
}

export function cumulants(spec: ModelSpec, T: number): Cumulants {
  const rough = roughVariance(spec, T);
  let h = 0.1 / Math.sqrt(rough);
  const j = spec.jumps;
  if (j.type === 'double-exponential') {
    if (j.upMean > 0) h = Math.min(h, 0.2 / j.upMean);
    if (j.downMean > 0) h = Math.min(h, 0.2 / j.downMean);
  }
  h = Math.min(h, 0.2); // stay well inside (−∞, 1] where E[S_T^w] is finite for any martingale
  for (let attempt = 0; attempt < 12; attempt++) {
    if (!momentsFinite(spec, T, 2 * h) || !momentsFinite(spec, T, -2 * h)) {
      h *= 0.5;
      continue;
    }
    const w = Float64Array.of(h, -h, 2 * h, -2 * h);
    const lnM = new Float64Array(4);
    logCharacteristic(spec, T, w, new Float64Array(4), lnM, new Float64Array(4), 4);
    const [p1, m1, p2, m2] = lnM;
    const c1 = (8 * (p1 - m1) - (p2 - m2)) / (12 * h);
    const c2 = (16 * (p1 + m1) - (p2 + m2)) / (12 * h * h);
    const c4 = (p2 + m2 - 4 * (p1 + m1)) / (h * h * h * h);
    if ([c1, c2, c4].every(Number.isFinite) && c2 > 0) return { c1, c2, c4: Math.abs(c4) };
    h *= 0.5;
  }
  return { c1: -0.5 * rough, c2: rough, c4: 0 };
}
