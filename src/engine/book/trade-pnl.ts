/**
 * Two views of a book a desk reads every morning: the P&L since trade of the legs that carry a
 * trade price (quantity × (value now − trade price)), and vega bucketed by expiry (a short-dated
 * book's vega sits in other places than its total says).
 */
import type { LegRisk } from './book';
import type { Position } from './positions';

export interface SinceTrade {
  /** per leg: quantity × (price now − tradePrice), null without a trade price */
  legs: (number | null)[];
  /** the sum over the legs that have one */
  total: number;
  /** how many legs have a trade price */
  priced: number;
}

export function pnlSinceTrade(
  positions: readonly Position[],
  legs: readonly LegRisk[],
): SinceTrade {
  let total = 0;
  let priced = 0;
  const out = positions.map((p, i) => {
    if (p.tradePrice === undefined) return null;
    // legs[i].value is quantity × price now (spot for the underlying)
    const pnl = legs[i].value - p.quantity * p.tradePrice;
    total += pnl;
    priced++;
    return pnl;
  });
  return { legs: out, total, priced };
}

/** Expiry buckets, in years (upper bounds); the last takes everything longer. */
export const VEGA_BUCKETS: readonly { label: string; upTo: number }[] = [
  { label: 'to 1W', upTo: 7 / 365 },
  { label: '1W–1M', upTo: 1 / 12 },
  { label: '1M–3M', upTo: 0.25 },
  { label: '3M–1Y', upTo: 1 },
  { label: 'over 1Y', upTo: Infinity },
];

/** The book's vega (per vol point) summed by expiry bucket; the underlying has none. */
export function vegaByExpiry(
  positions: readonly Position[],
  legs: readonly LegRisk[],
): { label: string; vega: number }[] {
  const sums = VEGA_BUCKETS.map((b) => ({ label: b.label, vega: 0 }));
  positions.forEach((p, i) => {
    if (p.type === 'underlying') return;
    const k = VEGA_BUCKETS.findIndex((b) => p.expiry! <= b.upTo);
    sums[k].vega += legs[i].vega;
  });
  return sums;
}
