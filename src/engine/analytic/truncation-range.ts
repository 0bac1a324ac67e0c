/**
 * The COS range [a, b] from Chernoff's bound on the law's tails, for a tail mass the caller
 * sets. With M(p) = E[e^{pY}]:
 *   P(Y < a) ≤ M(p)·e^{−pa} for p < 0, and E[e^Y; Y > b] ≤ M(p)·e^{−(p−1)b} for p > 1,
 * so a = max over p < 0 of (ln ε − ln M(p))/|p| and b = min over p > 1 of (ln M(p) − ln ε)/(p − 1)
 * leave at most ε of probability below a and of forward above b. Unlike a fixed multiple of
 * √(c2 + √c4) (Fang & Oosterlee 2008, section 5.1) the range follows each tail: short on Heston's
 * thin side, long on its fat one, whichever way ρ points. Junike & Pankrashkin (2022), "Precise
 * option pricing by the COS method — how to choose the truncation range", bound the range by
 * Markov's inequality on a moment; Chernoff's is the same inequality on e^{pY}.
 *
 * M(p) is finite only on an interval around [0, 1]: Heston's variance makes moments explode
 * after a finite time (Andersen & Piterbarg 2007, "Moment explosions in stochastic volatility
 * models"), exponential jump laws have finite moments only below their rates. The candidates
 * for p are tried outward from [0, 1] and stop at the first one outside that interval.
 */
import type { Diffusion, JumpLaw, ModelSpec } from '../core/model-spec';

/** ln E[e^{pY}] at real p[j], j < count, into out. */
export type LogMoment = (p: Float64Array, out: Float64Array, count: number) => void;

export interface TruncationRange {
  a: number;
  b: number;
}

/**
 * The time at which E[e^{pY}] of Heston's diffusion part becomes infinite: the blow-up time of
 * D' = ½ξ²D² + (ρξp − κ)D + ½(p² − p), D(0) = 0, written in closed form (Infinity if never).
 */
export function hestonExplosionTime(h: Extract<Diffusion, { type: 'heston' }>, p: number): number {
  const qa = 0.5 * h.volOfVol * h.volOfVol;
  const qb = h.rho * h.volOfVol * p - h.kappa;
  const qc = 0.5 * (p * p - p);
  if (qc <= 0) return Infinity; // 0 ≤ p ≤ 1: M(p) ≤ 1
  const disc = qb * qb - 4 * qa * qc;
  if (disc >= 0) {
    // real roots, both of the sign of −qb: D settles at the first root if they are positive
    if (qb < 0) return Infinity;
    const s = Math.sqrt(disc);
    return s > 1e-12 * qb ? Math.log((qb + s) / (qb - s)) / s : 2 / qb;
  }
  // no real root: ∫₀^∞ dD/(qa D² + qb D + qc)
  const s = Math.sqrt(-disc);
  return (2 / s) * (0.5 * Math.PI - Math.atan(qb / s));
}

/** D(p, T) of the same Riccati equation at a real p before its explosion time. */
export function hestonMomentExponent(
  h: Extract<Diffusion, { type: 'heston' }>,
  p: number,
  T: number,
): number {
  const qa = 0.5 * h.volOfVol * h.volOfVol;
  const qb = h.rho * h.volOfVol * p - h.kappa;
  const qc = 0.5 * (p * p - p);
  const disc = qb * qb - 4 * qa * qc;
  if (Math.abs(disc) <= 1e-14 * qb * qb) {
    // double root r: 1/(r − D) − 1/r = qa·T
    const r = -qb / (2 * qa);
    return r - 1 / (qa * T + 1 / r);
  }
  if (disc > 0) {
    // (D − r2)/(D − r1) = (r2/r1)·e^{√disc·T}
    const s = Math.sqrt(disc);
    const r1 = (-qb - s) / (2 * qa);
    const r2 = (-qb + s) / (2 * qa);
    const q = (r2 / r1) * Math.exp(s * T);
    return (r2 - q * r1) / (1 - q);
  }
  const s = Math.sqrt(-disc);
  return (s * Math.tan(0.5 * s * T + Math.atan(qb / s)) - qb) / (2 * qa);
}

