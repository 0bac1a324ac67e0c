/**
 * Calibration parameters: bounds, the logistic map that keeps every trial inside them
 * (x = lo + (hi − lo)/(1 + e^{−z})), plausible boxes for starting points, and a Halton sequence
 * (low-discrepancy, Halton 1960) to spread those starts.
 */
import type { Model, ModelKind } from './types';

export interface Bound {
  lo: number;
  hi: number;
  /** where multi-start points are drawn */
  startLo: number;
  startHi: number;
}

export const BOUNDS: Record<string, Bound> = {
  sigma: { lo: 0.005, hi: 3, startLo: 0.08, startHi: 0.6 },
  v0: { lo: 1e-5, hi: 2, startLo: 0.005, startHi: 0.2 },
  kappa: { lo: 0.01, hi: 25, startLo: 0.3, startHi: 6 },
  theta: { lo: 1e-5, hi: 2, startLo: 0.005, startHi: 0.2 },
  volOfVol: { lo: 0.005, hi: 5, startLo: 0.1, startHi: 1.5 },
  rho: { lo: -0.999, hi: 0.999, startLo: -0.9, startHi: 0.2 },
  jumpIntensity: { lo: 1e-4, hi: 20, startLo: 0.05, startHi: 3 },
  jumpMean: { lo: -1.5, hi: 0.5, startLo: -0.3, startHi: 0.05 },
  jumpStdev: { lo: 0.001, hi: 1.5, startLo: 0.02, startHi: 0.3 },
  upProbability: { lo: 0.001, hi: 0.999, startLo: 0.1, startHi: 0.6 },
  upMean: { lo: 0.001, hi: 0.6, startLo: 0.01, startHi: 0.15 },
  downMean: { lo: 0.001, hi: 1.5, startLo: 0.02, startHi: 0.3 },
};

export const PARAMETERS: Record<ModelKind, string[]> = {
  'black-scholes': ['sigma'],
  heston: ['v0', 'kappa', 'theta', 'volOfVol', 'rho'],
  merton: ['sigma', 'jumpIntensity', 'jumpMean', 'jumpStdev'],
  bates: ['v0', 'kappa', 'theta', 'volOfVol', 'rho', 'jumpIntensity', 'jumpMean', 'jumpStdev'],
  'heston-kou': [
    'v0',
    'kappa',
    'theta',
    'volOfVol',
    'rho',
    'jumpIntensity',
    'upProbability',
    'upMean',
    'downMean',
  ],
};

export const toUnbounded = (x: number, b: Bound) => {
  const u = Math.min(1 - 1e-12, Math.max(1e-12, (x - b.lo) / (b.hi - b.lo)));
  return Math.log(u / (1 - u));
};
export const toBounded = (z: number, b: Bound) => b.lo + (b.hi - b.lo) / (1 + Math.exp(-z));

/** Whether x sits within 0.1 % of the width of either bound. */
export const onBound = (x: number, b: Bound) =>
  (x - b.lo) / (b.hi - b.lo) < 1e-3 || (b.hi - x) / (b.hi - b.lo) < 1e-3;

const PRIMES = [2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31];

/** Point `index` (1-based) of the Halton sequence in `dims` dimensions. */
export function halton(index: number, dims: number): number[] {
  return Array.from({ length: dims }, (_, d) => {
    const base = PRIMES[d];
    let f = 1;
    let r = 0;
    let i = index;
    while (i > 0) {
      f /= base;
      r += f * (i % base);
      i = Math.floor(i / base);
    }
    return r;
  });
}

/** The free parameters of a model kind, less the fixed ones. */
export function freeParameters(kind: ModelKind, fixed: readonly string[]): string[] {
  return PARAMETERS[kind].filter((p) => !fixed.includes(p));
}

export function withParameters(
  model: Model,
  names: readonly string[],
  values: ArrayLike<number>,
): Model {
  const m = { ...model } as Record<string, unknown>;
  names.forEach((n, i) => (m[n] = values[i]));
  return m as unknown as Model;
}

const TYPICAL: Record<string, number> = {
  sigma: 0.2,
  v0: 0.04,
  kappa: 1.5,
  theta: 0.04,
  volOfVol: 0.5,
  rho: -0.6,
  jumpIntensity: 0.3,
  jumpMean: -0.08,
  jumpStdev: 0.1,
  upProbability: 0.3,
  upMean: 0.04,
  downMean: 0.08,
};

/** A full starting guess: the caller's values, typical ones for the parameters not given. */
export function completeGuess(kind: ModelKind, given: Record<string, unknown>): Model {
  const m: Record<string, unknown> = { kind };
  for (const p of PARAMETERS[kind]) m[p] = typeof given[p] === 'number' ? given[p] : TYPICAL[p];
  return m as unknown as Model;
}
