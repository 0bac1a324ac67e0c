/** Shared engine types. Times are year fractions (ACT/365); rates continuously compounded. */

/** A zero-rate curve as [t, r] pairs, t in years, r continuously compounded. */
export type Curve = ReadonlyArray<readonly [number, number]>;

export interface Market {
  spot: number;
  /** flat continuously compounded zero rate (ignored when rateCurve is given) */
  rate?: number;
  dividendYield?: number;
  rateCurve?: Curve;
  dividendCurve?: Curve;
}

export interface HestonParams {
  /** initial variance */
  v0: number;
  /** mean-reversion speed κ */
  kappa: number;
  /** long-run variance θ */
  theta: number;
  /** volatility of variance ξ */
  volOfVol: number;
  /** correlation of spot and variance shocks */
  rho: number;
}

/** Merton lognormal jumps: arrival rate λ per year, ln(1+J) ~ N(jumpMean, jumpStdev²). */
export interface LognormalJumpParams {
  jumpIntensity: number;
  jumpMean: number;
  jumpStdev: number;
}

/** Kou double-exponential jumps: up with probability p, mean up size 1/η1, mean down size 1/η2. */
export interface DoubleExponentialJumpParams {
  jumpIntensity: number;
  upProbability: number;
  upMean: number;
  downMean: number;
}

export type BlackScholesModel = { kind: 'black-scholes'; sigma: number };
export type HestonModel = { kind: 'heston' } & HestonParams;
export type MertonModel = { kind: 'merton'; sigma: number } & LognormalJumpParams;
export type BatesModel = { kind: 'bates' } & HestonParams & LognormalJumpParams;
export type HestonKouModel = { kind: 'heston-kou' } & HestonParams & DoubleExponentialJumpParams;

export type Model = BlackScholesModel | HestonModel | MertonModel | BatesModel | HestonKouModel;
export type ModelKind = Model['kind'];

export const MODEL_KINDS: readonly ModelKind[] = [
  'black-scholes',
  'heston',
  'merton',
  'bates',
  'heston-kou',
];

export type OptionType = 'call' | 'put';

export interface OptionSpec {
  type: OptionType;
  strike: number;
  /** years */
  expiry: number;
}
