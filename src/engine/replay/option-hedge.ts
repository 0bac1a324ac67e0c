/**
 * The option hedges of a replay: at each rebalance hold the hedge option in the quantity that
 * zeroes the book's model gamma (model-delta-gamma) or model vega (model-delta-vega), then hold
 * the underlying against the delta that is left, both read from the model's tables. The option
 * is marked to the model on every step and, held past the horizon, sold at its model value there.
 */
import { buildHedgeTable, lookupGreeks, type HedgeTable } from './hedge-table';
import type { HedgeMethod, ReplayRequest } from './replay';
import type { OptionSpec } from '../core/types';

/** The option a gamma or vega hedge trades: one unit is one option on one unit of underlying. */
export type HedgeInstrument = OptionSpec;

export const isOptionHedge = (method: HedgeMethod): boolean =>
  method === 'model-delta-gamma' || method === 'model-delta-vega';

/**
 * The most hedge options held, per unit of the book's total leg quantity: where the option's
 * gamma or vega nearly vanishes the ratio would run away.
 */
export const MAX_HEDGE_RATIO = 20;

export interface OptionHedgePlan {
  /** the hedge option's model value per unit at rebalance k (k = steps: at the horizon) */
  unitValue(k: number, v: number, x: number): number;
  /** the book's model value at rebalance k (k < steps) */
  bookValue(k: number, v: number, x: number): number;
  /**
   * options and shares to hold after the rebalance at k, given the options held before it
   * (written into one reused object)
   */
  holdings(k: number, v: number, x: number, held: number): { options: number; shares: number };
  table: HedgeTable;
}

export function planOptionHedge(
  req: ReplayRequest,
  times: readonly number[],
  horizon: number,
  book: HedgeTable,
): OptionHedgePlan | null {
  const { hedge, market, model } = req;
  const instrument = hedge.instrument;
  if (!isOptionHedge(hedge.method) || !instrument) return null;
  const n = times.length;
  const S0 = market.spot;
  const table = buildHedgeTable(
    market,
    model,
    [{ ...instrument, quantity: 1 }],
    [...times, horizon],
    {
      vega: hedge.method === 'model-delta-vega',
    },
  );
  const expiresAtHorizon = instrument.expiry <= horizon + 1e-10;
  const cap =
    MAX_HEDGE_RATIO *
    [...req.position, ...(req.overlay ?? [])].reduce((a, l) => a + Math.abs(l.quantity), 0);
  const byGamma = hedge.method === 'model-delta-gamma';
  // the Greeks at the last state each table was read at: a step's end is the next one's start
  const cached = (t: HedgeTable) => {
    const at = { k: -1, v: NaN, x: NaN };
    const out = { value: 0, delta: 0, gamma: 0, vega: 0 };
    return (k: number, v: number, x: number) => {
      if (at.k !== k || at.v !== v || at.x !== x) {
        lookupGreeks(t, k, v, x, S0, out);
        at.k = k;
        at.v = v;
        at.x = x;
      }
      return out;
    };
  };
  const greeksAt = cached(table);
  const bookAt = cached(book);
  const answer = { options: 0, shares: 0 };
  return {
    table,
    unitValue(k, v, x) {
      if (k < n || !expiresAtHorizon) return greeksAt(k, v, x).value;
      const S = S0 * Math.exp(x);
      return Math.max(
        0,
        instrument.type === 'call' ? S - instrument.strike : instrument.strike - S,
      );
    },
    bookValue(k, v, x) {
      return bookAt(k, v, x).value;
    },
    holdings(k, v, x, held) {
      const g = bookAt(k, v, x);
      const gi = greeksAt(k, v, x);
      const exposure = byGamma ? g.gamma : g.vega;
      const perUnit = byGamma ? gi.gamma : gi.vega;
      // where the option has (next to) none of the exposure, keep what is held
      answer.options =
        Math.abs(perUnit) > 1e-12 * Math.max(1, Math.abs(exposure))
          ? Math.max(-cap, Math.min(cap, -exposure / perUnit))
          : held;
      answer.shares = -(g.delta + answer.options * gi.delta);
      return answer;
    },
  };
}
