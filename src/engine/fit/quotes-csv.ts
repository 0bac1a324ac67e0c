/**
 * Option-chain quotes from CSV: expiry (date or year fraction), strike, and either an implied vol
 * or a call/put with a mid price or bid and ask (mid used; a tighter spread weighs more). Prices
 * become implied vols through the scenario's market. Each bad row is listed with its line and
 * reason; good rows are kept.
 */
import Papa from 'papaparse';
import { discountFactor, forwardPrice } from '../core/market';
import { impliedVol } from '../analytic/implied-vol';
import { expiryYears } from '../core/dates';
import type { RowIssue } from '../core/validate';
import type { VolQuote } from './calibrate';
import type { Market } from '../core/types';
import { arbitrageFlags, type ArbitrageFlag } from './arbitrage';
import { prepareChain, type PreparedChain } from './chain-quotes';
import { median, type ChainQuote } from './forwards';

export const MAX_QUOTES_FILE_BYTES = 2 * 1024 * 1024;
export const MAX_QUOTES = 5000;

export interface ParsedQuotes {
  quotes: VolQuote[];
  issues: RowIssue[];
  fileError?: string;
  /**
   * The spot the quotes' own forwards imply under the scenario's carry (the median over the
   * rows that give a forward), when any row does.
   */
  impliedSpot?: number;
  /**
   * A chain of calls and puts with bid and ask (and no forward column): the forwards read off it
   * by put–call parity with the carry they imply, the quotes dropped, and the out-of-the-money
   * quotes used (with their bid and ask vols) in `quotes`
   */
  chain?: Omit<PreparedChain, 'quotes'> & { carry: number[]; quotes: PreparedChain['quotes'] };
  /** static-arbitrage flags on the quotes kept (at their forwards) */
  arbitrage: ArbitrageFlag[];
}

export interface QuoteFileOptions {
  /** read the discount from this rate instead of fitting it by parity (chains only) */
  rate?: number;
}

/** Arbitrage flags of vol quotes, each at its own forward or the market's. */
function flagsOf(quotes: readonly VolQuote[], market: Market): ArbitrageFlag[] {
  return arbitrageFlags(
    quotes.map((q) => ({ ...q, forward: q.forward ?? forwardPrice(market, q.expiry) })),
  );
}

/** How far (relative) the quotes' spot may stand from the scenario's before it is pointed out. */
export const SPOT_MISMATCH = 0.02;

const ALIASES: Record<string, string> = {
  iv: 'impliedvol',
  vol: 'impliedvol',
  impliedvolatility: 'impliedvol',
  mid: 'price',
  maturity: 'expiry',
  k: 'strike',
  optiontype: 'type',
  cp: 'type',
  fwd: 'forward',
  r: 'rate',
  q: 'dividend',
  dividendyield: 'dividend',
};

/** The expiry's forward and discount factor: the row's forward or rate/dividend, else the market's. */
function carry(
  f: Record<string, string | undefined>,
  market: Market,
  T: number,
): { forward: number; discount: number; own: boolean } | string {
  const num = (key: string) => {
    const t = (f[key] ?? '').trim();
    if (t === '') return undefined;
    const n = Number(t);
    return Number.isFinite(n) ? n : NaN;
  };
  const fwd = num('forward');
  const r = num('rate');
  const q = num('dividend');
  if ([fwd, r, q].some((x) => x !== undefined && Number.isNaN(x))) {
    return 'forward, rate and dividend must be numbers when given';
  }
  if (fwd !== undefined && !(fwd > 0)) return 'the forward must be positive';
  const discount = r !== undefined ? Math.exp(-r * T) : discountFactor(market, T);
  const own = fwd !== undefined || r !== undefined || q !== undefined;
  const forward =
    fwd ??
    (own
      ? market.spot * Math.exp(((r ?? market.rate ?? 0) - (q ?? market.dividendYield ?? 0)) * T)
      : forwardPrice(market, T));
  return { forward, discount, own };
}

function header(h: string): string {
  const key = h
    .trim()
    .toLowerCase()
    .replace(/[\s_-]+/g, '');
  return ALIASES[key] ?? key;
}

