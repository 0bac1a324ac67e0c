/**
 * Short expiries with jumps, split on whether a jump arrives before T. Over days or weeks the
 * diffusion spreads Y by about σ√T while a jump moves it by μJ ± σJ: one cosine series must span
 * the jumps' range at the diffusion's resolution and needs 600–1,300 terms. Conditioning on the
 * jump count N (as Merton 1976 writes his price as a Poisson sum) splits the law in two:
 * - N = 0, weight e^{−Λ}: the jump-free law shifted by the compensator −Λκ̄; narrow, on its own
 *   range, with the jump-free law's few terms;
 * - N ≥ 1, weight 1 − e^{−Λ}: wide, but at least one independent N(·, σJ²) jump is in it, so its
 *   characteristic function, φ − e^{−Λ}φ₀, falls like e^{−σJ²u²/2} and a few dozen terms cover it.
 * This holds for Merton/Bates jumps and for SVCJ's (given no jump the variance never jumps, so
 * the N = 0 part is plain Heston); Kou's exponential jumps do not smooth the law and keep the
 * single series.
 */
import { logCharacteristic, type ModelSpec, type TimeSlopeOut } from './characteristic';
import { cumulants } from './cumulants';
import {
  cosSeries,
  type CosSeries,
  type Envelope,
  type LogCf,
  type TableAllocator,
} from './cos-series';
import type { CosSettings } from './cos';
import { lawRange } from './cos-range';
import type { TruncationRange } from './truncation-range';
import { expectedJumps, NO_JUMPS, type JumpLaw } from '../core/model-spec';
import { intensityAt } from '../core/scheduled-moves';

export interface MixturePart {
  /** the part's probability and its slope in τ */
  weight: number;
  weightSlope: number;
  series: CosSeries;
}

/** Smaller blocks than a single series', so that a narrow part can stop early. */
const PART_BLOCK = 32;
/** The split is taken when its estimated terms are below this share of the single series'. */
const WORTHWHILE = 0.9;

/** E[e^{Z}] − 1 for one jump's log-move Z, and the normal spread σJ in it; null for Kou. */
function jumpMoments(j: JumpLaw): { kbar: number; spread: number } | null {
  if (j.type === 'lognormal')
    return { kbar: Math.expm1(j.jumpMean + 0.5 * j.jumpStdev ** 2), spread: j.jumpStdev };
  if (j.type === 'price-variance')
    return {
      kbar:
        Math.exp(j.jumpMean + 0.5 * j.jumpStdev ** 2) /
          (1 - j.jumpCorrelation * j.varianceJumpMean) -
        1,
      spread: j.jumpStdev,
    };
  return null;
}

/**
 * Where |φ(u)|/(1 + u²) of a law falls below `tolerance`, found by doubling from `start` and
 * then bisecting: an estimate of the series' last u, to weigh the split against the single one.
 */
function decayPoint(logCf: LogCf, start: number, tolerance: number): number {
  const wr = new Float64Array(1);
  const wi = new Float64Array(1);
  const re = new Float64Array(1);
  const im = new Float64Array(1);
  const decayed = (u: number) => {
    wi[0] = u;
    logCf(wr, wi, re, im, 1);
    return Math.exp(re[0]) / (1 + u * u) < tolerance;
  };
  let lo = 0;
  let hi = start;
  for (let i = 0; i < 40 && !decayed(hi); i++) {
    lo = hi;
    hi *= 2;
  }
  for (let i = 0; i < 5; i++) {
    const mid = 0.5 * (lo + hi);
    if (decayed(mid)) hi = mid;
    else lo = mid;
  }
  return hi;
}

/**
 * The two parts for the spec's jumps at T, or null when the spec has no such jumps or the
 * single series is the cheaper one. `single` is the single series' range, which the N ≥ 1 part
 * takes: its tails are the whole law's, at its weight.
 */
