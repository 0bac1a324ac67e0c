import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { forwardPrice, type Model } from '../../src/engine/core';
import { priceOptions } from '../../src/engine/analytic';
import {
  simulationSettingsSchema,
  blockCount,
  combineBlocks,
  simulate,
  simulateBlock,
  type SimulationSettings,
} from '../../src/engine/paths';

const root = fileURLToPath(new URL('../..', import.meta.url));
const base = (over: Partial<SimulationSettings>): SimulationSettings => ({
  horizon: 1,
  stepsPerYear: 52,
  paths: 16384,
  seed: 20261201,
  antithetic: true,
  scheme: 'qe',
  options: [],
  ...over,
});

describe('Monte Carlo against analytic prices', () => {
  it('reproduces Andersen (2008) Case I at Δt = 1/8 within 4 s.e. + 0.04 (calls K = 60/100/140, T = 10)', () => {
    const m: Model = { kind: 'heston', kappa: 0.5, theta: 0.04, volOfVol: 1, rho: -0.9, v0: 0.04 };
    const ref = [44.32997507, 13.08467014, 0.29577444]; // Andersen 2008, Case I
    const r = simulate(
      { spot: 100 },
      m,
      base({
        horizon: 10,
        stepsPerYear: 8,
        paths: 65536,
        options: [60, 100, 140].map((K) => ({ type: 'call', strike: K, expiry: 10 })),
      }),
    );
    r.estimates.forEach((e, i) =>
      expect(Math.abs(e.price - ref[i]), `K index ${i}`).toBeLessThan(4 * e.stdError + 0.04),
    );
  });

  it('reproduces Andersen (2008) Case II at Δt = 1/8 (calls K = 60/100/140, T = 15)', () => {
    const m: Model = {
      kind: 'heston',
      kappa: 0.3,
      theta: 0.04,
      volOfVol: 0.9,
      rho: -0.5,
      v0: 0.04,
    };
    const ref = [45.28686, 16.64922, 5.13819]; // Andersen 2008, Case II (high-precision values)
    const r = simulate(
      { spot: 100 },
      m,
      base({
        horizon: 15,
        stepsPerYear: 8,
        paths: 32768,
        options: [60, 100, 140].map((K) => ({ type: 'call', strike: K, expiry: 15 })),
      }),
    );
    r.estimates.forEach((e, i) =>
      expect(Math.abs(e.price - ref[i])).toBeLessThan(4 * e.stdError + 0.04),
    );
  });

  it('QE’s bias at yearly steps is far smaller than full-truncation Euler’s (Andersen 2008, section 6)', () => {
    const m: Model = { kind: 'heston', kappa: 0.5, theta: 0.04, volOfVol: 1, rho: -0.9, v0: 0.04 };
    const options = [{ type: 'call' as const, strike: 100, expiry: 10 }];
    const qe = simulate(
      { spot: 100 },
      m,
      base({ horizon: 10, stepsPerYear: 1, paths: 65536, options }),
    );
    const euler = simulate(
      { spot: 100 },
      m,
      base({ horizon: 10, stepsPerYear: 1, paths: 65536, options, scheme: 'euler' }),
    );
    const exact = 13.08467014;
    expect(Math.abs(qe.estimates[0].price - exact)).toBeLessThan(0.5); // Andersen reports about +0.24 at Δt = 1
    expect(Math.abs(euler.estimates[0].price - exact)).toBeGreaterThan(
      4 * Math.abs(qe.estimates[0].price - exact),
    );
  });

  it('Bates calls and puts agree with the COS prices within 3 standard errors', () => {
    const m: Model = {
      kind: 'bates',
      kappa: 1.5768,
      theta: 0.0398,
      volOfVol: 0.5751,
      rho: -0.5711,
      v0: 0.0175,
      jumpIntensity: 0.5,
      jumpMean: -0.1,
      jumpStdev: 0.15,
    };
    const market = { spot: 100, rate: 0.02, dividendYield: 0.01 };
    const options = [
      { type: 'put' as const, strike: 85, expiry: 0.25 },
      { type: 'call' as const, strike: 100, expiry: 0.5 },
      { type: 'put' as const, strike: 95, expiry: 1 },
    ];
    const r = simulate(market, m, base({ stepsPerYear: 52, paths: 65536, options }));
    const cos = priceOptions(market, m, options);
    r.estimates.forEach((e, i) =>
      expect(Math.abs(e.price - cos[i].price), JSON.stringify(options[i])).toBeLessThan(
        3 * e.stdError + 0.01,
      ),
    );
  });

  it('keeps the discounted spot a martingale with jumps on: mean S_T equals the forward within 3 s.e.', () => {
    const m: Model = {
      kind: 'heston-kou',
      v0: 0.04,
      kappa: 1.5,
      theta: 0.04,
      volOfVol: 0.6,
      rho: -0.6,
      jumpIntensity: 2,
      upProbability: 0.3,
      upMean: 0.05,
      downMean: 0.1,
    };
    const market = { spot: 100, rate: 0.04, dividendYield: 0.01 };
    const r = simulate(market, m, base({ paths: 65536 }));
    expect(Math.abs(r.terminal.mean - forwardPrice(market, 1))).toBeLessThan(
      3 * r.terminal.meanStdError,
    );
  });
});

