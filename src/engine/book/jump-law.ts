/**
 * How likely an instant gap of each ladder size is over a horizon: the probability of at least
 * one jump, 1 − e^{−Λ(h)} (Λ(h) = λh at a constant intensity), times the chance that a jump's size falls in the ladder point's bin
 * (single-jump approximation, fine for the day and week horizons it is drawn for).
 */
import { normCdf } from '../analytic/normal';
import { modelSpec } from '../core/models';
import { expectedJumps, type JumpLaw } from '../core/model-spec';
import type { Model } from '../core/types';

function logJumpCdf(jumps: JumpLaw, y: number): number {
  if (jumps.type === 'lognormal') {
    if (jumps.jumpStdev === 0) return y >= jumps.jumpMean ? 1 : 0;
    return normCdf((y - jumps.jumpMean) / jumps.jumpStdev);
  }
  if (jumps.type === 'price-variance') return priceVarianceCdf(jumps, y);
  if (jumps.type === 'double-exponential') {
    const { upProbability: p, upMean: m1, downMean: m2 } = jumps;
    if (y < 0) return m2 > 0 ? (1 - p) * Math.exp(y / m2) : 0;
    return 1 - (m1 > 0 ? p * Math.exp(-y / m1) : 0);
  }
  return y >= 0 ? 1 : 0;
}

/**
 * CDF of the SVCJ log-jump Z_S = μS + σS·N + ρJ·Z_V, Z_V exponential with mean μV: a normal
 * plus (ρJ > 0) or minus (ρJ < 0) an exponential of rate c = 1/(|ρJ|μV), the exponentially
 * modified Gaussian (common practice):
 *   plus:  Φ(x) − e^{−c(y−μ) + c²σ²/2} Φ(x − cσ),   minus: Φ(x) + e^{c(y−μ) + c²σ²/2} Φ(−x − cσ),
 * with x = (y − μ)/σ; products formed in logs so neither factor overflows.
 */
function priceVarianceCdf(j: Extract<JumpLaw, { type: 'price-variance' }>, y: number): number {
  const mu = j.jumpMean;
  const sd = j.jumpStdev;
  const scale = Math.abs(j.jumpCorrelation) * j.varianceJumpMean;
  if (scale === 0) return sd === 0 ? (y >= mu ? 1 : 0) : normCdf((y - mu) / sd);
  const c = 1 / scale;
  if (sd === 0) {
    // a shifted exponential, up or down
    const t = (y - mu) * Math.sign(j.jumpCorrelation);
    const tail = t <= 0 ? 1 : Math.exp(-c * t);
    return j.jumpCorrelation > 0 ? 1 - tail : tail;
  }
  const x = (y - mu) / sd;
  const term = (a: number, b: number) => {
    const p = normCdf(b);
    return p > 0 ? Math.exp(a + Math.log(p)) : 0;
  };
  const half = 0.5 * c * c * sd * sd;
  const value =
    j.jumpCorrelation > 0
      ? normCdf(x) - term(-c * (y - mu) + half, x - c * sd)
      : normCdf(x) + term(c * (y - mu) + half, -x - c * sd);
  return Math.min(1, Math.max(0, value));
}

/** Probability, per horizon, that a jump lands in the bin around each move (moves ascending). */
export function jumpMoveProbabilities(
  model: Model,
  moves: readonly number[],
  horizonYears: number,
): number[] {
  const spec = modelSpec(model);
  const jumps = spec.jumps;
  // the expected count over the horizon honours an intensity schedule
  const count = expectedJumps(spec, horizonYears);
  if (count === 0 || moves.length === 0) return moves.map(() => 0);
  const atLeastOne = -Math.expm1(-count);
  return moves.map((m, i) => {
    const lo = i === 0 ? -0.9999 : 0.5 * (moves[i - 1] + m);
    const hi =
      i === moves.length - 1 ? m + (m - (moves[i - 1] ?? m - 0.01)) / 2 : 0.5 * (m + moves[i + 1]);
    const yLo = Math.log(Math.max(1 + lo, 1e-12));
    const yHi = Math.log(Math.max(1 + hi, 1e-12));
    return atLeastOne * Math.max(0, logJumpCdf(jumps, yHi) - logJumpCdf(jumps, yLo));
  });
}

