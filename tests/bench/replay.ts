/**
 * Benchmark: 10,000 paths, daily rebalancing over one month, a two-leg position hedged with the
 * model's delta (table included) and with Black-Scholes delta on the same paths, one core; and
 * 10,000 paths × 21 daily steps hedged by model delta and by model delta-gamma with a 2-month
 * call, for a short 95 put (target: at most 2.5× the model-delta time).
 */
import {
  blockCountFor,
  combineReplay,
  replay,
  type BlockPnl,
  type ReplayRequest,
} from '../../src/engine/replay';
import { blocksInThreads } from './threads';
import { type Model, DEFAULT_BATES } from '../../src/engine/core';
import { fmt } from './timing';

export async function benchReplay(): Promise<Record<string, string>[]> {
  const market = { spot: 100, rate: 0.02, dividendYield: 0.01 };
  const model: Model = DEFAULT_BATES;
  const position = [
    { type: 'put' as const, strike: 95, expiry: 30 / 365, quantity: -10 },
    { type: 'call' as const, strike: 105, expiry: 30 / 365, quantity: 5 },
  ];
  const request = (method: 'bs-delta' | 'model-delta'): ReplayRequest => ({
    market,
    model,
    position,
    hedge: { method, rebalancesPerDay: 1, costBps: 2 },
    paths: 10000,
    seed: 11,
  });
  const run = (method: 'bs-delta' | 'model-delta') => replay(request(method));
  run('bs-delta'); // warm-up
  const bs = run('bs-delta');
  const md = run('model-delta');
  const inThreads = async (workers: number) => {
    const { ms, blocks } = await blocksInThreads<BlockPnl>(
      new URL('./replay-thread.mjs', import.meta.url),
      workers,
      blockCountFor(10000),
      { request: request('model-delta') },
    );
    const plan = {
      request: request('model-delta'),
      steps: md.steps,
      premium: md.premium,
      overlayPremium: 0,
    };
    return { ms, digest: combineReplay(plan, blocks, 0).digest };
  };
  const threeWeeks = (method: 'model-delta' | 'model-delta-gamma') =>
    replay({
      market,
      model,
      position: [{ type: 'put', strike: 95, expiry: 21 / 365, quantity: -10 }],
      hedge: {
        method,
        rebalancesPerDay: 1,
        costBps: 2,
        instrument: { type: 'call', strike: 100, expiry: 61 / 365 },
      },
      paths: 10000,
      seed: 11,
    });
  const deltaOnly = threeWeeks('model-delta');
  const deltaGamma = threeWeeks('model-delta-gamma');
  const one = await inThreads(1);
  const two = await inThreads(2);
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
    {
      case: '21 steps: model delta (table built in the run)',
      ms: fmt(deltaOnly.elapsedMs, 4),
      'P&L s.d.': fmt(deltaOnly.pnl.stdev, 4),
      ES99: fmt(deltaOnly.pnl.es99, 4),
    },
    {
      case: '21 steps: model delta-gamma with a 61-day call (both tables built in the run)',
      ms: fmt(deltaGamma.elapsedMs, 4),
      'P&L s.d.': fmt(deltaGamma.pnl.stdev, 4),
      ES99: fmt(deltaGamma.pnl.es99, 4),
    },
    {
      case: 'ratio delta-gamma / model delta time (target ≤ 2.5×)',
      ms: `${fmt(deltaGamma.elapsedMs / deltaOnly.elapsedMs, 3)}× ${deltaGamma.elapsedMs <= 2.5 * deltaOnly.elapsedMs ? '(met)' : '(MISSED)'}`,
      'P&L s.d.': '',
      ES99: '',
    },
    {
      case: 'model delta, 1 / 2 worker threads (wall clock, incl. start-up and table)',
      ms: `${fmt(one.ms, 4)} / ${fmt(two.ms, 4)}`,
      'P&L s.d.':
        two.digest === md.digest && one.digest === md.digest ? 'bit-identical' : 'NOT identical',
      ES99: '',
    },
  ];
}