export function jumpSplitParts(
  spec: ModelSpec,
  T: number,
  settings: CosSettings,
  withSlope: boolean,
  single: TruncationRange,
  allocate?: TableAllocator,
): MixturePart[] | null {
  const j = spec.jumps;
  const moments = jumpMoments(j);
  if (!moments || !(moments.spread > 0) || j.type === 'none') return null;
  const lambdaT = expectedJumps(spec, T);
  // so rare a jump part only risks underflow in 1 − e^{−Λ}: the single series takes it
  if (!(lambdaT > 1e-12)) return null;
  const { kbar, spread } = moments;
  const lambdaNow = intensityAt(j.jumpIntensity, spec.intensitySchedule, 0);
  const quiet: ModelSpec = { diffusion: spec.diffusion, jumps: NO_JUMPS };
  if (spec.events) quiet.events = spec.events;
  const base = cumulants(quiet, T);
  const p0 = Math.exp(-lambdaT);
  const pJump = -Math.expm1(-lambdaT);
  const shift = -lambdaT * kbar;
  const tolerance = settings.tailTolerance;

  // jump-free: ln φ₀ + w·shift, whose slope gains −w·κ̄·λ(0)
  const quietCf: LogCf = (wr, wi, re, im, count, slope) => {
    logCharacteristic(quiet, T, wr, wi, re, im, count, slope);
    for (let k = 0; k < count; k++) {
      re[k] += shift * wr[k];
      im[k] += shift * wi[k];
      if (slope) {
        slope.re[k] -= wr[k] * kbar * lambdaNow;
        slope.im[k] -= wi[k] * kbar * lambdaNow;
      }
    }
  };
  const quietRange = lawRange(quiet, T, settings.tailMass, base);
  quietRange.a += shift;
  quietRange.b += shift;
  const quietWidth = quietRange.b - quietRange.a;
  const singleWidth = single.b - single.a;
  // terms ∝ range × last u: the single series ends where the jump-free law does, the N ≥ 1
  // part where e^{−σJ²u²/2}·(1 − e^{−Λ}) falls below the tolerance, if sooner
  const uQuiet = decayPoint(quietCf, (PART_BLOCK * Math.PI) / quietWidth, tolerance);
  const uJump = Math.min(uQuiet, Math.sqrt(2 * Math.log(pJump / tolerance)) / spread);
  if (quietWidth * uQuiet + singleWidth * uJump >= WORTHWHILE * singleWidth * uQuiet) return null;

  const quietSeries = cosSeries(quietRange.a, quietRange.b, settings, withSlope, quietCf, {
    block: PART_BLOCK,
    allocate,
  });
  // E[e^Y | N = 0] = e^{−Λκ̄}
  quietSeries.mean = Math.exp(shift);
  quietSeries.meanSlope = -lambdaNow * kbar * quietSeries.mean;

  const jumpCf =
    j.type === 'lognormal'
      ? lognormalJumpPartCf(quietCf, j, lambdaT, lambdaNow, p0, pJump)
      : jumpPartCf(spec, T, quietCf, p0, pJump, lambdaNow);
  const jumpSeries = cosSeries(
    single.a,
    single.b,
    // the part's error counts at its weight: it may stop its series sooner
    {
      ...settings,
      tailTolerance: Math.min(1e-6, tolerance / pJump),
      densityTolerance: Math.min(1e-2, settings.densityTolerance / pJump),
    },
    withSlope,
    jumpCf,
    {
      block: PART_BLOCK,
      envelope:
        j.type === 'lognormal' ? lognormalPartEnvelope(j.jumpStdev, lambdaT, p0, pJump) : undefined,
      allocate,
    },
  );
  // E[e^Y | N ≥ 1] = (1 − e^{−Λ}·e^{−Λκ̄})/(1 − e^{−Λ}), so that the two parts' means average to 1
  const quietMass = p0 * quietSeries.mean; // e^{−Λ(1 + κ̄)}
  jumpSeries.mean = -Math.expm1(-lambdaT * (1 + kbar)) / pJump;
  jumpSeries.meanSlope =
    (lambdaNow * (1 + kbar) * quietMass * pJump - lambdaNow * p0 * pJump * jumpSeries.mean) /
    (pJump * pJump);
  return [
    { weight: p0, weightSlope: -lambdaNow * p0, series: quietSeries },
    { weight: pJump, weightSlope: lambdaNow * p0, series: jumpSeries },
  ];
}

/**
 * A bound on the Merton/Bates N ≥ 1 part's |characteristic function| (see
 * `lognormalJumpPartCf`): |φ_q| ≤ 1 and |e^{ΛE} − 1| ≤ e^{Λ|E|} − 1 with |E(iu)| = e^{−δ²u²/2},
 * so |ψ(u)| ≤ e^{−Λ}(e^{Λe^{−δ²u²/2}} − 1)/(1 − e^{−Λ}), which is 1 at u = 0 and falls like
 * a Gaussian.
 */