export function parseQuotesCsv(
  text: string,
  market: Market,
  valuationDate: string,
  options: QuoteFileOptions = {},
): ParsedQuotes {
  const none = { quotes: [], issues: [], arbitrage: [] };
  if (text.length > MAX_QUOTES_FILE_BYTES)
    return { ...none, fileError: `the file is over ${MAX_QUOTES_FILE_BYTES / 1024 / 1024} MB` };
  if (text.trim() === '') return { ...none, fileError: 'the file is empty' };
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: false,
    delimitersToGuess: [',', ';', '\t'],
    transformHeader: header,
  });
  const cols = parsed.meta.fields ?? [];
  if (
    !cols.includes('expiry') ||
    !cols.includes('strike') ||
    !(
      cols.includes('impliedvol') ||
      (cols.includes('type') &&
        (cols.includes('price') || (cols.includes('bid') && cols.includes('ask'))))
    )
  ) {
    return {
      ...none,
      fileError: `the header must name expiry, strike and either impliedVol, or type with price (or bid and ask); found: ${cols.join(', ') || 'nothing'} (is the delimiter a comma, semicolon or tab?)`,
    };
  }
  const rows = parsed.data
    .map((f, i) => ({ line: i + 2, f }))
    .filter((r) => Object.values(r.f).some((v) => typeof v === 'string' && v.trim() !== ''));
  if (rows.length > MAX_QUOTES)
    return { ...none, fileError: `the file has ${rows.length} rows; the limit is ${MAX_QUOTES}` };
  const quotes: VolQuote[] = [];
  const issues: RowIssue[] = [];
  const seen = new Set<string>();
  const spots: number[] = [];
  // a chain (both sides with bid and ask, no forward of its own) is read by put–call parity
  const chainFile =
    cols.includes('bid') &&
    cols.includes('ask') &&
    !cols.includes('impliedvol') &&
    !cols.includes('price') &&
    !['forward', 'rate', 'dividend'].some((c) => cols.includes(c));
  const chainRows: ChainQuote[] = [];
  const chainLines: number[] = [];
  for (const { line, f } of rows) {
    const bad = (field: string, message: string) => issues.push({ line, field, message });
    const T = expiryYears(f.expiry ?? '', valuationDate);
    if (typeof T === 'string') {
      bad('expiry', (f.expiry ?? '').trim() === '' ? 'is missing' : T);
      continue;
    }
    if (T <= 0) {
      bad('expiry', 'is on or before the valuation date');
      continue;
    }
    if (T > 50) {
      bad('expiry', 'is more than 50 years away');
      continue;
    }
    const K = Number((f.strike ?? '').trim());
    if ((f.strike ?? '').trim() === '' || !Number.isFinite(K)) {
      bad('strike', 'must be a number');
      continue;
    }
    if (K <= 0) {
      bad('strike', 'must be positive');
      continue;
    }
    const c = carry(f, market, T);
    if (typeof c === 'string') {
      bad('forward', c);
      continue;
    }
    let vol: number;
    let weight = 1;
    const ivText = (f.impliedvol ?? '').trim();
    const type = (f.type ?? '').trim().toLowerCase();
    if (ivText !== '') {
      const v = Number(ivText.replace('%', ''));
      if (!Number.isFinite(v)) {
        bad('impliedVol', 'must be a number');
        continue;
      }
      vol = ivText.endsWith('%') || v > 3 ? v / 100 : v; // 23.5 and 23.5% both mean 0.235
      if (!(vol > 0 && vol < 5)) {
        bad('impliedVol', 'must be between 0 and 500 %');
        continue;
      }
    } else {
      if (type !== 'call' && type !== 'put' && type !== 'c' && type !== 'p') {
        bad('type', 'must be call or put when no implied vol is given');
        continue;
      }
      let price: number;
      const bid = Number((f.bid ?? '').trim());
      const ask = Number((f.ask ?? '').trim());
      if (chainFile) {
        // a chain row is read with the others by parity; crossed, locked and zero-bid rows are
        // listed as dropped there
        if (
          (f.bid ?? '').trim() === '' ||
          (f.ask ?? '').trim() === '' ||
          !(bid >= 0) ||
          !(ask >= 0)
        ) {
          bad('price', 'needs a bid and an ask, both numbers of at least 0');
          continue;
        }
        const key = `${T.toFixed(8)}|${K}|${type[0]}`;
        if (seen.has(key)) {
          bad('strike', 'duplicates an earlier quote at the same expiry and strike');
          continue;
        }
        seen.add(key);
        chainRows.push({
          expiry: T,
          strike: K,
          type: type.startsWith('c') ? 'call' : 'put',
          bid,
          ask,
        });
        continue;
      }
      if ((f.price ?? '').trim() !== '') price = Number(f.price!.trim());
      else if (
        Number.isFinite(bid) &&
        Number.isFinite(ask) &&
        (f.bid ?? '').trim() !== '' &&
        ask >= bid
      ) {
        price = 0.5 * (bid + ask);
        weight = ask > bid ? 1 / Math.max(ask - bid, 1e-6 * price) : 1;
      } else {
        bad('price', 'needs a price, or a bid and an ask with ask ≥ bid');
        continue;
      }
      if (!Number.isFinite(price)) {
        bad('price', 'must be a number');
        continue;
      }
      // a price is read against the row's own forward and discount when it gives them
      const r = impliedVol({
        price,
        forward: c.forward,
        strike: K,
        expiry: T,
        discount: c.discount,
        isCall: type.startsWith('c'),
      });
      if (r.vol === null) {
        bad('price', `is outside the no-arbitrage bounds for this market (${r.failure})`);
        continue;
      }
      vol = r.vol;
    }
    const key = `${T.toFixed(8)}|${K}|${ivText !== '' ? 'iv' : type[0]}`;
    if (seen.has(key)) {
      bad('strike', 'duplicates an earlier quote at the same expiry and strike');
      continue;
    }
    seen.add(key);
    if ((f.forward ?? '').trim() !== '')
      spots.push((c.forward * market.spot) / forwardPrice(market, T));
    quotes.push(
      c.own
        ? { strike: K, expiry: T, impliedVol: vol, weight, forward: c.forward }
        : { strike: K, expiry: T, impliedVol: vol, weight },
    );
  }
  if (chainFile && hasPairs(chainRows)) return chainQuotes(chainRows, issues, market, options);
  // bid/ask rows without both sides: each mid read against the market's forward, as always
  chainRows.forEach((r, i) => {
    const line = chainLines[i];
    if (!(r.ask >= r.bid) || !(r.ask > 0)) {
      issues.push({ line, field: 'price', message: 'needs a bid and an ask with ask ≥ bid' });
      return;
    }
    const price = 0.5 * (r.bid + r.ask);
    const iv = impliedVol({
      price,
      forward: forwardPrice(market, r.expiry),
      strike: r.strike,
      expiry: r.expiry,
      discount: discountFactor(market, r.expiry),
      isCall: r.type === 'call',
    }).vol;
    if (iv === null) {
      issues.push({
        line,
        field: 'price',
        message: 'is outside the no-arbitrage bounds for this market',
      });
      return;
    }
    quotes.push({
      strike: r.strike,
      expiry: r.expiry,
      impliedVol: iv,
      weight: r.ask > r.bid ? 1 / Math.max(r.ask - r.bid, 1e-6 * price) : 1,
    });
  });
  issues.sort((a, b) => a.line - b.line);
  // spread weights are relative: scale so they average 1
  const mean = quotes.reduce((a, q) => a + (q.weight ?? 1), 0) / Math.max(1, quotes.length);
  quotes.forEach((q) => (q.weight = (q.weight ?? 1) / mean));
  const arbitrage = flagsOf(quotes, market);
  if (spots.length === 0) return { quotes, issues, arbitrage };
  return { quotes, issues, impliedSpot: median(spots), arbitrage };
}

