import { describe, expect, it } from 'vitest';
import { blackPrice } from '../../src/engine/analytic';
import { parseQuotesCsv } from '../../src/engine/fit';

const market = { spot: 100, rate: 0, dividendYield: 0 };

describe('quotes CSV', () => {
  it('keeps good rows, turns prices and bid/ask into vols, and lists each bad row', () => {
    const price = blackPrice({
      forward: 100,
      strike: 110,
      sigma: 0.2,
      expiry: 0.5,
      discount: 1,
      isCall: true,
    });
    const csv = [
      'expiry,strike,impliedVol,type,price,bid,ask',
      '0.25,100,0.21,,,,',
      `0.5,110,,call,${price},,`,
      `0.5,120,,call,,${price * 0.5},${price * 0.6}`,
      '2026-11-01,100,0.2,,,,', // past
      '0.25,abc,0.2,,,,', // text in a numeric column
      '0.25,-5,0.2,,,,', // negative strike
      '0.25,100,0.22,,,,', // duplicate
      '0.5,90,,put,95,,', // above the no-arbitrage bound for a put (K·DF = 90)
    ].join('\n');
    const r = parseQuotesCsv(csv, market, '2026-12-01');
    expect(r.quotes).toHaveLength(3);
    expect(r.quotes[1].impliedVol).toBeCloseTo(0.2, 10);
    expect(r.issues.map((i) => [i.line, i.field])).toEqual([
      [5, 'expiry'],
      [6, 'strike'],
      [7, 'strike'],
      [8, 'strike'],
      [9, 'price'],
    ]);
  });

  it('refuses an empty file, a wrong delimiter, a file where every row is bad, and 10 MB', () => {
    expect(parseQuotesCsv('', market, '2026-12-01').fileError).toBe('the file is empty');
    expect(
      parseQuotesCsv('expiry|strike|impliedVol\n0.25|100|0.2', market, '2026-12-01').fileError,
    ).toMatch(/delimiter/);
    const allBad = parseQuotesCsv(
      'expiry,strike,impliedVol\nx,100,0.2\n0.25,y,0.2',
      market,
      '2026-12-01',
    );
    expect(allBad.quotes).toHaveLength(0);
    expect(allBad.issues).toHaveLength(2);
    expect(parseQuotesCsv('x'.repeat(10 * 1024 * 1024), market, '2026-12-01').fileError).toMatch(
      /over 2 MB/,
    );
  });
});
