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
 * The candidates, and the ones evaluated with their ln M, kept between calls (each engine runs
 * in one thread): a typed array of more than a few elements costs microseconds to allocate,
 * more than the bound itself.
 */
const CANDIDATE_SCRATCH = {
  p: new Float64Array(2 * CANDIDATES),
  at: new Float64Array(2 * CANDIDATES),
  lnM: new Float64Array(2 * CANDIDATES),
  index: new Int32Array(2 * CANDIDATES),
};

/**
 * The range for tail mass `tailMass`, given ln M, its domain test and the law's first two
 * cumulants (which place the first candidates: a normal law's best p is √(2 ln(1/ε)/c2)).
 * Null when no candidate gives a finite bound on a side.
 *
 * Each side's bound is quasi-convex in p: for p > 1, with K = ln M convex and c = −ln ε > 0,
 * (K(p) + c)/(p − 1) has a derivative whose numerator K'(p)(p − 1) − K(p) − c only grows (its
 * slope is K''(p)(p − 1) ≥ 0); the side p < 0 is the mirror image. Along a side the candidates'
 * bounds therefore fall and then rise, and the best of all lies next to the best of every other
 * one: those are evaluated first, then the best one's two neighbours, which gives the same range
 * as evaluating all of them for 19 evaluations instead of 32.
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
  const { p, index } = CANDIDATE_SCRATCH;
  const lowerCount = candidates(p, 0, -1, first, finiteAt);
  const upperCount = candidates(p, CANDIDATES, 1, first, finiteAt);
  // every other candidate on each side
  let count = 0;
  for (let i = 0; i < lowerCount; i += 2) index[count++] = i;
  for (let i = 0; i < upperCount; i += 2) index[count++] = CANDIDATES + i;
  const bounds = { a: -Infinity, b: Infinity, lowerBest: -1, upperBest: -1 };
  evaluate(logMoment, logEps, count, bounds);
  // then the neighbours of each side's best
  count = neighbours(bounds.lowerBest, 0, lowerCount, 0);
  count = neighbours(bounds.upperBest, CANDIDATES, upperCount, count);
  evaluate(logMoment, logEps, count, bounds);
  const { a, b } = bounds;
  return Number.isFinite(a) && Number.isFinite(b) && a < b ? { a, b } : null;
}

/** Writes the neighbours of position `best` (−1: none) on a side into index from `count`. */
function neighbours(best: number, offset: number, sideCount: number, count: number): number {
  const { index } = CANDIDATE_SCRATCH;
  if (best < 0) return count;
  if (best > offset) index[count++] = best - 1;
  if (best + 1 < offset + sideCount) index[count++] = best + 1;
  return count;
}

/**
 * ln M at the candidates index[0..count) (positions in CANDIDATE_SCRATCH.p) in one call, and the
 * bounds they give folded into `bounds`, with the position of each side's best so far.
 */
function evaluate(
  logMoment: LogMoment,
  logEps: number,
  count: number,
  bounds: { a: number; b: number; lowerBest: number; upperBest: number },
): void {
  if (count === 0) return;
  const { p, at, lnM, index } = CANDIDATE_SCRATCH;
  for (let i = 0; i < count; i++) at[i] = p[index[i]];
  logMoment(at, lnM, count);
  for (let i = 0; i < count; i++) {
    if (!Number.isFinite(lnM[i])) continue;
    const q = at[i];
    if (q < 0) {
      const a = (logEps - lnM[i]) / -q;
      if (a > bounds.a) {
        bounds.a = a;
        bounds.lowerBest = index[i];
      }
    } else {
      const b = (lnM[i] - logEps) / (q - 1);
      if (b < bounds.b) {
        bounds.b = b;
        bounds.upperBest = index[i];
      }
    }
  }
}

/**
 * Writes the candidates on one side into p from `at`: −x_i below 0 (side −1) or 1 + x_i above 1
 * (side +1), x_i = first·1.5^i, up to the first outside the moments' domain; returns how many.
 * The domain of a moment generating function is an interval, so only every other candidate is
 * tested until one is outside, and then the one before it.
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
    p[at + i] = candidate;
    if (i % 2 === 1) continue;
    if (!finiteAt(candidate)) return i > 0 && finiteAt(p[at + i - 1]) ? i : Math.max(0, i - 1);
  }
  return finiteAt(p[at + CANDIDATES - 1]) ? CANDIDATES : CANDIDATES - 1;
}
