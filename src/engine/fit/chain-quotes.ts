/**
 * A chain of calls and puts with bid and ask, made ready for a fit: each expiry's forward and
 * discount by put–call parity (`forwards.ts`), then at each strike the out-of-the-money side
 * (puts below the forward, calls at and above it) as a vol quote at its mid, with the vols of
 * its bid and ask and a weight from its spread; quotes that cannot be used are listed.
 */
import { impliedVol } from '../analytic/implied-vol';
import type { VolQuote } from './calibrate';
import {
  chainForwards,
  cleanQuotes,
  type ChainQuote,
  type DroppedQuote,
  type ExpiryForward,
} from './forwards';

export interface ChainVolQuote extends VolQuote {
  type: 'call' | 'put';
  /** vols of the bid (null when below intrinsic) and of the ask */
  bidVol: number | null;
  askVol: number | null;
}

export interface PreparedChain {
  forwards: ExpiryForward[];
  quotes: ChainVolQuote[];
  dropped: (Omit<DroppedQuote, 'reason'> & {
    expiry: number;
    reason: DroppedQuote['reason'] | 'no implied vol' | 'no forward';
  })[];
}

export function prepareChain(chain: readonly ChainQuote[], rate?: number): PreparedChain {
  const forwards = chainForwards(chain, rate);
  const byExpiry = new Map(forwards.map((f) => [f.expiry, f]));
  const { kept, dropped: unusable } = cleanQuotes(chain);
  const dropped: PreparedChain['dropped'] = [...unusable];
  const quotes: ChainVolQuote[] = [];
  for (const q of kept) {
    const f = byExpiry.get(q.expiry);
    if (!f) {
      dropped.push({ expiry: q.expiry, strike: q.strike, type: q.type, reason: 'no forward' });
      continue;
    }
    const otm = q.strike < f.forward ? 'put' : 'call';
    if (q.type !== otm) continue; // the in-the-money side carries no extra information
    const vol = (price: number) =>
      impliedVol({
        price,
        forward: f.forward,
        strike: q.strike,
        expiry: q.expiry,
        discount: f.discount,
        isCall: q.type === 'call',
      }).vol;
    const mid = vol(0.5 * (q.bid + q.ask));
    if (mid === null) {
      dropped.push({ expiry: q.expiry, strike: q.strike, type: q.type, reason: 'no implied vol' });
      continue;
    }
    quotes.push({
      expiry: q.expiry,
      strike: q.strike,
      type: q.type,
      impliedVol: mid,
      forward: f.forward,
      bidVol: vol(q.bid),
      askVol: vol(q.ask),
      weight: 1 / Math.max(q.ask - q.bid, 1e-6 * q.ask),
    });
  }
  // spread weights are relative: scale so they average 1
  const mean = quotes.reduce((a, q) => a + (q.weight ?? 1), 0) / Math.max(1, quotes.length);
  quotes.forEach((q) => (q.weight = (q.weight ?? 1) / mean));
  return { forwards, quotes, dropped };
}

/**
 * Fit errors in units of each quote's half-spread in vol, and the share within the spread per
 * expiry: |model − mid| ≤ (ask vol − bid vol)/2.
 */
export function spreadErrors(
  quotes: readonly ChainVolQuote[],
  modelVols: readonly (number | null)[],
): {
  inHalfSpreads: (number | null)[];
  withinSpread: { expiry: number; share: number; count: number }[];
} {
  const inHalfSpreads = quotes.map((q, i) => {
    const m = modelVols[i];
    if (m === null || q.bidVol === null || q.askVol === null) return null;
    const half = 0.5 * (q.askVol - q.bidVol);
    return half > 0 ? (m - q.impliedVol) / half : null;
  });
  const byExpiry = new Map<number, { inside: number; count: number }>();
  quotes.forEach((q, i) => {
    const e = byExpiry.get(q.expiry) ?? { inside: 0, count: 0 };
    const m = modelVols[i];
    e.count++;
    if (m !== null && q.bidVol !== null && q.askVol !== null && m >= q.bidVol && m <= q.askVol)
      e.inside++;
    byExpiry.set(q.expiry, e);
  });
  return {
    inHalfSpreads,
    withinSpread: [...byExpiry]
      .sort((a, b) => a[0] - b[0])
      .map(([expiry, e]) => ({ expiry, share: e.inside / e.count, count: e.count })),
  };
}
