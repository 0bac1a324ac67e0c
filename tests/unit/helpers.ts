/** Small builders shared by the engine tests. */
import { lewisPrice, priceOptions } from '../../src/engine/analytic';
import type { Market, Model, OptionType } from '../../src/engine/core';

export function market(spot: number, rate = 0, dividendYield = 0): Market {
  return { spot, rate, dividendYield };
}

export function heston(
  kappa: number,
  theta: number,
  volOfVol: number,
  rho: number,
  v0: number,
): Model {
  return { kind: 'heston', kappa, theta, volOfVol, rho, v0 };
}

export function cosPrice(
  m: Market,
  model: Model,
  type: OptionType,
  strike: number,
  expiry: number,
): number {
  return priceOptions(m, model, [{ type, strike, expiry }])[0].price;
}

export { lewisPrice };

/** One parameter set per model family, shared by the tests that sweep every kind. */
export const CASE_HESTON = { v0: 0.04, kappa: 1.5, theta: 0.05, volOfVol: 0.6, rho: -0.7 };
export const MODEL_CASES: Record<'heston' | 'merton' | 'bates' | 'heston-kou', Model> = {
  heston: { kind: 'heston', ...CASE_HESTON },
  merton: { kind: 'merton', sigma: 0.18, jumpIntensity: 0.8, jumpMean: -0.08, jumpStdev: 0.12 },
  bates: { kind: 'bates', ...CASE_HESTON, jumpIntensity: 0.5, jumpMean: -0.1, jumpStdev: 0.15 },
  'heston-kou': {
    kind: 'heston-kou',
    ...CASE_HESTON,
    jumpIntensity: 1,
    upProbability: 0.3,
    upMean: 0.04,
    downMean: 0.09,
  },
};