describe('reproducibility', () => {
  const m: Model = {
    kind: 'bates',
    kappa: 2,
    theta: 0.04,
    volOfVol: 0.5,
    rho: -0.7,
    v0: 0.04,
    jumpIntensity: 0.5,
    jumpMean: -0.1,
    jumpStdev: 0.15,
  };
  const s = base({ paths: 10000, options: [{ type: 'put', strike: 90, expiry: 1 }] });

  it('gives bit-identical numbers however the blocks are shared out (1, 2 or 4 workers)', () => {
    const whole = simulate({ spot: 100 }, m, s);
    for (const workers of [1, 2, 4]) {
      const blocks = new Array(blockCount(s));
      // worker w runs blocks w, w + workers, …, in reverse order; the sums are added in block order
      for (let w = workers - 1; w >= 0; w--)
        for (let b = blockCount(s) - 1 - ((blockCount(s) - 1 - w) % workers); b >= 0; b -= workers)
          blocks[b] = simulateBlock({ spot: 100 }, m, s, b);
      const combined = combineBlocks({ spot: 100 }, s, blocks, 0);
      expect(combined.estimates).toEqual(whole.estimates);
      expect(combined.terminal).toEqual(whole.terminal);
    }
  });

  it('gives the same numbers in two separate processes, and different numbers for another seed', () => {
    const request = JSON.stringify({
      market: { spot: 100 },
      model: m,
      horizon: 1,
      stepsPerYear: 12,
      paths: 4000,
      seed: 99,
      options: [{ type: 'put', strike: 90, expiry: 1 }],
    });
    const run = (input: string) => {
      const out = JSON.parse(
        spawnSync(process.execPath, ['--import', 'tsx', 'cli/main.ts', 'simulate'], {
          cwd: root,
          input,
          encoding: 'utf8',
        }).stdout,
      );
      delete out.elapsedMs;
      return out;
    };
    const a = run(request);
    expect(run(request)).toEqual(a);
    expect(run(request.replace('"seed":99', '"seed":100')).estimates[0].price).not.toBe(
      a.estimates[0].price,
    );
  });
});

describe('simulation settings', () => {
  const ok = { horizon: 1, stepsPerYear: 52, paths: 1000, seed: 1 };
  const cases: [string, object, string][] = [
    ['zero paths', { ...ok, paths: 0 }, 'paths'],
    ['fractional paths', { ...ok, paths: 10.5 }, 'paths'],
    ['no steps', { ...ok, stepsPerYear: 0 }, 'stepsPerYear'],
    ['a horizon beyond the model’s range', { ...ok, horizon: 100 }, 'horizon'],
    ['a seed that is not an integer', { ...ok, seed: 1.5 }, 'seed'],
    ['a run too large to hold', { ...ok, paths: 10_000_000, stepsPerYear: 100000 }, 'paths'],
    [
      'an option beyond the horizon',
      { ...ok, options: [{ type: 'call', strike: 100, expiry: 2 }] },
      'options.0.expiry',
    ],
  ];
  for (const [what, settings, path] of cases) {
    it(`refuses ${what} with a message at ${path}`, () => {
      const r = simulationSettingsSchema.safeParse(settings);
      expect(r.success).toBe(false);
      if (!r.success) expect(r.error.issues[0].path.join('.')).toBe(path);
    });
  }
});

describe('the control variate', () => {
  it('narrows the standard error with the discounted spot as control, and stays within 3 s.e. of COS', () => {
    const m: Model = {
      kind: 'bates',
      kappa: 1.5768,
      theta: 0.0398,
      volOfVol: 0.5751,
      rho: -0.5711,
      v0: 0.0175,
      jumpIntensity: 0.5,
      jumpMean: -0.1,
      jumpStdev: 0.15,
    };
    const market = { spot: 100, rate: 0.02 };
    const options = [
      { type: 'call' as const, strike: 80, expiry: 1 },
      { type: 'call' as const, strike: 100, expiry: 1 },
    ];
    const r = simulate(market, m, base({ paths: 32768, options }));
    const cos = priceOptions(market, m, options);
    r.estimates.forEach((e, i) => {
      expect(e.stdErrorControlled).toBeLessThan(e.stdError);
      expect(Math.abs(e.priceControlled - cos[i].price)).toBeLessThan(
        3 * e.stdErrorControlled + 0.005,
      );
    });
  });
});
