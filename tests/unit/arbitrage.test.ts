import { describe, expect, it } from 'vitest';
import { forwardPrice, type Model } from '../../src/engine/core';
import { arbitrageFlags, modelVols, type ArbitrageQuote } from '../../src/engine/fit';

const market = { spot: 100, rate: 0.02, dividendYield: 0.01 };
const bates: Model = {
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

/** A clean surface: a Bates model's vols are free of static arbitrage (common practice). */
function surface(): ArbitrageQuote[] {
  const out: ArbitrageQuote[] = [];
  for (const d of [14, 30, 91, 182])
    for (let i = 0; i < 11; i++) {
      const expiry = d / 365;
      out.push({
        expiry,
        strike: 80 + 4 * i,
        impliedVol: 0,
        forward: forwardPrice(market, expiry),
      });
    }
  modelVols(market, bates, out).forEach((v, i) => (out[i].impliedVol = v!));
  return out;
}

const at = (qs: ArbitrageQuote[], days: number, strike: number) =>
  qs.find((q) => Math.round(q.expiry * 365) === days && q.strike === strike)!;

describe('static-arbitrage flags', () => {
  it('a clean surface has no flag', () => {
    expect(arbitrageFlags(surface())).toEqual([]);
  });

  it('flags a planted butterfly violation with its three quotes', () => {
    const qs = surface();
    at(qs, 30, 100).impliedVol += 0.08; // a spike at the money
    const flags = arbitrageFlags(qs).filter((f) => f.kind === 'butterfly');
    expect(flags.length).toBeGreaterThan(0);
    expect(
      flags.some((f) =>
        f.quotes.some((q) => q.strike === 100 && Math.round(q.expiry * 365) === 30),
      ),
    ).toBe(true);
    expect(flags.every((f) => f.size > 0)).toBe(true);
  });

  it('flags a planted vertical violation: a call priced above the next lower strike', () => {
    const qs = surface();
    at(qs, 91, 108).impliedVol = 0.6; // the 108 call now costs more than the 104 call
    const vertical = arbitrageFlags(qs).filter((f) => f.kind === 'vertical');
    expect(vertical).toHaveLength(1);
    expect(vertical[0].quotes.map((q) => q.strike)).toEqual([104, 108]);
  });

  it('flags a planted calendar violation: less total variance at a later expiry', () => {
    const qs = surface();
    at(qs, 91, 96).impliedVol *= 0.5;
    const calendar = arbitrageFlags(qs).filter((f) => f.kind === 'calendar');
    expect(calendar.length).toBeGreaterThan(0);
    expect(
      calendar.every((f) =>
        f.quotes.some((q) => q.strike === 96 && Math.round(q.expiry * 365) === 91),
      ),
    ).toBe(true);
  });
});
