/**
 * Forwards and discount factors read off an option chain by put–call parity: at each strike
 * with both sides quoted, C − P = D·F − D·K, so the mids' differences against the strike are a
 * line a + b·K with D = −b and F = a/D. The line is fitted per expiry by weighted least squares
 * (weights 1/(h_C² + h_P²), h the half-spreads) made robust by iterated Tukey bisquare weights on
 * residuals scaled by their half-spreads (Beaton & Tukey 1974, "The fitting of power series…",
 * Technometrics 16; scale from the median absolute residual). Standard errors come from the
 * weighted fit's covariance (scaled by the residual variance), F's by the delta method. Given a
 * rate, D = e^{−rT} is fixed and only F is fitted. Quotes with a zero bid, or crossed or locked
 * (bid ≥ ask), are dropped and listed.
 */

export interface ChainQuote {
  expiry: number;
  strike: number;
  type: 'call' | 'put';
  bid: number;
  ask: number;
}

export interface DroppedQuote {
  strike: number;
  type: 'call' | 'put';
  reason: 'zero bid' | 'crossed' | 'locked' | 'outlier' | 'one side only';
}

export interface ExpiryForward {
  expiry: number;
  forward: number;
  discount: number;
  forwardStdError: number;
  /** 0 when the discount was fixed by a given rate */
  discountStdError: number;
  /** strikes with both sides that carried weight in the fit */
  used: number;
  dropped: DroppedQuote[];
}

const TUKEY_C = 4.685;

interface Pair {
  strike: number;
  /** C − P at the mids */
  y: number;
  /** its standard deviation proxy: √(h_C² + h_P²) */
  sd: number;
}

/** Quotes usable for a mid, and the ones dropped with their reason. */
export function cleanQuotes<Q extends ChainQuote>(
  quotes: readonly Q[],
): { kept: Q[]; dropped: (DroppedQuote & { expiry: number })[] } {
  const kept: Q[] = [];
  const dropped: (DroppedQuote & { expiry: number })[] = [];
  for (const q of quotes) {
    const reason = !(q.bid > 0)
      ? 'zero bid'
      : q.bid > q.ask
        ? 'crossed'
        : q.bid === q.ask
          ? 'locked'
          : null;
    if (reason) dropped.push({ expiry: q.expiry, strike: q.strike, type: q.type, reason });
    else kept.push(q);
  }
  return { kept, dropped };
}

function pairsOf(quotes: readonly ChainQuote[]): { pairs: Pair[]; single: DroppedQuote[] } {
  const byStrike = new Map<number, { call?: ChainQuote; put?: ChainQuote }>();
  for (const q of quotes) {
    const e = byStrike.get(q.strike) ?? {};
    e[q.type] = q;
    byStrike.set(q.strike, e);
  }
  const pairs: Pair[] = [];
  const single: DroppedQuote[] = [];
  for (const [strike, { call, put }] of [...byStrike].sort((a, b) => a[0] - b[0])) {
    if (!call || !put) {
      const q = (call ?? put)!;
      single.push({ strike, type: q.type, reason: 'one side only' });
      continue;
    }
    const hc = 0.5 * (call.ask - call.bid);
    const hp = 0.5 * (put.ask - put.bid);
    pairs.push({
      strike,
      y: 0.5 * (call.bid + call.ask) - 0.5 * (put.bid + put.ask),
      sd: Math.sqrt(hc * hc + hp * hp),
    });
  }
  return { pairs, single };
}

/** Weighted least squares of y on (1, K) (or of y + D·K on 1 with D fixed). */
function weightedFit(pairs: readonly Pair[], w: readonly number[], fixedDiscount: number | null) {
  let sw = 0;
  let sx = 0;
  let sy = 0;
  let sxx = 0;
  let sxy = 0;
  pairs.forEach((p, i) => {
    const y = fixedDiscount === null ? p.y : p.y + fixedDiscount * p.strike;
    sw += w[i];
    sx += w[i] * p.strike;
    sy += w[i] * y;
    sxx += w[i] * p.strike * p.strike;
    sxy += w[i] * p.strike * y;
  });
  if (fixedDiscount !== null) {
    const a = sy / sw;
    return { a, b: -fixedDiscount, varA: 1 / sw, varB: 0, covAB: 0 };
  }
  const det = sw * sxx - sx * sx;
  const b = (sw * sxy - sx * sy) / det;
  const a = (sy - b * sx) / sw;
  return { a, b, varA: sxx / det, varB: sw / det, covAB: -sx / det };
}

