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

/**
 * A random law of the Heston family for property sweeps: Heston, Bates, SVCJ and Heston-Kou in
 * turn by `i`, parameters uniform over wide ranges (ρ from −0.95 to 0.6, ξ up to 1.5, up to
 * three jumps a year); `u(lo, hi)` draws one uniform number.
 */
export function randomHestonFamily(
  i: number,
  u: (lo: number, hi: number) => number,
): { model: Model; v0: number } {
  const diffusion = {
    v0: u(0.005, 0.3),
    kappa: u(0.2, 5),
    theta: u(0.01, 0.2),
    volOfVol: u(0.1, 1.5),
    rho: u(-0.95, 0.6),
  };
  const jumps = { jumpIntensity: u(0, 3), jumpMean: u(-0.3, 0.1), jumpStdev: u(0.01, 0.3) };
  const models: Model[] = [
    { kind: 'heston', ...diffusion },
    { kind: 'bates', ...diffusion, ...jumps },
    {
      kind: 'svcj',
      ...diffusion,
      ...jumps,
      varianceJumpMean: u(0, 0.1),
      jumpCorrelation: u(-1, 0.5),
    },
    {
      kind: 'heston-kou',
      ...diffusion,
      jumpIntensity: u(0, 3),
      upProbability: u(0, 1),
      upMean: u(0.01, 0.1),
      downMean: u(0.01, 0.2),
    },
  ];
  return { model: models[i % 4], v0: diffusion.v0 };
}
