/**
 * Benchmark: 10,000 paths, daily rebalancing over one month, a two-leg position hedged with the
 * model's delta (table included) and with Black-Scholes delta on the same paths, one core.
 */
import { replay } from '../../src/engine/replay';
import type { Model } from '../../src/engine/types';
import { fmt } from './timing';

export function benchReplay(): Record<string, string>[] {
  const market = { spot: 100, rate: 0.02, dividendYield: 0.01 };
  const model: Model = {
    kind: 'bates',
    v0: 0.04,
    kappa: 1.5,
    theta: 0.04,
    volOfVol: 0.5,
    rho: -0.7,
    jumpIntensity: 0.5,
    jumpMean: -0.1,
    jumpStdev: 0.15,
  };
  const position = [
    { type: 'put' as const, strike: 95, expiry: 30 / 365, quantity: -10 },
    { type: 'call' as const, strike: 105, expiry: 30 / 365, quantity: 5 },
  ];
  const run = (method: 'bs-delta' | 'model-delta') =>
    replay({
      market,
      model,
      position,
      hedge: { method, rebalancesPerDay: 1, costBps: 2 },
      paths: 10000,
      seed: 11,
    });
  run('bs-delta'); // warm-up
  const bs = run('bs-delta');
  const md = run('model-delta');
  return [
    {
      case: 'model delta (table built in the run)',
      ms: fmt(md.elapsedMs, 4),
      'P&L s.d.': fmt(md.pnl.stdev, 4),
      ES99: fmt(md.pnl.es99, 4),
    },
    {
      case: 'Black-Scholes delta at each leg’s inception vol',
      ms: fmt(bs.elapsedMs, 4),
      'P&L s.d.': fmt(bs.pnl.stdev, 4),
      ES99: fmt(bs.pnl.es99, 4),
    },
    {
      case: 'ratio model / Black-Scholes time',
      ms: `${fmt(md.elapsedMs / bs.elapsedMs, 3)}×`,
      'P&L s.d.': '',
      ES99: '',
    },
  ];
}
