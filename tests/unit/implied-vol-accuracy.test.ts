import { describe, expect, it } from 'vitest';
import {
  cosStrip,
  impliedVol,
  impliedVolFromOtm,
  lewisPrice,
  modelSpec,
  normalisedImpliedSigma,
  normalisedOtmCall,
  prepareCos,
  priceOptions,
  stripImpliedVols,
} from '../../src/engine/analytic';
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

// A root search may start from a neighbouring strike's vol. Whatever the start, the root is the
// Black-Scholes formula's own (Black 1976, in Jäckel's normalised form).
describe('implied vols do not depend on where the root search starts', () => {
  it('guesses from 1/1000 to 1000 times the root, either side of the inflection point', () => {
    for (const x of [-2, -0.3, -0.01, 0]) {
      for (const s of [0.005, 0.05, 0.3, 1.5, 6]) {
        const beta = normalisedOtmCall(x, s);
        if (!(beta > 1e-200)) continue; // e.g. 2 log-units out at s = 0.005: nothing to invert
        const cold = normalisedImpliedSigma(x, beta);
        expect(Math.abs(cold / s - 1), `x=${x} s=${s}`).toBeLessThan(1e-12);
        // the root is set to about ε·b/(s·∂b/∂s) relative: wider where b(s) flattens
        const vega = Math.exp(-0.5 * ((x / s) ** 2 + (s / 2) ** 2)) / Math.sqrt(2 * Math.PI);
        const tolerance = Math.max(4e-15, (8 * Number.EPSILON * beta) / (s * vega));
        // starts within 1e-4 end after one Householder step: they must land as close
        for (const factor of [
          1e-3,
          0.5,
          0.99,
          0.999,
          1 - 1e-4,
          1 - 3e-5,
          1 + 3e-5,
          1 + 1e-4,
          1.001,
          1.01,
          2,
          8,
          1e3,
        ]) {
          const warm = normalisedImpliedSigma(x, beta, s * factor);
          expect(Math.abs(warm / cold - 1), `x=${x} s=${s} ×${factor}`).toBeLessThan(tolerance);
        }
      }
    }
  });

  it('a strip solved strike by strike from its neighbours matches one solved cold', () => {
    for (const model of Object.values(MODELS)) {
      for (const T of [1 / 365, 0.25, 10]) {
        const sd = 0.22 * Math.sqrt(T);
        const ks = Float64Array.from({ length: 41 }, (_, i) => sd * (-3.5 + (7 * i) / 40));
        const n = ks.length;
        const [call, put, cdf, density] = Array.from({ length: 4 }, () => new Float64Array(n));
        cosStrip(prepareCos(modelSpec(model), T), ks, call, put, cdf, density);
        const strip = stripImpliedVols(call, put, ks, T);
        ks.forEach((k, j) => {
          const cold = impliedVolFromOtm(k < 0 ? put[j] : call[j], k, T);
          expect(strip[j] === null, `T=${T} k=${k}`).toBe(cold === null);
          if (cold !== null) expect(Math.abs(strip[j]! / cold - 1)).toBeLessThan(4e-15);
        });
      }
    }
  });
});