export function lognormalPartEnvelope(
  jumpStdev: number,
  lambdaT: number,
  p0: number,
  pJump: number,
): Envelope {
  const hv = 0.5 * jumpStdev * jumpStdev;
  return (u) => (p0 * Math.expm1(lambdaT * Math.exp(-hv * u * u))) / pJump;
}

/** The jump-free law's values beside the whole law's, kept between calls and grown on demand. */
const quietScratch = (size: number) => ({
  re: new Float64Array(size),
  im: new Float64Array(size),
  slope: { re: new Float64Array(size), im: new Float64Array(size) } as TimeSlopeOut,
});
let QUIET_SCRATCH = quietScratch(64);

/**
 * ln of the N ≥ 1 part's characteristic function, (φ − e^{−Λ}φ₀)/(1 − e^{−Λ}), and its time
 * slope: ∂τ(φ − e^{−Λ}φ₀) = φ·∂τ ln φ − e^{−Λ}φ₀·(∂τ ln φ₀ − λ(0)), divided by the difference,
 * less ∂τ ln(1 − e^{−Λ}) = λ(0)e^{−Λ}/(1 − e^{−Λ}). Only e^{ln φ} is used, so any branch will do.
 */
function jumpPartCf(
  spec: ModelSpec,
  T: number,
  quietCf: LogCf,
  p0: number,
  pJump: number,
  lambdaNow: number,
): LogCf {
  const logWeight = Math.log(pJump);
  const weightRate = (lambdaNow * p0) / pJump;
  return (wr, wi, re, im, count, slope) => {
    if (QUIET_SCRATCH.re.length < count) QUIET_SCRATCH = quietScratch(count);
    const { re: qRe, im: qIm, slope: qSlope } = QUIET_SCRATCH;
    logCharacteristic(spec, T, wr, wi, re, im, count, slope);
    quietCf(wr, wi, qRe, qIm, count, slope ? qSlope : undefined);
    for (let k = 0; k < count; k++) {
      const fm = Math.exp(re[k]);
      const fr = fm * Math.cos(im[k]);
      const fi = fm * Math.sin(im[k]);
      const qm = p0 * Math.exp(qRe[k]);
      const qr = qm * Math.cos(qIm[k]);
      const qi = qm * Math.sin(qIm[k]);
      const zr = fr - qr;
      const zi = fi - qi;
      const zm = zr * zr + zi * zi;
      re[k] = 0.5 * Math.log(zm) - logWeight;
      im[k] = Math.atan2(zi, zr);
      if (!slope) continue;
      if (zm === 0) {
        slope.re[k] = 0;
        slope.im[k] = 0;
        continue;
      }
      // φ·s − e^{−Λ}φ₀·(s₀ − λ(0)), over z
      const sr = slope.re[k];
      const si = slope.im[k];
      const s0r = qSlope.re[k] - lambdaNow;
      const s0i = qSlope.im[k];
      const nr = fr * sr - fi * si - (qr * s0r - qi * s0i);
      const ni = fr * si + fi * sr - (qr * s0i + qi * s0r);
      slope.re[k] = (nr * zr + ni * zi) / zm - weightRate;
      slope.im[k] = (ni * zr - nr * zi) / zm;
    }
  };
}

/**
 * The N ≥ 1 part for Merton/Bates jumps, with one jump-free evaluation: with E(w) = e^{μw + ½δ²w²},
 * φ = φ_q·e^{Λ(E − 1)} (φ_q the shifted jump-free function), so the part's characteristic
 * function is φ_q·(e^{ΛE} − 1)·e^{−Λ}/(1 − e^{−Λ}). e^{ΛE} − 1 is formed with expm1, free of the
 * cancellation φ − e^{−Λ}φ_q suffers where ΛE is small. Its time slope is φ_q's plus
 * λ(0)·[E·e^{ΛE}/(e^{ΛE} − 1) − 1 − e^{−Λ}/(1 − e^{−Λ})]. Where |ΛE| < 0.05, as at most of the
 * part's terms, both come from series in ΛE (`smallJumpSeries`): no logarithm, quotient or
 * expm1 there.
 */
