/**
 * What a model kind is made of, as data the analytic layer turns into a characteristic
 * function and the paths layer into steps: a diffusion for the variance and a law for the
 * jumps. Fields keep the parameter names of the scenario document. Each registry entry builds
 * one from its parameters.
 */

export type Diffusion =
  | { type: 'constant'; variance: number }
  | { type: 'heston'; v0: number; kappa: number; theta: number; volOfVol: number; rho: number };

export type JumpLaw =
  | { type: 'none' }
  | { type: 'lognormal'; jumpIntensity: number; jumpMean: number; jumpStdev: number }
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

/** Kou (2002): up with probability upProbability, mean up and down log-jumps 1/η1 and 1/η2. */
export const doubleExponentialJumps = (p: ParameterValues): JumpLaw => ({
  type: 'double-exponential',
  jumpIntensity: num(p, 'jumpIntensity'),
  upProbability: num(p, 'upProbability'),
  upMean: num(p, 'upMean'),
  downMean: num(p, 'downMean'),
});