/**
 * Density of one log-jump: normal (Merton), asymmetric double exponential (Kou), or SVCJ's
 * normal plus a signed exponential, the exponentially modified Gaussian
 * c·e^{−c(y−μ) + c²σ²/2}·Φ(x − cσ) (mirrored for ρJ < 0), x = (y − μ)/σ, c = 1/(|ρJ|μV).
 */
export function logJumpDensity(jumps: JumpLaw, y: number): number {
  if (jumps.type === 'lognormal') {
    const z = (y - jumps.jumpMean) / jumps.jumpStdev;
    return Math.exp(-0.5 * z * z) / (jumps.jumpStdev * Math.sqrt(2 * Math.PI));
  }
  if (jumps.type === 'double-exponential') {
    const { upProbability: p, upMean: m1, downMean: m2 } = jumps;
    if (y >= 0) return m1 > 0 ? (p / m1) * Math.exp(-y / m1) : 0;
    return m2 > 0 ? ((1 - p) / m2) * Math.exp(y / m2) : 0;
  }
  if (jumps.type === 'price-variance') {
    const { jumpMean: mu, jumpStdev: sd, jumpCorrelation: rho, varianceJumpMean: muV } = jumps;
    const scale = Math.abs(rho) * muV;
    const sign = Math.sign(rho);
    if (scale === 0) return logJumpDensity({ ...jumps, type: 'lognormal' }, y);
    const c = 1 / scale;
    const t = (y - mu) * sign; // the exponential's side made positive
    if (sd === 0) return t >= 0 ? c * Math.exp(-c * t) : 0;
    const x = t / sd;
    const p = normCdf(x - c * sd);
    return p > 0 ? c * Math.exp(-c * t + 0.5 * c * c * sd * sd + Math.log(p)) : 0;
  }
  return 0;
}

/**
 * Where a log-jump's density lives, for quadrature: break points (panels between each pair,
 * a kink sits on one) and panels per piece; a single point for a jump of fixed size; null
 * without jumps. Beyond the range the mass is below 1e-20.
 */
export function logJumpRange(
  jumps: JumpLaw,
): { breaks: number[]; panels: number; point?: number } | null {
  if (jumps.type === 'none') return null;
  if (
    jumps.type === 'lognormal' ||
    (jumps.type === 'price-variance' && jumps.varianceJumpMean === 0)
  ) {
    if (jumps.jumpStdev === 0) return { breaks: [], panels: 0, point: jumps.jumpMean };
    const s = jumps.jumpStdev;
    return { breaks: [jumps.jumpMean - 10 * s, jumps.jumpMean + 10 * s], panels: 24 };
  }
  if (jumps.type === 'double-exponential') {
    const lo = jumps.downMean > 0 && jumps.upProbability < 1 ? -47 * jumps.downMean : 0;
    const hi = jumps.upMean > 0 && jumps.upProbability > 0 ? 47 * jumps.upMean : 0;
    return { breaks: [lo, 0, hi].filter((b, i, all) => i === 0 || b > all[i - 1]), panels: 24 };
  }
  const { jumpMean: mu, jumpStdev: sd, jumpCorrelation: rho, varianceJumpMean: muV } = jumps;
  const reach = 47 * Math.abs(rho) * muV;
  const lo = mu - 10 * sd - (rho < 0 ? reach : 0);
  const hi = mu + 10 * sd + (rho > 0 ? reach : 0);
  // with σS = 0 the density jumps at μS: a break there
  return sd === 0
    ? { breaks: rho > 0 ? [mu, hi] : [lo, mu], panels: 24 }
    : { breaks: [lo, hi], panels: 32 };
}