/** The median of a list of numbers. */
export const median = (xs: readonly number[]): number => {
  const s = [...xs].sort((x, y) => x - y);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : 0.5 * (s[m - 1] + s[m]);
};

/** The forward and discount of one expiry from its cleaned quotes. */
export function expiryForward(
  expiry: number,
  quotes: readonly ChainQuote[],
  rate?: number,
): ExpiryForward | null {
  const { kept, dropped } = cleanQuotes(quotes);
  const { pairs, single } = pairsOf(kept);
  const fixed = rate === undefined ? null : Math.exp(-rate * expiry);
  const need = fixed === null ? 3 : 1;
  if (pairs.length < need) return null;
  let robust = pairs.map(() => 1);
  let fit = weightedFit(
    pairs,
    pairs.map((p) => 1 / (p.sd * p.sd)),
    fixed,
  );
  let scale = 1;
  for (let it = 0; it < 20; it++) {
    const z = pairs.map(
      (p) =>
        (p.y + (fixed ?? 0) * p.strike - fit.a - (fixed === null ? fit.b * p.strike : 0)) / p.sd,
    );
    scale = Math.max(1.4826 * median(z.map(Math.abs)), 1e-12);
    const next = z.map((r) => {
      const u = r / (TUKEY_C * scale);
      return Math.abs(u) < 1 ? (1 - u * u) ** 2 : 0;
    });
    if (next.filter((v) => v > 0).length < need) break;
    const changed = next.some((v, i) => Math.abs(v - robust[i]) > 1e-9);
    robust = next;
    fit = weightedFit(
      pairs,
      pairs.map((p, i) => robust[i] / (p.sd * p.sd)),
      fixed,
    );
    if (!changed) break;
  }
  // residual variance per unit weight over the pairs that carry weight
  const usedIdx = pairs.map((_, i) => i).filter((i) => robust[i] > 0);
  const k = fixed === null ? 2 : 1;
  const chi = usedIdx.reduce((acc, i) => {
    const p = pairs[i];
    const r = p.y + (fixed ?? 0) * p.strike - fit.a - (fixed === null ? fit.b * p.strike : 0);
    return acc + (robust[i] * r * r) / (p.sd * p.sd);
  }, 0);
  const s2 = usedIdx.length > k ? chi / (usedIdx.length - k) : 1;
  const D = -fit.b;
  const F = fit.a / D;
  // delta method: F = −a/b
  const dFa = -1 / fit.b;
  const dFb = fit.a / (fit.b * fit.b);
  const varF = s2 * (dFa * dFa * fit.varA + dFb * dFb * fit.varB + 2 * dFa * dFb * fit.covAB);
  return {
    expiry,
    forward: F,
    discount: D,
    forwardStdError: Math.sqrt(Math.max(0, varF)),
    discountStdError: fixed === null ? Math.sqrt(Math.max(0, s2 * fit.varB)) : 0,
    used: usedIdx.length,
    dropped: [
      ...dropped.map(({ strike, type, reason }) => ({ strike, type, reason })),
      ...single,
      ...pairs
        .filter((_, i) => robust[i] === 0)
        .flatMap((p) => [
          { strike: p.strike, type: 'call' as const, reason: 'outlier' as const },
          { strike: p.strike, type: 'put' as const, reason: 'outlier' as const },
        ]),
    ],
  };
}

/** Every expiry's forward and discount, in expiry order (expiries that cannot be fitted are left out). */
export function chainForwards(quotes: readonly ChainQuote[], rate?: number): ExpiryForward[] {
  const byExpiry = new Map<number, ChainQuote[]>();
  for (const q of quotes)
    (byExpiry.get(q.expiry) ?? byExpiry.set(q.expiry, []).get(q.expiry)!).push(q);
  return [...byExpiry.keys()]
    .sort((a, b) => a - b)
    .map((T) => expiryForward(T, byExpiry.get(T)!, rate))
    .filter((f): f is ExpiryForward => f !== null);
}
