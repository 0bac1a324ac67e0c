/**
 * What a model kind is made of, as data the analytic layer turns into a characteristic
 * function and the paths layer into steps: a diffusion for the variance and a law for the
 * jumps. Fields keep the parameter names of the scenario document. Each registry entry builds
 * one from its parameters.
 */

import {
  integratedIntensity,
  shiftSchedule,
  type IntensitySchedule,
  type ScheduledMove,
} from './scheduled-moves';

export type Diffusion =
  | { type: 'constant'; variance: number }
  | { type: 'heston'; v0: number; kappa: number; theta: number; volOfVol: number; rho: number };

export type JumpLaw =
  | { type: 'none' }
  | { type: 'lognormal'; jumpIntensity: number; jumpMean: number; jumpStdev: number }
  | {
      /**
       * Duffie, Pan & Singleton (2000) contemporaneous jumps: Z_V ~ Exp(mean varianceJumpMean)
       * added to the variance, Z_S | Z_V ~ N(jumpMean + jumpCorrelation·Z_V, jumpStdev²) to ln S
       */
      type: 'price-variance';
      jumpIntensity: number;
      jumpMean: number;
      jumpStdev: number;
      varianceJumpMean: number;
      jumpCorrelation: number;
    }
  | {
      type: 'double-exponential';
      jumpIntensity: number;
      upProbability: number;
      upMean: number;
      downMean: number;
    };

export interface ModelSpec {
  diffusion: Diffusion;
  jumps: JumpLaw;
  /** scheduled moves of ln S (`scheduled-moves.ts`); none when absent */
  events?: readonly ScheduledMove[];
  /** piecewise-constant jump intensity; `jumps.jumpIntensity` after its last point */
  intensitySchedule?: IntensitySchedule;
}

/** Parameter values by name, as a registry entry's builders read them. */
export type ParameterValues = Readonly<Record<string, unknown>>;

const num = (p: ParameterValues, key: string) => p[key] as number;

export const constantDiffusion = (p: ParameterValues): Diffusion => ({
  type: 'constant',
  variance: num(p, 'sigma') ** 2,
});

export const hestonDiffusion = (p: ParameterValues): Diffusion => ({
  type: 'heston',
  v0: num(p, 'v0'),
  kappa: num(p, 'kappa'),
  theta: num(p, 'theta'),
  volOfVol: num(p, 'volOfVol'),
  rho: num(p, 'rho'),
});

export const NO_JUMPS: JumpLaw = { type: 'none' };

/** Merton (1976): ln(1 + J) ~ N(jumpMean, jumpStdev²) at rate jumpIntensity. */
export const lognormalJumps = (p: ParameterValues): JumpLaw => ({
  type: 'lognormal',
  jumpIntensity: num(p, 'jumpIntensity'),
  jumpMean: num(p, 'jumpMean'),
  jumpStdev: num(p, 'jumpStdev'),
});

/**
 * SVCJ jumps (Duffie, Pan & Singleton 2000); with no variance jump they are Merton's lognormal
 * jumps exactly, so that case is built as the lognormal law (Bates to the last bit).
 */
export const priceVarianceJumps = (p: ParameterValues): JumpLaw =>
  num(p, 'varianceJumpMean') === 0
    ? lognormalJumps(p)
    : {
        type: 'price-variance',
        jumpIntensity: num(p, 'jumpIntensity'),
        jumpMean: num(p, 'jumpMean'),
        jumpStdev: num(p, 'jumpStdev'),
        varianceJumpMean: num(p, 'varianceJumpMean'),
        jumpCorrelation: num(p, 'jumpCorrelation'),
      };

/** Kou (2002): up with probability upProbability, mean up and down log-jumps 1/η1 and 1/η2. */
export const doubleExponentialJumps = (p: ParameterValues): JumpLaw => ({
  type: 'double-exponential',
  jumpIntensity: num(p, 'jumpIntensity'),
  upProbability: num(p, 'upProbability'),
  upMean: num(p, 'upMean'),
  downMean: num(p, 'downMean'),
});

/** Λ(T): the expected number of jumps up to T (0 without jumps), honouring the schedule. */
export function expectedJumps(spec: ModelSpec, T: number): number {
  const j = spec.jumps;
  if (j.type === 'none') return 0;
  return integratedIntensity(j.jumpIntensity, spec.intensitySchedule, T);
}

/** Expected jumps over (t0, t1]. */
export const expectedJumpsBetween = (spec: ModelSpec, t0: number, t1: number): number =>
  expectedJumps(spec, t1) - expectedJumps(spec, t0);

/** Whether the spec has dated parts (scheduled moves or an intensity schedule). */
export const hasDatedRisk = (spec: ModelSpec): boolean =>
  (spec.events?.length ?? 0) > 0 || (spec.intensitySchedule?.length ?? 0) > 0;

/**
 * The model as seen `dt` years after its valuation (dt < 0: before it): scheduled moves and the
 * intensity schedule move by −dt. Moves still ahead keep their order; moves already passed are
 * dropped when dt > 0 (a move at exactly dt is still ahead: it happens at that instant).
 */
export function specFrom(spec: ModelSpec, dt: number): ModelSpec {
  if (!hasDatedRisk(spec) || dt === 0) return spec;
  const out: ModelSpec = { diffusion: spec.diffusion, jumps: spec.jumps };
  if (spec.events?.length) {
    out.events = spec.events
      .filter((e) => e.time >= dt || dt < 0)
      .map((e) => ({ ...e, time: e.time - dt }));
  }
  if (spec.intensitySchedule?.length)
    out.intensitySchedule = shiftSchedule(spec.intensitySchedule, dt);
  return out;
}
