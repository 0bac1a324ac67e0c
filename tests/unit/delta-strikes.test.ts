/**
 * The 25Δ and 10Δ strikes behind the smile summaries, against Black-Scholes inversion of the
 * delta formula (Hull, "Options, Futures, and Other Derivatives", the delta of a European call,
 * N(d1) with d1 = (ln(F/K) + σ²T/2)/(σ√T)). The smile quotes forward (undiscounted) deltas, so
 * Hull's e^{−qT} factor is left out: a call of delta Δ has K = F·exp(−σ√T·N⁻¹(Δ) + σ²T/2), and
 * the put quoted at delta Δ is the call of delta 1 − Δ.
 */
import { describe, expect, it } from 'vitest';
import { normCdf, normInv, priceOptions, smileSurface } from '../../src/engine/analytic';
import { DEFAULT_BATES, type Market, type Model } from '../../src/engine/core';

const market: Market = { spot: 100, rate: 0.03, dividendYield: 0.01 };

/** Hull's call delta inverted for the strike, at vol σ. */
function strikeForCallDelta(F: number, sigma: number, T: number, delta: number): number {
  const s = sigma * Math.sqrt(T);
  return F * Math.exp(-s * normInv(delta) + 0.5 * s * s);
}

describe('delta strikes of the smile summaries', () => {
  it('under Black-Scholes the 10Δ and 25Δ strikes are the delta formula inverted', () => {
    const sigma = 0.2;
    const expiries = [1 / 365, 7 / 365, 30 / 365, 1];
    const surface = smileSurface(market, { kind: 'black-scholes', sigma }, expiries, [0]);
    surface.slices.forEach((s) => {
      const F = s.forward;
      const T = s.expiry;
      expect(s.strike10Call).toBeCloseTo(strikeForCallDelta(F, sigma, T, 0.1), 8);
      expect(s.strike10Put).toBeCloseTo(strikeForCallDelta(F, sigma, T, 0.9), 8);
      expect(s.strike25Call).toBeCloseTo(strikeForCallDelta(F, sigma, T, 0.25), 8);
      expect(s.strike25Put).toBeCloseTo(strikeForCallDelta(F, sigma, T, 0.75), 8);
      // a flat smile has no risk reversal or butterfly
      expect(Math.abs(s.rr10!)).toBeLessThan(1e-10);
      expect(Math.abs(s.bf10!)).toBeLessThan(1e-10);
    });
  });

  it("under Bates each 10Δ strike has forward delta 0.1 (or 0.9) at the smile's own vol there", () => {
    const model: Model = DEFAULT_BATES;
    const expiries = [1 / 365, 7 / 365, 91 / 365, 1];
    const surface = smileSurface(market, model, expiries, [0]);
    surface.slices.forEach((s) => {
      const T = s.expiry;
      for (const [K, delta] of [
        [s.strike10Call!, 0.1],
        [s.strike10Put!, 0.9],
      ]) {
        const [priced] = priceOptions(market, model, [{ type: 'call', strike: K, expiry: T }]);
        const sigma = priced.impliedVol!;
        const rootT = sigma * Math.sqrt(T);
        const d1 = (Math.log(s.forward / K) + 0.5 * rootT * rootT) / rootT;
        expect(normCdf(d1)).toBeCloseTo(delta, 9);
        expect(strikeForCallDelta(s.forward, sigma, T, delta)).toBeCloseTo(K, 6);
      }
      // the index skew: the 10Δ put's vol is above the 10Δ call's
      expect(s.rr10!).toBeLessThan(0);
    });
  });
});
