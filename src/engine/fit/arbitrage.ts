/**
 * Static-arbitrage checks on a set of implied-vol quotes before a fit (common practice; the
 * conditions of e.g. Carr & Madan 2005, "A note on sufficient conditions for no arbitrage",
 * Finance Research Letters 2): at one expiry, undiscounted call prices per unit forward must not
 * rise with strike (vertical spreads) and must be convex in strike (butterflies); across
 * expiries, total implied variance σ²T at a fixed ln(K/F) must not fall (calendar spreads).
 * Each flag names the quotes involved and the size of the violation.
 */
import { normalisedBlack } from '../analytic/black';

export interface ArbitrageQuote {
  expiry: number;
  strike: number;
  impliedVol: number;
  /** the quote's forward (the market's forward at its expiry when the chain gives none) */
  forward: number;
}

export interface ArbitrageFlag {
  kind: 'vertical' | 'butterfly' | 'calendar';
  quotes: { expiry: number; strike: number }[];
  /** vertical and butterfly: in price per unit forward; calendar: in total variance σ²T */
  size: number;
}

/** Undiscounted call price per unit forward at the quote's own vol. */
function callPerForward(q: ArbitrageQuote): number {
  const x = Math.log(q.forward / q.strike);
  return (
    Math.sqrt(q.strike / q.forward) * normalisedBlack(x, q.impliedVol * Math.sqrt(q.expiry), 1)
  );
}

/** Tolerance below which a violation is rounding, not arbitrage. */
const TOLERANCE = 1e-10;

export function arbitrageFlags(quotes: readonly ArbitrageQuote[]): ArbitrageFlag[] {
  const flags: ArbitrageFlag[] = [];
  const byExpiry = new Map<number, ArbitrageQuote[]>();
  for (const q of quotes)
    (byExpiry.get(q.expiry) ?? byExpiry.set(q.expiry, []).get(q.expiry)!).push(q);
  const expiries = [...byExpiry.keys()].sort((a, b) => a - b);
  for (const T of expiries) {
    const qs = [...byExpiry.get(T)!].sort((a, b) => a.strike - b.strike);
    // strikes in units of each quote's forward (forwards of one expiry agree to rounding)
    const k = qs.map((q) => q.strike / q.forward);
    const c = qs.map(callPerForward);
    for (let i = 0; i + 1 < qs.length; i++) {
      if (c[i + 1] - c[i] > TOLERANCE)
        flags.push({
          kind: 'vertical',
          quotes: [qs[i], qs[i + 1]].map(pick),
          size: c[i + 1] - c[i],
        });
    }
    for (let i = 1; i + 1 < qs.length; i++) {
      const left = (c[i] - c[i - 1]) / (k[i] - k[i - 1]);
      const right = (c[i + 1] - c[i]) / (k[i + 1] - k[i]);
      if (left - right > TOLERANCE)
        flags.push({
          kind: 'butterfly',
          quotes: [qs[i - 1], qs[i], qs[i + 1]].map(pick),
          size: (left - right) * Math.min(k[i] - k[i - 1], k[i + 1] - k[i]),
        });
    }
  }
  // calendars: each quote against the next expiry's total variance at its ln(K/F), by linear
  // interpolation between that expiry's quotes (no extrapolation beyond them)
  for (let e = 0; e + 1 < expiries.length; e++) {
    const later = [...byExpiry.get(expiries[e + 1])!]
      .map((q) => ({ q, x: Math.log(q.strike / q.forward), w: q.impliedVol ** 2 * q.expiry }))
      .sort((a, b) => a.x - b.x);
    for (const q of byExpiry.get(expiries[e])!) {
      const x = Math.log(q.strike / q.forward);
      const j = later.findIndex((p) => p.x >= x);
      if (j < 0 || (j === 0 && later[0].x > x)) continue;
      const hi = later[j];
      const lo = j === 0 ? hi : later[j - 1];
      const t = hi.x === lo.x ? 0 : (x - lo.x) / (hi.x - lo.x);
      const wLater = lo.w + t * (hi.w - lo.w);
      const w = q.impliedVol ** 2 * q.expiry;
      if (w - wLater > TOLERANCE)
        flags.push({
          kind: 'calendar',
          quotes: [pick(q), pick(lo.q), ...(hi === lo ? [] : [pick(hi.q)])],
          size: w - wLater,
        });
    }
  }
  return flags;
}

const pick = (q: ArbitrageQuote) => ({ expiry: q.expiry, strike: q.strike });
