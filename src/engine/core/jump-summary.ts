/**
 * What a jump law says in numbers a trader reads: how often, the mean move, the share of jumps
 * that go up, and (SVCJ) how much the variance jumps, in general and given the size of the
 * price jump.
 */
import type { JumpLaw } from './model-spec';
import { millsRatioAnywhere, normCdf } from './normal';

type PriceVariance = Extract<JumpLaw, { type: 'price-variance' }>;
type VarianceJumpParameters = Pick<
  PriceVariance,
  'jumpMean' | 'jumpStdev' | 'varianceJumpMean' | 'jumpCorrelation'
>;

/**
 * E[Z_V | Z_S = y] under SVCJ's joint law (Z_V ~ Exp(mean μV), Z_S | Z_V ~ N(μS + ρJ Z_V, σS²)):
 * given y, Z_V has density ∝ e^{−z/μV − (y − μS − ρJ z)²/(2σS²)} on z ≥ 0, a normal of mean
 * m = (ρJ(y − μS) − σS²/μV)/ρJ² and s.d. s = σS/|ρJ| truncated at 0, whose mean is
 * m + s/R(−m/s) with R the Mills ratio (common practice for a truncated normal).
 */
export function expectedVarianceJump(j: VarianceJumpParameters, y: number): number {
  const { jumpMean: muS, jumpStdev: sS, varianceJumpMean: muV, jumpCorrelation: rhoJ } = j;
  if (muV === 0) return 0;
  if (rhoJ === 0) return muV;
  if (sS === 0) return Math.max(0, (y - muS) / rhoJ);
  const m = (rhoJ * (y - muS) - (sS * sS) / muV) / (rhoJ * rhoJ);
  const s = sS / Math.abs(rhoJ);
  return m + s / millsRatioAnywhere(-m / s);
}

export interface JumpSummary {
  /** years between jumps on average (Infinity without jumps) */
  yearsBetween: number;
  /** E[e^J] − 1: the mean relative move of one jump */
  meanMove: number;
  /** P(J > 0) */
  upShare: number;
  /** SVCJ: the mean variance jump, and the ATM-vol equivalent from a starting variance */
  varianceJump?: number;
}

export function jumpSummary(j: JumpLaw): JumpSummary | null {
  if (j.type === 'none' || !(j.jumpIntensity > 0)) return null;
  const yearsBetween = 1 / j.jumpIntensity;
  if (j.type === 'lognormal')
    return {
      yearsBetween,
      meanMove: Math.expm1(j.jumpMean + 0.5 * j.jumpStdev ** 2),
      upShare: j.jumpStdev > 0 ? normCdf(j.jumpMean / j.jumpStdev) : j.jumpMean > 0 ? 1 : 0,
    };
  if (j.type === 'double-exponential')
    return {
      yearsBetween,
      meanMove: j.upProbability / (1 - j.upMean) + (1 - j.upProbability) / (1 + j.downMean) - 1,
      upShare: j.upProbability,
    };
  // SVCJ: P(Z_S > 0) by a short Gauss-Laguerre-free sum over the exponential (midpoint rule on
  // its quantiles, 400 points: ample for a summary figure)
  let up = 0;
  const n = 400;
  for (let i = 0; i < n; i++) {
    const z = -j.varianceJumpMean * Math.log(1 - (i + 0.5) / n);
    const mean = j.jumpMean + j.jumpCorrelation * z;
    up += j.jumpStdev > 0 ? normCdf(mean / j.jumpStdev) : mean > 0 ? 1 : 0;
  }
  return {
    yearsBetween,
    meanMove:
      Math.exp(j.jumpMean + 0.5 * j.jumpStdev ** 2) / (1 - j.jumpCorrelation * j.varianceJumpMean) -
      1,
    upShare: up / n,
    varianceJump: j.varianceJumpMean,
  };
}
