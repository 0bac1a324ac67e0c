import { describe, expect, it } from 'vitest';
import { priceOptions } from '../../src/engine/analytic';
import type { Model } from '../../src/engine/core';
import { quantlibBatesPrices } from '../support/quantlib';

// Outside reference: @quantlib/ql's Heston engine with the Bates jump term written out correctly
// (the packaged BatesEngine's term is wrong; see tests/support/quantlib.ts).
describe('Bates against QuantLib’s Heston engine with the corrected jump term', () => {
  const p = {
    kappa: 1.5768,
    theta: 0.0398,
    volOfVol: 0.5751,
    rho: -0.5711,
    v0: 0.0175,
    jumpIntensity: 0.5,
    jumpMean: -0.1,
    jumpStdev: 0.15,
  };

  it('reproduces the computed reference 7.558073816048 itself (harness check)', () => {
    const [v] = quantlibBatesPrices(100, 0, 0, p, [{ type: 'call', strike: 100, days: 365 }]);
    expect(Math.abs(v - 7.558073816048)).toBeLessThan(1e-10);
  });

  it('agrees within 1e-8 × spot from 1 week to 5 years over strikes 70–130', () => {
    const options: { type: 'call' | 'put'; strike: number; days: number }[] = [];
    for (const days of [7, 30, 91, 365, 1825])
      for (const strike of [70, 85, 100, 115, 130])
        options.push({ type: strike < 100 ? 'put' : 'call', strike, days });
    const reference = quantlibBatesPrices(100, 0.02, 0.01, p, options);
    const model: Model = { kind: 'bates', ...p };
    const ours = priceOptions(
      { spot: 100, rate: 0.02, dividendYield: 0.01 },
      model,
      options.map((o) => ({ type: o.type, strike: o.strike, expiry: o.days / 365 })),
    );
    ours.forEach((o, i) =>
      expect(Math.abs(o.price - reference[i]), JSON.stringify(options[i])).toBeLessThan(1e-6),
    );
  });
});
