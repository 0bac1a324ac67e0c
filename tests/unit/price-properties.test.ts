import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { lewisPrice, priceOptions } from '../../src/engine/analytic';
import { discountFactor, forwardPrice, type Market, type Model } from '../../src/engine/core';

// No-arbitrage properties for random valid parameters (fast-check property tests).
const hestonPart = {
  v0: fc.double({ min: 0.005, max: 0.5, noNaN: true }),
  kappa: fc.double({ min: 0.2, max: 8, noNaN: true }),
  theta: fc.double({ min: 0.005, max: 0.5, noNaN: true }),
  volOfVol: fc.double({ min: 0, max: 1.5, noNaN: true }),
  rho: fc.double({ min: -0.95, max: 0.5, noNaN: true }),
};
const jumps = {
  jumpIntensity: fc.double({ min: 0, max: 3, noNaN: true }),
  jumpMean: fc.double({ min: -0.3, max: 0.1, noNaN: true }),
  jumpStdev: fc.double({ min: 0.01, max: 0.3, noNaN: true }),
};
const model: fc.Arbitrary<Model> = fc.oneof(
  fc.record({
    kind: fc.constant('black-scholes' as const),
    sigma: fc.double({ min: 0.05, max: 1.2, noNaN: true }),
  }),
  fc.record({ kind: fc.constant('heston' as const), ...hestonPart }),
  fc.record({
    kind: fc.constant('merton' as const),
    sigma: fc.double({ min: 0.05, max: 0.8, noNaN: true }),
    ...jumps,
  }),
  fc.record({ kind: fc.constant('bates' as const), ...hestonPart, ...jumps }),
  fc.record({
    kind: fc.constant('heston-kou' as const),
    ...hestonPart,
    jumpIntensity: fc.double({ min: 0, max: 3, noNaN: true }),
    upProbability: fc.double({ min: 0, max: 1, noNaN: true }),
    upMean: fc.double({ min: 0.01, max: 0.2, noNaN: true }),
    downMean: fc.double({ min: 0.01, max: 0.3, noNaN: true }),
  }),
);
const market: fc.Arbitrary<Market> = fc.record({
  spot: fc.double({ min: 1, max: 5000, noNaN: true }),
  rate: fc.double({ min: -0.01, max: 0.1, noNaN: true }),
  dividendYield: fc.double({ min: 0, max: 0.06, noNaN: true }),
});
const expiry = fc.double({ min: 1 / 365, max: 5, noNaN: true });

describe('prices respect no-arbitrage for any valid parameters', () => {
  it('calls fall and are convex in strike, within [max(DF(F−K), 0), DF·F], with finite Greeks', () => {
    fc.assert(
      fc.property(model, market, expiry, (m, mk, T) => {
        const F = forwardPrice(mk, T);
        const df = discountFactor(mk, T);
        const strikes = Array.from({ length: 31 }, (_, i) => F * Math.exp(-0.6 + 0.04 * i));
        const calls = priceOptions(
          mk,
          m,
          strikes.map((strike) => ({ type: 'call', strike, expiry: T })),
        );
        const tol = 1e-9 * mk.spot;
        calls.forEach((c, i) => {
          expect(
            Number.isFinite(c.price) &&
              Number.isFinite(c.delta) &&
              Number.isFinite(c.gamma) &&
              Number.isFinite(c.theta),
          ).toBe(true);
          expect(c.price).toBeGreaterThanOrEqual(Math.max(df * (F - strikes[i]), 0) - tol);
          expect(c.price).toBeLessThanOrEqual(df * F + tol);
          if (c.impliedVol !== null) expect(c.impliedVol).toBeGreaterThan(0);
          if (i > 0) expect(c.price).toBeLessThanOrEqual(calls[i - 1].price + tol);
          if (i > 0 && i < calls.length - 1) {
            // convexity on a geometric grid: slopes must not decrease
            const left = (c.price - calls[i - 1].price) / (strikes[i] - strikes[i - 1]);
            const right = (calls[i + 1].price - c.price) / (strikes[i + 1] - strikes[i]);
            expect(right).toBeGreaterThanOrEqual(left - 1e-7);
          }
        });
      }),
      { numRuns: 150, seed: 20261201 },
    );
  });

  it('the COS call and the independent Lewis put satisfy put-call parity C − P = DF·(F − K)', () => {
    fc.assert(
      fc.property(
        model,
        market,
        fc.double({ min: 7 / 365, max: 3, noNaN: true }),
        fc.double({ min: -0.3, max: 0.3, noNaN: true }),
        (m, mk, T, k) => {
          const F = forwardPrice(mk, T);
          const K = F * Math.exp(k);
          const call = priceOptions(mk, m, [{ type: 'call', strike: K, expiry: T }])[0].price;
          const put = lewisPrice(mk, m, 'put', K, T);
          // the COS range holds each tail by Chernoff's bound (the former symmetric range
          // missed by up to 1e-10 of spot where Heston's fat tail points up)
          expect(Math.abs(call - put - discountFactor(mk, T) * (F - K))).toBeLessThan(
            1e-11 * mk.spot,
          );
        },
      ),
      { numRuns: 100, seed: 7 },
    );
  });
});
