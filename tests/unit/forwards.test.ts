import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { blackPrice } from '../../src/engine/analytic';
import { chainForwards, prepareChain, spreadErrors, type ChainQuote } from '../../src/engine/fit';

/**
 * A chain made from Black-Scholes prices (common practice: put–call parity holds exactly for
 * them) at a known forward and discount per expiry, each mid moved by noise inside its own
 * random spread, and two quotes per expiry corrupted by many spreads.
 */
function chain(seed: string, corrupt = true) {
  const rng = seedrandom(seed);
  const truth = [7, 14, 30, 61, 91, 182].map((d) => {
    const T = d / 365;
    return { T, F: 4250 * Math.exp(0.012 * T), D: Math.exp(-0.031 * T) };
  });
  const quotes: ChainQuote[] = [];
  for (const { T, F, D } of truth) {
    const sd = 0.2 * Math.sqrt(T);
    const strikes = Array.from({ length: 24 }, (_, i) =>
      Math.round(F * Math.exp(sd * (-2 + (4 * i) / 23))),
    );
    const bad = corrupt ? [5, 17] : [];
    strikes.forEach((K, i) => {
      for (const isCall of [true, false]) {
        const price = blackPrice({
          forward: F,
          strike: K,
          sigma: 0.2,
          expiry: T,
          discount: D,
          isCall,
        });
        const half = 0.5 * Math.max(0.05, price * (0.002 + 0.008 * rng()));
        let mid = price + half * (2 * rng() - 1);
        if (bad.includes(i) && isCall) mid += 12 * half + 2;
        quotes.push({
          expiry: T,
          strike: K,
          type: isCall ? 'call' : 'put',
          bid: Math.max(0.05, mid - half),
          ask: Math.max(0.05, mid - half) + 2 * half,
        });
      }
    });
  }
  return { truth, quotes };
}

describe('forwards from put–call parity', () => {
  it('recovers each of 6 forwards within 2 bp, with two corrupted quotes per expiry, and the true discount within 3 reported standard errors', () => {
    const { truth, quotes } = chain('parity');
    const f = chainForwards(quotes);
    expect(f).toHaveLength(6);
    f.forEach((e, i) => {
      expect(Math.abs(e.forward / truth[i].F - 1), `expiry ${i}`).toBeLessThan(2e-4);
      expect(Math.abs(e.discount - truth[i].D), `expiry ${i}`).toBeLessThan(3 * e.discountStdError);
      expect(e.dropped.filter((d) => d.reason === 'outlier').length).toBeGreaterThanOrEqual(2);
    });
  });

  it('with a given rate, the discount is exact and only the forward is fitted', () => {
    const { truth, quotes } = chain('parity-rate');
    const f = chainForwards(quotes, 0.031);
    f.forEach((e, i) => {
      expect(e.discount).toBe(Math.exp(-0.031 * truth[i].T));
      expect(e.discountStdError).toBe(0);
      expect(Math.abs(e.forward / truth[i].F - 1)).toBeLessThan(2e-4);
    });
  });

  it('drops and names zero-bid, crossed and locked quotes', () => {
    const { quotes } = chain('parity-bad', false);
    const T = quotes[0].expiry;
    const some = quotes.filter((q) => q.expiry === T);
    some[0].bid = 0;
    some[2].bid = some[2].ask + 1;
    some[4].bid = some[4].ask;
    const [e] = chainForwards(some);
    const reasons = e.dropped.map((d) => d.reason);
    expect(reasons).toContain('zero bid');
    expect(reasons).toContain('crossed');
    expect(reasons).toContain('locked');
  });
});

describe('a chain made ready for a fit', () => {
  it('keeps the out-of-the-money side at each strike, at the parity forward, with bid and ask vols around the mid', () => {
    const { truth, quotes } = chain('prepared', false);
    const prepared = prepareChain(quotes);
    expect(prepared.forwards).toHaveLength(6);
    for (const q of prepared.quotes) {
      const f = prepared.forwards.find((e) => e.expiry === q.expiry)!;
      expect(q.type).toBe(q.strike < f.forward ? 'put' : 'call');
      if (q.bidVol !== null) expect(q.bidVol).toBeLessThanOrEqual(q.impliedVol);
      expect(q.askVol!).toBeGreaterThanOrEqual(q.impliedVol);
      // Black-Scholes at 20 % with noise inside the spread: the mid vol is close to 20 %
      expect(Math.abs(q.impliedVol - 0.2)).toBeLessThan(0.02);
    }
    expect(prepared.quotes.length).toBeGreaterThan(6 * 20);
    // the model at the true vol sits inside every spread
    const within = spreadErrors(
      prepared.quotes,
      prepared.quotes.map(() => 0.2),
    ).withinSpread;
    expect(within.every((w) => w.share > 0.9)).toBe(true);
    expect(truth).toHaveLength(6);
  });
});
