/** A new scenario's starting point: a Bates market a trader would recognise as ordinary. */
import type { Model } from './types';
import { SCENARIO_FORMAT, type ScenarioDocument } from './schema';
import { NO_STRESS } from './stress';

/** Tenors in years (ACT/365) for the grid: 1D, 1W, 2W, 1M, 3M, 6M, 1Y. */
export const TENORS: ReadonlyArray<{ label: string; years: number }> = [
  { label: '1D', years: 1 / 365 },
  { label: '1W', years: 7 / 365 },
  { label: '2W', years: 14 / 365 },
  { label: '1M', years: 30 / 365 },
  { label: '3M', years: 91 / 365 },
  { label: '6M', years: 182 / 365 },
  { label: '1Y', years: 1 },
];

export function defaultMoneyness(points = 41, halfWidth = 0.3): number[] {
  return Array.from({ length: points }, (_, i) => -halfWidth + (2 * halfWidth * i) / (points - 1));
}

/** The model a new scenario starts from (also the benchmarks' model). */
export const DEFAULT_BATES: Extract<Model, { kind: 'bates' }> = {
  kind: 'bates',
  v0: 0.04,
  kappa: 1.5,
  theta: 0.04,
  volOfVol: 0.5,
  rho: -0.7,
  jumpIntensity: 0.5,
  jumpMean: -0.1,
  jumpStdev: 0.15,
};

export function newScenario(id: string, name: string, valuationDate: string): ScenarioDocument {
  return {
    format: SCENARIO_FORMAT,
    id,
    name,
    notes: '',
    valuationDate,
    market: { spot: 100, rate: 0.03, dividendYield: 0.01 },
    model: { ...DEFAULT_BATES },
    stress: { ...NO_STRESS },
    grid: {
      expiries: TENORS.slice(0, 5).map((t) => t.years),
      moneyness: defaultMoneyness(),
      strikeSpacing: 'standard-deviations',
    },
    runs: [],
  };
}
