import { describe, expect, it } from 'vitest';
import { priceOptions } from '../../src/engine/analytic';
import { type Model, modelSpec } from '../../src/engine/core';
import {
  blockCount,
  combineBlocks,
  simulate,
  simulateBlock,
  type SimulationSettings,
} from '../../src/engine/paths';
import { stepGrid } from '../../src/engine/paths/step-grid';
import { planReplay, replay, tracePath, type ReplayRequest } from '../../src/engine/replay';

const market = { spot: 100, rate: 0.02, dividendYield: 0.01 };
const dated: Model = {
  kind: 'bates',
  v0: 0.04,
  kappa: 1.5,
  theta: 0.04,
  volOfVol: 0.5,
  rho: -0.7,
  jumpIntensity: 0.5,
  jumpMean: -0.1,
  jumpStdev: 0.15,
  // an earnings-style two-point move on day 10.5 and a normal one on day 40
  events: [
    { time: 10.5 / 365, law: 'two-point', up: 0.06, down: -0.08, upProbability: 0.55 },
    { time: 40 / 365, law: 'normal', stdev: 0.03 },
  ],
  jumpIntensitySchedule: [
    [14 / 365, 3],
    [30 / 365, 1],
  ],
};

const settings = (over: Partial<SimulationSettings>): SimulationSettings => ({
  horizon: 0.25,
  stepsPerYear: 365,
  paths: 65536,
  seed: 20261202,
  antithetic: true,
  scheme: 'qe',
  options: [],
  ...over,
});

describe('the step grid', () => {
  it('makes each scheduled move a step boundary and keeps the even steps elsewhere', () => {
    const grid = stepGrid(modelSpec(dated), 91 / 365, 91, 0.01, 0); // daily steps
    const moveAt = grid.movesAt.findIndex((m) => m.length > 0);
    expect(grid.times[moveAt]).toBe(10.5 / 365);
    expect(grid.steps).toBe(92); // day 40 is already a boundary; day 10.5 splits a step
    // the expected jump count integrates the schedule: 3 per year over the first 14 days
    expect(grid.expectedJumps[0]).toBeCloseTo(3 / 365, 14);
    expect(grid.expectedJumps[20]).toBeCloseTo(1 / 365, 14);
  });
});

describe('Monte Carlo with scheduled moves and an intensity schedule', () => {
  it('agrees with COS within 3 standard errors, for options either side of each move', () => {
    const options = [
      { type: 'put' as const, strike: 95, expiry: 7 / 365 },
      { type: 'put' as const, strike: 95, expiry: 21 / 365 },
      { type: 'call' as const, strike: 104, expiry: 21 / 365 },
      { type: 'put' as const, strike: 90, expiry: 0.25 },
    ];
    const mc = simulate(market, dated, settings({ options }));
    const exact = priceOptions(market, dated, options);
    mc.estimates.forEach((e, i) =>
      expect(Math.abs(e.price - exact[i].price), `option ${i}`).toBeLessThan(3 * e.stdError),
    );
  });

  it('gives bit-identical numbers however the blocks are shared out (1, 2 or 3 workers)', () => {
    const s = settings({
      paths: 8000,
      options: [{ type: 'put', strike: 92, expiry: 30 / 365 }],
      recordTimes: 20,
    });
    const whole = simulate(market, dated, s);
    for (const workers of [1, 2, 3]) {
      const blocks = new Array(blockCount(s));
      for (let w = workers - 1; w >= 0; w--)
        for (let b = w; b < blockCount(s); b += workers)
          blocks[b] = simulateBlock(market, dated, s, b);
      const combined = combineBlocks(market, s, blocks, 0);
      expect(combined.estimates).toEqual(whole.estimates);
      expect(combined.terminal).toEqual(whole.terminal);
    }
  });

  it('records the boundary of each move and the step after it, so the fan shows the move', () => {
    const b = simulateBlock(market, dated, settings({ paths: 512, recordTimes: 12 }), 0);
    const times = Array.from(b.record!.times);
    expect(times).toContain(10.5 / 365);
  });
});

describe('replay around a scheduled move', () => {
  const request: ReplayRequest = {
    market,
    model: {
      kind: 'black-scholes',
      sigma: 0.2,
      events: [{ time: 5.5 / 365, law: 'normal', stdev: 0.06 }],
    },
    // a short straddle expiring after the move, delta-hedged daily
    position: [
      { type: 'call', strike: 100, expiry: 14 / 365, quantity: -1 },
      { type: 'put', strike: 100, expiry: 14 / 365, quantity: -1 },
    ],
    hedge: { method: 'model-delta', rebalancesPerDay: 1, costBps: 0 },
    paths: 4096,
    seed: 7,
  };

  it('books the largest loss of the worst path on the move step (common practice: a hedged short straddle loses on the gap)', () => {
    const r = replay(request);
    const trace = tracePath(planReplay(request), r.worstPath);
    const steps = trace.pnl
      .slice(1)
      .map((p, i) => ({ time: trace.times[i], change: p - trace.pnl[i] }));
    const worst = steps.reduce((a, b) => (b.change < a.change ? b : a));
    expect(worst.time).toBe(5.5 / 365);
    expect(trace.events).toHaveLength(1);
  });

  it('puts the tail loss on the move step in the attribution', () => {
    const r = replay(request);
    expect(r.attribution.tailEvents).toBeLessThan(0);
    expect(Math.abs(r.attribution.tailEvents)).toBeGreaterThan(0.5 * r.pnl.es99);
    expect(r.attribution.jumps).toBe(0);
  });
});
