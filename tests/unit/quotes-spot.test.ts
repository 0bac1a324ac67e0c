/**
 * Quotes that carry their own forward are read against it, and the spot their forwards imply
 * is reported so that a scenario on another spot can be pointed out (common practice: the
 * forward is what a chain is priced on).
 */
import { describe, expect, it } from 'vitest';
import { blackPrice } from '../../src/engine/analytic';
import { parseQuotesCsv, SPOT_MISMATCH } from '../../src/engine/fit';

const market = { spot: 4250, rate: 0.031, dividendYield: 0.017 };

describe('quotes with their own forwards', () => {
  it('reads a price against the row forward: the Black vol it was made with comes back', () => {
    const F = 4470 * Math.exp(0.014 * 0.25);
    const price = blackPrice({
      forward: F,
      strike: 4400,
      sigma: 0.18,
      expiry: 0.25,
      discount: Math.exp(-0.031 * 0.25),
      isCall: false,
    });
    const text = `expiry,strike,type,price,forward,rate\n0.25,4400,put,${price},${F},0.031`;
    const parsed = parseQuotesCsv(text, market, '2026-12-02');
    expect(parsed.issues).toEqual([]);
    expect(parsed.quotes[0].impliedVol).toBeCloseTo(0.18, 10);
  });

  it('reports the spot the forwards imply (the median), and none without forwards', () => {
    const rows = ['expiry,strike,impliedVol,forward'];
    for (const [T, spot] of [
      [0.1, 4460],
      [0.25, 4470],
      [0.5, 4480],
    ])
      rows.push(`${T},4400,0.2,${spot * Math.exp(0.014 * T)}`);
    const parsed = parseQuotesCsv(rows.join('\n'), market, '2026-12-02');
    expect(parsed.impliedSpot).toBeCloseTo(4470, 8);
    expect(Math.abs(parsed.impliedSpot! / market.spot - 1)).toBeGreaterThan(SPOT_MISMATCH);
    const plain = parseQuotesCsv('expiry,strike,impliedVol\n0.25,4400,0.2', market, '2026-12-02');
    expect(plain.impliedSpot).toBeUndefined();
  });
});