/** Whether some expiry quotes both a call and a put at three strikes or more. */
function hasPairs(rows: readonly ChainQuote[]): boolean {
  const sides = new Map<string, Set<string>>();
  for (const r of rows) {
    const key = `${r.expiry}|${r.strike}`;
    (sides.get(key) ?? sides.set(key, new Set()).get(key)!).add(r.type);
  }
  const pairsByExpiry = new Map<number, number>();
  for (const [key, types] of sides)
    if (types.size === 2) {
      const T = Number(key.split('|')[0]);
      pairsByExpiry.set(T, (pairsByExpiry.get(T) ?? 0) + 1);
    }
  return [...pairsByExpiry.values()].some((n) => n >= 3);
}

/**
 * The chain's forwards by parity, its out-of-the-money quotes at them, the carry each forward
 * implies (q = r − ln(F/S)/T with r = −ln(D)/T) and the spot they imply under the market's
 * carry (for the mismatch check).
 */
function chainQuotes(
  rows: readonly ChainQuote[],
  issues: RowIssue[],
  market: Market,
  options: QuoteFileOptions,
): ParsedQuotes {
  const prepared = prepareChain(rows, options.rate);
  const carry = prepared.forwards.map(
    (f) => -Math.log(f.discount) / f.expiry - Math.log(f.forward / market.spot) / f.expiry,
  );
  const spots = prepared.forwards.map(
    (f) => (f.forward * market.spot) / forwardPrice(market, f.expiry),
  );
  return {
    quotes: prepared.quotes,
    issues,
    chain: { ...prepared, carry },
    arbitrage: flagsOf(prepared.quotes, market),
    ...(spots.length > 0 ? { impliedSpot: median(spots) } : {}),
  };
}
