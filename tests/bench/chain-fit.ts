/**
 * Benchmark: a chain of 8 expiries × 40 strikes × calls and puts with bid and ask, read by
 * put–call parity (forwards, cleaning, out-of-the-money mids with bid and ask vols) and fitted
 * with Bates, against the same Bates fit on the mids given directly (target: at most 1.5 s on
 * one core for the whole).
 */
import { blackPrice } from '../../src/engine/analytic';
import { DEFAULT_BATES, forwardPrice, discountFactor, type Market } from '../../src/engine/core';
import {
  calibrate,
  modelVols,
  prepareChain,
  type ChainQuote,
  type VolQuote,
} from '../../src/engine/fit';
import { fmt } from './timing';

const market: Market = { spot: 100, rate: 0.03, dividendYield: 0.01 };
const DAYS = [7, 14, 30, 61, 91, 182, 273, 365];

function chain(): { chain: ChainQuote[]; mids: VolQuote[] } {
  const mids: VolQuote[] = [];
  for (const d of DAYS) {
    const T = d / 365;
    const sd = 0.2 * Math.sqrt(T);
    for (let i = 0; i < 40; i++)
      mids.push({
        expiry: T,
        strike: forwardPrice(market, T) * Math.exp(sd * (-3 + (5 * i) / 39)),
        impliedVol: 0,
      });
  }
  modelVols(market, DEFAULT_BATES, mids).forEach((v, i) => (mids[i].impliedVol = v!));
  const quotes: ChainQuote[] = mids.flatMap((q) =>
    [true, false].map((isCall) => {
      const price = blackPrice({
        forward: forwardPrice(market, q.expiry),
        strike: q.strike,
        sigma: q.impliedVol,
        expiry: q.expiry,
        discount: discountFactor(market, q.expiry),
        isCall,
      });
      const half = Math.max(0.005, 0.01 * price);
      return {
        expiry: q.expiry,
        strike: q.strike,
        type: isCall ? 'call' : 'put',
        bid: Math.max(0, price - half),
        ask: price + half,
      } as ChainQuote;
    }),
  );
  return { chain: quotes, mids };
}

export function benchChainFit(): Record<string, string>[] {
  const { chain: quotes, mids } = chain();
  const t0 = performance.now();
  const prepared = prepareChain(quotes);
  const prepMs = performance.now() - t0;
  const chainFit = calibrate({ market, model: DEFAULT_BATES, quotes: prepared.quotes });
  const chainMs = performance.now() - t0;
  const t1 = performance.now();
  const midFit = calibrate({ market, model: DEFAULT_BATES, quotes: mids });
  const midMs = performance.now() - t1;
  return [
    {
      case: `chain of ${quotes.length} quotes: forwards, cleaning, Bates fit`,
      value: `${fmt(chainMs / 1000, 3)} s (parity and cleaning ${fmt(prepMs, 3)} ms)`,
      note: `RMSE ${fmt(chainFit.rmseVolPoints, 2)} vol pts; target at most 1.5 s: ${chainMs <= 1500 ? 'met' : 'MISSED'}`,
    },
    {
      case: `the same Bates fit on ${mids.length} given mids`,
      value: `${fmt(midMs / 1000, 3)} s`,
      note: `RMSE ${fmt(midFit.rmseVolPoints, 2)} vol pts; ratio ${fmt(chainMs / midMs, 3)}×`,
    },
  ];
}
