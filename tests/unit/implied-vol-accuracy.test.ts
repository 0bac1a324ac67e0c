import { describe, expect, it } from 'vitest';
import { impliedVol, lewisPrice, priceOptions } from '../../src/engine/analytic';
import { discountFactor, forwardPrice, type Market, type Model } from '../../src/engine/core';
import { CASE_HESTON, MODEL_CASES } from './helpers';

// The engine's implied vols against vols implied from the independent Lewis-integral prices,
// for every model from 1 day to 10 years, including parameters at their limits.
const heston = CASE_HESTON;
const MODELS: Record<string, Model> = {
  ...MODEL_CASES,
  'bates, vanishing vol-of-vol': {
    kind: 'bates',
    ...heston,
    volOfVol: 1e-8,
    v0: 0.05,
    jumpIntensity: 0.5,
    jumpMean: -0.1,
    jumpStdev: 0.15,
  },
  'bates, rare large jumps': {
    kind: 'bates',
    ...heston,
    jumpIntensity: 0.05,
    jumpMean: -0.3,
    jumpStdev: 0.05,
  },
};
const market: Market = { spot: 100, rate: 0.03, dividendYield: 0.01 };

describe('implied vols within 1e-6 of a high-precision reference', () => {
  for (const [name, model] of Object.entries(MODELS)) {
    it(`${name}: 1 day to 10 years, strikes ±3 standard deviations`, () => {
      for (const T of [1 / 365, 7 / 365, 0.25, 1, 10]) {
        const F = forwardPrice(market, T);
        const df = discountFactor(market, T);
        const sd = 0.22 * Math.sqrt(T);
        for (const z of [-3, -1.5, 0, 1.5, 3]) {
          const K = F * Math.exp(z * sd);
          const type = z < 0 ? 'put' : 'call';
          const ours = priceOptions(market, model, [{ type, strike: K, expiry: T }])[0];
          const refPrice = lewisPrice(market, model, type, K, T);
          const ref = impliedVol({
            price: refPrice,
            forward: F,
            strike: K,
            expiry: T,
            discount: df,
            isCall: type === 'call',
          });
          expect(ours.impliedVol, `${name} T=${T} z=${z}`).not.toBeNull();
          expect(Math.abs(ours.impliedVol! - ref.vol!), `${name} T=${T} z=${z}`).toBeLessThan(1e-6);
          expect(Math.abs(ours.price - refPrice)).toBeLessThan(1e-8 * market.spot);
        }
      }
    });
  }
});