function lognormalJumpPartCf(
  quietCf: LogCf,
  jl: Extract<JumpLaw, { type: 'lognormal' }>,
  lambdaT: number,
  lambdaNow: number,
  p0: number,
  pJump: number,
): LogCf {
  const mu = jl.jumpMean;
  const hv = 0.5 * jl.jumpStdev * jl.jumpStdev;
  const logScale = -lambdaT - Math.log(pJump);
  // ln Λ with the part's scale, for ln z = ln Λ + x
  const logLambda = Math.log(lambdaT) + logScale;
  const weightRate = lambdaNow * (1 + p0 / pJump);
  return (wr, wi, re, im, count, slope) => {
    quietCf(wr, wi, re, im, count, slope);
    for (let k = 0; k < count; k++) {
      const a = wr[k];
      const b = wi[k];
      // ΛE = Λe^x, x = μw + ½δ²w²
      const xr = mu * a + hv * (a * a - b * b);
      const xi = mu * b + 2 * hv * a * b;
      const em = lambdaT * Math.exp(xr);
      const zr = em * Math.cos(xi);
      const zi = em * Math.sin(xi);
      if (em < SMALL_Z) {
        // ln(e^z − 1) = ln z + ln((e^z − 1)/z), ln z = ln Λ + x; E·e^z/(e^z − 1) = (1/Λ)·z/(1 − e^{−z})
        const series = SERIES_OUT;
        smallJumpSeries(zr, zi, series);
        re[k] += logLambda + xr + series[0];
        im[k] += xi + series[1];
        if (slope) {
          slope.re[k] += (lambdaNow / lambdaT) * series[2] - weightRate;
          slope.im[k] += (lambdaNow / lambdaT) * series[3];
        }
        continue;
      }
      // e^z − 1, from expm1 and the half angle so that neither part cancels when z is small
      const sHalf = Math.sin(0.5 * zi);
      const cHalf = Math.cos(0.5 * zi);
      const twoS2 = 2 * sHalf * sHalf;
      const cz = 1 - twoS2;
      const sz = 2 * sHalf * cHalf;
      const ezm1 = Math.expm1(zr);
      const ez = 1 + ezm1;
      const mr = ezm1 * cz - twoS2;
      const mi = ez * sz;
      const mm = mr * mr + mi * mi;
      re[k] += 0.5 * Math.log(mm) + logScale;
      im[k] += Math.atan2(mi, mr);
      if (!slope) continue;
      if (mm === 0) {
        // E underflowed: the term is 0 and so is what its slope carries
        slope.re[k] = 0;
        slope.im[k] = 0;
        continue;
      }
      // E·e^z/(e^z − 1), with E = z/Λ
      const pr = (ez * (zr * cz - zi * sz)) / lambdaT;
      const pi = (ez * (zr * sz + zi * cz)) / lambdaT;
      slope.re[k] += (lambdaNow * (pr * mr + pi * mi)) / mm - weightRate;
      slope.im[k] += (lambdaNow * (pi * mr - pr * mi)) / mm;
    }
  };
}

/** Below this |z| the N ≥ 1 part takes e^z − 1 from series (see `smallJumpSeries`). */
const SMALL_Z = 0.05;
const SERIES_OUT = new Float64Array(4);

/**
 * At small z = ΛE, the N ≥ 1 part's two functions of z from their series rather than from
 * e^z − 1, a logarithm and a quotient, into out: [0, 1] ln((e^z − 1)/z) = z/2 + ln(sinh(z/2)/(z/2))
 * = z/2 + z²/24 − z⁴/2880 + z⁶/181440 − …, and [2, 3] z/(1 − e^{−z}) = 1 + z/2 + z²/12 − z⁴/720 +
 * z⁶/30240 − … (the Bernoulli series). For |z| < 0.05 the first terms left out are below 1e-17.
 */
export function smallJumpSeries(zr: number, zi: number, out: Float64Array): void {
  const z2r = zr * zr - zi * zi;
  const z2i = 2 * zr * zi;
  const z4r = z2r * z2r - z2i * z2i;
  const z4i = 2 * z2r * z2i;
  const z6r = z4r * z2r - z4i * z2i;
  const z6i = z4r * z2i + z4i * z2r;
  out[0] = zr / 2 + z2r / 24 - z4r / 2880 + z6r / 181440;
  out[1] = zi / 2 + z2i / 24 - z4i / 2880 + z6i / 181440;
  out[2] = 1 + zr / 2 + z2r / 12 - z4r / 720 + z6r / 30240;
  out[3] = zi / 2 + z2i / 12 - z4i / 720 + z6i / 30240;
}
