/**
 * An invented option chain for the Fit page's first visit: calls and puts at every strike on a
 * scenario's market, priced by its model at six expiries from one week to six months, with
 * seeded noise on the vols (a tenth of a vol point, the same for the call and the put of a
 * strike, so put–call parity holds at the mids) and a bid/ask around each price on a 0.05 tick.
 * Its forwards are read back by parity; fitting it recovers the model it came from, within the
 * noise.
 */
import seedrandom from 'seedrandom';
import { blackPrice } from '../analytic/black';
import { normPdf } from '../analytic/normal';
import { priceOptions } from '../analytic/pricing';
import { addDays } from '../core/dates';
import { discountFactor, forwardPrice } from '../core/market';
import type { Market, Model, OptionSpec } from '../core/types';

export interface DemoChainRequest {
  market: Market;
  model: Model;
  valuationDate: string;
  seed?: number;
}

const DAYS = [7, 14, 30, 61, 91, 182];
const TICK = 0.05;
/** vol noise and the half-spread, in vol points */
const NOISE_VOL_POINTS = 0.1;
const HALF_SPREAD_VOL_POINTS = 0.4;

/** The chain as CSV rows `expiry,strike,type,bid,ask` (expiry as a date). */
export function demoChainCsv(req: DemoChainRequest): string {
  const { market, model } = req;
  const random = seedrandom.alea(`saltation:demo-chain:${req.seed ?? 20261202}`);
  // Box-Muller, one normal per call
  const normal = () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
  const step = market.spot > 1000 ? 25 : market.spot > 100 ? 5 : 0.5;
  const rows = ['expiry,strike,type,bid,ask'];
  for (const days of DAYS) {
    const T = days / 365;
    const F = forwardPrice(market, T);
    const df = discountFactor(market, T);
    const [atm] = priceOptions(market, model, [{ type: 'call', strike: F, expiry: T }]);
    const sd = (atm.impliedVol ?? 0.2) * Math.sqrt(T);
    const strikes = new Set<number>();
    for (let z = -3.5; z <= 2.5 + 1e-9; z += 0.25)
      strikes.add(Math.round((F * Math.exp(z * sd)) / step) * step);
    const options: OptionSpec[] = [...strikes]
      .sort((a, b) => a - b)
      .map((K) => ({ type: K < F ? 'put' : 'call', strike: K, expiry: T }));
    const priced = priceOptions(market, model, options);
    options.forEach((o, i) => {
      const vol = priced[i].impliedVol;
      if (vol === null) return;
      const sigma = vol + (NOISE_VOL_POINTS / 100) * normal();
      for (const isCall of [true, false]) {
        const inputs = { forward: F, strike: o.strike, expiry: T, discount: df, isCall };
        const mid = blackPrice({ ...inputs, sigma });
        const d1 = Math.log(F / o.strike) / (sigma * Math.sqrt(T)) + 0.5 * sigma * Math.sqrt(T);
        const vega = df * F * normPdf(d1) * Math.sqrt(T);
        const half = Math.max(TICK, vega * (HALF_SPREAD_VOL_POINTS / 100));
        const bid = Math.floor((mid - half) / TICK) * TICK;
        const ask = Math.ceil((mid + half) / TICK) * TICK;
        if (bid < TICK) continue; // no bid: not quoted
        rows.push(
          `${addDays(req.valuationDate, days)},${o.strike},${isCall ? 'call' : 'put'},${bid.toFixed(2)},${ask.toFixed(2)}`,
        );
      }
    });
  }
  return rows.join('\n') + '\n';
}
