/**
 * Benchmark: an 8-expiry × 41-strike Bates surface (328 options) priced with implied vols by the
 * engine, against @quantlib/ql pricing the same options in the same run — its Heston engine for
 * the Heston part, and the same engine with the corrected Bates jump term for Bates.
 */
import {
  modelSpec,
  cosStrip,
  prepareCos,
  impliedVolFromOtm,
  priceOptions,
  smileSurface,
} from '../../src/engine/analytic';
import { discountFactor, forwardPrice, type Market, type Model } from '../../src/engine/core';
import { quantlibBatesPrices, quantlibHestonPrices } from '../support/quantlib';
import { ENGINE_WARMUP, fmt, medianMs } from './timing';

const DAYS = [1, 7, 14, 30, 61, 91, 182, 365];
const STRIKES = 41;
const market: Market = { spot: 100, rate: 0.03, dividendYield: 0.01 };
const heston = { v0: 0.04, kappa: 1.5, theta: 0.04, volOfVol: 0.5, rho: -0.7 };
const jumps = { jumpIntensity: 0.5, jumpMean: -0.1, jumpStdev: 0.15 };

/** Strikes within ±3.5 standard deviations of each expiry's forward (log-moneyness). */
function grid(): { T: number; ks: Float64Array }[] {
  return DAYS.map((d) => {
    const T = d / 365;
    const sd = 0.2 * Math.sqrt(T);
    return {
      T,
      ks: Float64Array.from({ length: STRIKES }, (_, i) => sd * (-3.5 + (7 * i) / (STRIKES - 1))),
    };
  });
}

function ourSurface(model: Model, g: ReturnType<typeof grid>): Float64Array {
  const spec = modelSpec(model);
  const vols = new Float64Array(DAYS.length * STRIKES);
  const call = new Float64Array(STRIKES);
  const put = new Float64Array(STRIKES);
  const cdf = new Float64Array(STRIKES);
  const dens = new Float64Array(STRIKES);
  g.forEach(({ T, ks }, e) => {
    cosStrip(prepareCos(spec, T), ks, call, put, cdf, dens);
    for (let j = 0; j < STRIKES; j++)
      vols[e * STRIKES + j] = impliedVolFromOtm(ks[j] < 0 ? put[j] : call[j], ks[j], T) ?? NaN;
  });
  return vols;
}

function peerLegs(g: ReturnType<typeof grid>) {
  return g.flatMap(({ T, ks }, e) =>
    Array.from(ks, (k) => ({
      type: k < 0 ? ('put' as const) : ('call' as const),
      strike: forwardPrice(market, T) * Math.exp(k),
      days: DAYS[e],
      k,
      T,
    })),
  );
}

function volsFromPeer(prices: number[], legs: ReturnType<typeof peerLegs>): Float64Array {
  return Float64Array.from(
    legs,
    (l, i) =>
      impliedVolFromOtm(
        prices[i] / (discountFactor(market, l.T) * forwardPrice(market, l.T)),
        l.k,
        l.T,
      ) ?? NaN,
  );
}

function maxDiff(a: Float64Array, b: Float64Array): number {
  let m = 0;
  for (let i = 0; i < a.length; i++)
    if (Number.isFinite(a[i]) && Number.isFinite(b[i])) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
}

export function benchSurface(): Record<string, string>[] {
  const g = grid();
  const legs = peerLegs(g);
  const rows: Record<string, string>[] = [];
  const cases: [string, Model, () => number[]][] = [
    [
      'Heston',
      { kind: 'heston', ...heston },
      () => quantlibHestonPrices(market.spot, market.rate!, market.dividendYield!, heston, legs),
    ],
    [
      'Bates',
      { kind: 'bates', ...heston, ...jumps },
      () =>
        quantlibBatesPrices(
          market.spot,
          market.rate!,
          market.dividendYield!,
          { ...heston, ...jumps },
          legs,
        ),
    ],
  ];
  for (const [name, model, peer] of cases) {
    const ours = medianMs(() => ourSurface(model, g), 200, ENGINE_WARMUP);
    let peerPrices: number[] = [];
    const theirs = medianMs(() => (peerPrices = peer()), 5, 1);
    const diff = maxDiff(ourSurface(model, g), volsFromPeer(peerPrices, legs));
    rows.push({
      case: `${name} surface ${DAYS.length}×${STRIKES}`,
      'Saltation ms (median)': fmt(ours),
      'QuantLib ms (median)': fmt(theirs),
      'speed-up': `${fmt(theirs / ours)}×`,
      'max |Δσ|': diff.toExponential(2),
    });
  }
  const full = medianMs(
    () =>
      smileSurface(
        market,
        { kind: 'bates', ...heston, ...jumps },
        g.map((x) => x.T),
        Array.from(g[4].ks),
      ),
    50,
    5,
  );
  // the CLI's `price`: prices, implied vols and the five Greeks (theta from the strip itself)
  const options = peerLegs(g).map((l) => ({ type: l.type, strike: l.strike, expiry: l.T }));
  const batesModel: Model = { kind: 'bates', ...heston, ...jumps };
  const withGreeks = medianMs(() => priceOptions(market, batesModel, options), 200, ENGINE_WARMUP);
  let peerPrices: number[] = [];
  const peerBates = medianMs(
    () =>
      (peerPrices = quantlibBatesPrices(
        market.spot,
        market.rate!,
        market.dividendYield!,
        { ...heston, ...jumps },
        legs,
      )),
    5,
    1,
  );
  const ours = priceOptions(market, batesModel, options);
  const priceDiff = Math.max(...ours.map((o, i) => Math.abs(o.price - peerPrices[i])));
  rows.push({
    case: `Bates ${options.length} options with Greeks (target ≤ 1 ms)`,
    'Saltation ms (median)': fmt(withGreeks),
    'QuantLib ms (median)': fmt(peerBates),
    'speed-up': `${fmt(peerBates / withGreeks)}×`,
    'max |Δσ|': `|Δprice| ${priceDiff.toExponential(2)}`,
  });
  rows.push({
    case: 'Bates smile surface with ATM/RR25/BF25',
    'Saltation ms (median)': fmt(full),
    'QuantLib ms (median)': '—',
    'speed-up': '—',
    'max |Δσ|': '—',
  });
  return rows;
}
