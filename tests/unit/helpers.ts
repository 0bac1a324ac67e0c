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
