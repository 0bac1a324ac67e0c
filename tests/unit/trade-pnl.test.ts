import { describe, expect, it } from 'vitest';
import {
  bookTotal,
  legRisks,
  pnlSinceTrade,
  vegaByExpiry,
  type Position,
} from '../../src/engine/book';
import { DEFAULT_BATES, type Model } from '../../src/engine/core';

const market = { spot: 100, rate: 0.02, dividendYield: 0.01 };
/** the project's default Bates model (core's DEFAULT_BATES) */
const bates: Model = DEFAULT_BATES;

describe('P&L since trade and vega by expiry', () => {
  it('P&L since trade is quantity × (price now − trade price) on the legs that carry one (common practice); a leg traded at today’s model price shows 0', () => {
    const book: Position[] = [
      { id: 'put', type: 'put', strike: 95, expiry: 5 / 365, quantity: -10 },
      { id: 'call', type: 'call', strike: 105, expiry: 60 / 365, quantity: 4, tradePrice: 1.5 },
      { id: 'stock', type: 'underlying', quantity: 3, tradePrice: 98 },
    ];
    const legs = legRisks(market, bates, book);
    const priceNow = legs[0].value / -10;
    const withTrade = [{ ...book[0], tradePrice: priceNow }, book[1], book[2]];
    const r = pnlSinceTrade(withTrade, legs);
    expect(Math.abs(r.legs[0]!)).toBeLessThan(1e-12);
    expect(r.legs[1]).toBeCloseTo(legs[1].value - 4 * 1.5, 12);
    expect(r.legs[2]).toBeCloseTo(3 * (100 - 98), 12);
    expect(r.priced).toBe(3);
    expect(pnlSinceTrade(book, legs).legs[0]).toBeNull();
  });

  it('vega by expiry puts each leg in its bucket and the buckets add up to the book vega', () => {
    const book: Position[] = [
      { id: 'a', type: 'put', strike: 95, expiry: 3 / 365, quantity: -10 },
      { id: 'b', type: 'call', strike: 100, expiry: 20 / 365, quantity: 5 },
      { id: 'c', type: 'put', strike: 90, expiry: 0.5, quantity: 2 },
      { id: 'd', type: 'call', strike: 120, expiry: 2, quantity: 1 },
      { id: 'e', type: 'underlying', quantity: 7 },
    ];
    const legs = legRisks(market, bates, book);
    const buckets = vegaByExpiry(book, legs);
    expect(buckets.map((b) => b.label)).toEqual(['to 1W', '1W–1M', '1M–3M', '3M–1Y', 'over 1Y']);
    expect(buckets[0].vega).toBeCloseTo(legs[0].vega, 12);
    expect(buckets[1].vega).toBeCloseTo(legs[1].vega, 12);
    expect(buckets[2].vega).toBe(0);
    expect(buckets[3].vega).toBeCloseTo(legs[2].vega, 12);
    expect(buckets[4].vega).toBeCloseTo(legs[3].vega, 12);
    const sum = buckets.reduce((a, b) => a + b.vega, 0);
    expect(sum).toBeCloseTo(bookTotal(legs).vega, 10);
  });
});