/** Whether E[e^{pY}] is finite at T for the spec's diffusion and jumps (scheduled moves always are). */
export function momentIsFinite(
  spec: Pick<ModelSpec, 'diffusion' | 'jumps'>,
  p: number,
  T: number,
): boolean {
  const d = spec.diffusion;
  if (d.type === 'heston' && !(hestonExplosionTime(d, p) > T)) return false;
  return jumpMomentIsFinite(spec.jumps, d, p, T);
}

function jumpMomentIsFinite(j: JumpLaw, d: Diffusion, p: number, T: number): boolean {
  if (j.type === 'double-exponential') return p < 1 / j.upMean && p > -1 / j.downMean;
  if (j.type === 'price-variance') {
    // E[e^{pZ_S + D·Z_V}] = e^{pμ + ½p²σ²}/(1 − μ_V(pρ_J + D)) for every D(s), s ≤ T, that a jump
    // can meet; D moves monotonically from 0, so its extremes are 0 and D(p, T)
    const dT = d.type === 'heston' ? hestonMomentExponent(d, p, T) : 0;
    return j.varianceJumpMean * (p * j.jumpCorrelation + Math.max(0, dT)) < 1;
  }
  return true;
}

/** Growth between candidate p's, and how many are tried on each side. */
const CANDIDATE_RATIO = 1.5;
const CANDIDATES = 16;

/**
 * The candidates and their ln M, kept between calls (each engine runs in one thread): a typed
 * array of more than a few elements costs microseconds to allocate, more than the bound itself.
 */
const CANDIDATE_SCRATCH = {
  p: new Float64Array(2 * CANDIDATES),
  lnM: new Float64Array(2 * CANDIDATES),
};

/**
 * The range for tail mass `tailMass`, given ln M, its domain test and the law's first two
 * cumulants (which place the first candidates: a normal law's best p is √(2 ln(1/ε)/c2)).
 * Null when no candidate gives a finite bound on a side.
 */
export function chernoffRange(
  logMoment: LogMoment,
  finiteAt: (p: number) => boolean,
  c2: number,
  tailMass: number,
): TruncationRange | null {
  const logEps = Math.log(tailMass);
  const gaussianBest = Math.sqrt((-2 * logEps) / c2);
  // outward from the gaussian optimum's 1/1.5^11: fat tails want a smaller p than a normal law
  const first = gaussianBest / CANDIDATE_RATIO ** (CANDIDATES - 5);
  const { p, lnM } = CANDIDATE_SCRATCH;
  const lowerCount = candidates(p, 0, -1, first, finiteAt);
  const count = lowerCount + candidates(p, lowerCount, 1, first, finiteAt);
  logMoment(p, lnM, count);
  let a = -Infinity;
  let b = Infinity;
  for (let i = 0; i < count; i++) {
    if (!Number.isFinite(lnM[i])) continue;
    if (p[i] < 0) a = Math.max(a, (logEps - lnM[i]) / -p[i]);
    else b = Math.min(b, (lnM[i] - logEps) / (p[i] - 1));
  }
  return Number.isFinite(a) && Number.isFinite(b) && a < b ? { a, b } : null;
}

/**
 * Writes the candidates on one side into p from `at`: −x_i below 0 (side −1) or 1 + x_i above 1
 * (side +1), x_i = first·1.5^i, up to the first outside the moments' domain; returns how many.
 */
function candidates(
  p: Float64Array,
  at: number,
  side: -1 | 1,
  first: number,
  finiteAt: (p: number) => boolean,
): number {
  let x = first;
  for (let i = 0; i < CANDIDATES; i++, x *= CANDIDATE_RATIO) {
    const candidate = side < 0 ? -x : 1 + x;
    if (!finiteAt(candidate)) return i;
    p[at + i] = candidate;
  }
  return CANDIDATES;
}
