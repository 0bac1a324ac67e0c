/**
 * Where one expiry's COS series lives: the range [a, b] of Y = ln(S_T/F_T) that holds all but a
 * set tail mass of its law.
 */
import { logCharacteristic, type ModelSpec } from './characteristic';
import { cumulants, type Cumulants } from './cumulants';
import { expectedJumps } from '../core/model-spec';
import { touches, twoPointOutcomes } from '../core/scheduled-moves';
import {
  chernoffRange,
  momentIsFinite,
  type LogMoment,
  type TruncationRange,
} from './truncation-range';

/** The cumulant range's width in units of √(c2 + √c4) (Fang & Oosterlee section 5.1). */
const FALLBACK_WIDTH = 12;

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

/** Zero imaginary parts for real arguments, and where their (unused) phases go; reused. */
const momentScratch = (size: number) => ({
  zeros: new Float64Array(size),
  phase: new Float64Array(size),
});
let MOMENT_SCRATCH = momentScratch(32);

/**
 * The law's COS range: Chernoff's bound for `tailMass` (`truncation-range.ts`) or, should no
 * moment bound both tails, the cumulant range c1 ± 12√(c2 + √c4) widened by the jumps' and
 * the two-point moves' reach.
 */
export function lawRange(
  spec: ModelSpec,
  T: number,
  tailMass: number,
  { c1, c2, c4 }: Cumulants = cumulants(spec, T),
): TruncationRange {
  const logMoment: LogMoment = (p, out, count) => {
    if (MOMENT_SCRATCH.zeros.length < count) MOMENT_SCRATCH = momentScratch(count);
    const { zeros, phase } = MOMENT_SCRATCH;
    logCharacteristic(spec, T, p, zeros, out, phase, count);
  };
  const range = chernoffRange(logMoment, (p) => momentIsFinite(spec, p, T), c2, tailMass);
  if (range) return range;
  const half =
    FALLBACK_WIDTH * Math.sqrt(c2 + Math.sqrt(c4)) + jumpExtent(spec, T) + eventExtent(spec, T);
  return { a: c1 - half, b: c1 + half };
}
