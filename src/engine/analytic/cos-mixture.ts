/**
 * Short expiries with lognormal (Merton) jumps, conditioned on the number of jumps. Over a few
 * days the diffusion spreads Y by about σ√T while one jump moves it by μJ ± σJ: one cosine
 * series must span the jumps' range at the diffusion's resolution and needs 600–900 terms.
 * Given N = n jumps, Y is the jump-free law shifted by n·μJ − Λκ̄ and convolved with
 * N(0, n·σJ²), each narrow on its own range; Y's law is the Poisson(Λ) mixture of these
 * (Merton 1976 writes his price as the same Poisson sum of Black-Scholes prices). Each part is
 * a short COS series of its own; the Poisson tail beyond the last part is below 1e-17.
 */
import { logCharacteristic, type ModelSpec } from './characteristic';
import { cumulants } from './cumulants';
import { cosSeries, type CosSeries } from './cos-series';
import type { CosSettings } from './cos';
import { expectedJumps, NO_JUMPS } from '../core/model-spec';
import { intensityAt } from '../core/scheduled-moves';

export interface MixturePart {
  /** P(N = n) and its slope in τ, λ(0)·(P(N = n − 1) − P(N = n)) */
  weight: number;
  weightSlope: number;
  series: CosSeries;
}

/** Poisson probabilities below this, and the tail beyond the last part, are left out. */
const TAIL = 1e-17;
/**
 * The mixture is used while it has at most this many parts (Λ up to about 0.02, a week at
 * λ = 1). Each part needs at least one 64-term block; beyond that the single series is cheaper.
 */
const MAX_PARTS = 7;
/** Smaller blocks than a single series', so that a narrow part can stop at 64 terms. */
const PART_BLOCK = 32;

/** Poisson(Λ) probabilities until the tail is negligible; null when more than `MAX_PARTS`. */
function poissonWeights(lambdaT: number): number[] | null {
  const weights: number[] = [];
  let p = Math.exp(-lambdaT);
  for (let n = 0; n < MAX_PARTS; n++) {
    weights.push(p);
    const next = (p * lambdaT) / (n + 1);
    // the tail beyond n is at most p_{n+1}/(1 − Λ/(n + 2)) ≤ 2·p_{n+1} once n + 2 ≥ 2Λ
    if (n + 2 >= 2 * lambdaT && 2 * next < TAIL) return weights;
    p = next;
  }
  return null;
}

/**
 * The parts of a Poisson mixture for the spec's lognormal jumps at T, or null when the spec
 * has no such jumps or the single series is the cheaper one. `extraHalfWidth` widens each
 * part's range as the caller does for its own (scheduled two-point moves); `singleHalfWidth` is
 * the single series' half-width.
 */
export function mixtureParts(
  spec: ModelSpec,
  T: number,
  settings: CosSettings,
  withSlope: boolean,
  extraHalfWidth: number,
  singleHalfWidth: number,
): MixturePart[] | null {
  const j = spec.jumps;
  if (j.type !== 'lognormal') return null;
  const lambdaT = expectedJumps(spec, T);
  if (!(lambdaT > 0)) return null;
  const weights = poissonWeights(lambdaT);
  if (!weights) return null;
  const lambdaNow = intensityAt(j.jumpIntensity, spec.intensitySchedule, 0);
  const quiet: ModelSpec = { diffusion: spec.diffusion, jumps: NO_JUMPS };
  if (spec.events) quiet.events = spec.events;
  const base = cumulants(quiet, T);
  // the single series resolves the jump-free law's scale over its own wider range: it needs
  // about singleHalfWidth / (the jump-free half-width) times the terms of the first part, and
  // every part needs at most about that first part's
  const quietHalf = settings.width * Math.sqrt(base.c2 + Math.sqrt(base.c4)) + extraHalfWidth;
  if (weights.length >= singleHalfWidth / quietHalf) return null;
  const kbar = Math.expm1(j.jumpMean + 0.5 * j.jumpStdev * j.jumpStdev);
  return weights.map((weight, n) => {
    // given n jumps: shift m = nμ − Λκ̄, added variance s² = nσ²
    const m = n * j.jumpMean - lambdaT * kbar;
    const hv = 0.5 * n * j.jumpStdev * j.jumpStdev;
    const c1 = base.c1 + m;
    const half = settings.width * Math.sqrt(base.c2 + 2 * hv + Math.sqrt(base.c4)) + extraHalfWidth;
    // a part's error counts at its weight: a rare part may stop its series sooner
    const own = {
      ...settings,
      tailTolerance: Math.min(1e-6, settings.tailTolerance / weight),
    };
    const series = cosSeries(
      c1 - half,
      c1 + half,
      own,
      withSlope,
      (wr, wi, re, im, count, slope) => {
        logCharacteristic(quiet, T, wr, wi, re, im, count, slope);
        for (let k = 0; k < count; k++) {
          const a = wr[k];
          const b = wi[k];
          // w·m + ½·n·σ²·w²
          re[k] += m * a + hv * (a * a - b * b);
          im[k] += m * b + hv * 2 * a * b;
          if (slope) {
            // only the compensator −Λκ̄ moves with τ: −w·κ̄·λ(0)
            slope.re[k] -= a * kbar * lambdaNow;
            slope.im[k] -= b * kbar * lambdaNow;
          }
        }
      },
      PART_BLOCK,
    );
    // E[e^Y | N = n] = e^{m + ½nσ²}, which moves with τ through −Λκ̄
    series.mean = Math.exp(m + hv);
    series.meanSlope = -lambdaNow * kbar * series.mean;
    const weightSlope = lambdaNow * ((n > 0 ? weights[n - 1] : 0) - weight);
    return { weight, weightSlope, series };
  });
}
