import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import {
  buildHedgeTable,
  lookup,
  blockCountFor,
  combineReplay,
  planReplay,
  replay,
  replayBlock,
  tracePath,
  type ReplayRequest,
  checkReplay,
  runtimeName,
  summaryOf,
  type SavedReplayRun,
} from '../../src/engine/replay';
import { priceOptions } from '../../src/engine/analytic';
import { discountFactor, type Model } from '../../src/engine/core';

const root = fileURLToPath(new URL('../..', import.meta.url));
const market = { spot: 100, rate: 0.02, dividendYield: 0 };
const bates: Model = {
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

describe('hedge replay', () => {
  it('in a Black-Scholes world, delta hedging at the true vol has mean P&L near zero and its s.d. halves when rebalancing is 4× as frequent (Derman & Kamal 1999; Hull, hedging performance)', () => {
    const bs: Model = { kind: 'black-scholes', sigma: 0.2 };
    const run = (per: number) =>
      replay({
        market,
        model: bs,
        position: [{ type: 'call', strike: 100, expiry: 30 / 365, quantity: -1 }],
        hedge: { method: 'bs-delta', rebalancesPerDay: per, costBps: 0, hedgeVol: 0.2 },
        paths: 8192,
        seed: 1,
      });
    const daily = run(1);
    const fourTimes = run(4);
    expect(Math.abs(daily.pnl.mean)).toBeLessThan(3 * (daily.pnl.stdev / Math.sqrt(8192)) + 0.005);
    expect(fourTimes.pnl.stdev / daily.pnl.stdev).toBeGreaterThan(0.4);
    expect(fourTimes.pnl.stdev / daily.pnl.stdev).toBeLessThan(0.6);
  });

  it('with jumps, a hedged short put has a fatter left tail than without, carried by the jump steps (common practice)', () => {
    const heston: Model = {
      kind: 'heston',
      v0: 0.04,
      kappa: 1.5,
      theta: 0.04,
      volOfVol: 0.5,
      rho: -0.7,
    };
    const position = [{ type: 'put' as const, strike: 95, expiry: 14 / 365, quantity: -10 }];
    const hedge = { method: 'model-delta' as const, rebalancesPerDay: 1, costBps: 0 };
    const withJumps = replay({ market, model: bates, position, hedge, paths: 8192, seed: 5 });
    const without = replay({ market, model: heston, position, hedge, paths: 8192, seed: 5 });
    expect(withJumps.pnl.es99).toBeGreaterThan(1.5 * without.pnl.es99);
    expect(withJumps.attribution.tailJumps).toBeLessThan(withJumps.attribution.tailDiffusion);
    expect(Math.abs(withJumps.attribution.tailJumps)).toBeGreaterThan(0.5 * withJumps.pnl.es99);
  });

  it('the model-delta table matches direct pricing within 2e-3 in delta and value per unit of the position', () => {
    const legs = [
      { type: 'put' as const, strike: 95, expiry: 30 / 365, quantity: -1 },
      { type: 'call' as const, strike: 105, expiry: 30 / 365, quantity: 1 },
    ];
    const times = Array.from({ length: 30 }, (_, k) => k / 365);
    const table = buildHedgeTable(market, bates, legs, times);
    for (const ti of [0, 10, 25, 29]) {
      for (const v of [0.01, 0.04, 0.09]) {
        for (const S of [85, 95, 100, 104, 112]) {
          const direct = priceOptions(
            { ...market, spot: S },
            { ...bates, v0: v } as Model,
            legs.map((l) => ({ type: l.type, strike: l.strike, expiry: l.expiry - times[ti] })),
          );
          const delta = direct.reduce((a, r, i) => a + legs[i].quantity * r.delta, 0);
          const value = direct.reduce((a, r, i) => a + legs[i].quantity * r.price, 0);
          const got = lookup(table, ti, v, Math.log(S / 100), 100);
          expect(Math.abs(got.delta - delta), `t=${ti} v=${v} S=${S}`).toBeLessThan(2e-3);
          expect(Math.abs(got.value - value), `t=${ti} v=${v} S=${S}`).toBeLessThan(2e-3);
        }
      }
    }
  }, 30000);

  it('replays bit for bit in another process, and refuses bad positions with a field path', () => {
    const request = {
      market,
      model: bates,
      position: [{ type: 'put', strike: 95, expiry: 0.02, quantity: -1 }],
      hedge: { method: 'bs-delta', rebalancesPerDay: 1, costBps: 1 },
      paths: 2000,
      seed: 3,
    };
    const run = (r: unknown) =>
      spawnSync(process.execPath, ['--import', 'tsx', 'cli/main.ts', 'replay'], {
        cwd: root,
        input: JSON.stringify(r),
        encoding: 'utf8',
      });
    const a = JSON.parse(run(request).stdout);
    const b = JSON.parse(run(request).stdout);
    delete a.elapsedMs;
    delete b.elapsedMs;
    expect(b).toEqual(a);
    for (const [bad, path] of [
      [{ ...request, position: [] }, 'position'],
      [
        { ...request, position: [{ type: 'put', strike: -5, expiry: 0.02, quantity: 1 }] },
        'position.0.strike',
      ],
      [
        { ...request, position: [{ type: 'put', strike: 95, expiry: 0.02, quantity: 1e12 }] },
        'position.0.quantity',
      ],
      [
        { ...request, position: [{ type: 'put', strike: 95, expiry: 9, quantity: 1 }] },
        'position.0.expiry',
      ],
      [
        {
          ...request,
          position: [{ type: 'put', strike: 95, expiry: 2, quantity: 1 }],
          hedge: { ...request.hedge, rebalancesPerDay: 96 },
        },
        'hedge.rebalancesPerDay',
      ],
    ] as const) {
      const r = run(bad);
      expect(r.status).toBe(2);
      expect(JSON.parse(r.stderr).error.path).toBe(path);
    }
  }, 60000); // seven CLI processes, each building its own hedge table

  it('blocks run on separate plans, as separate workers run them, combine to the bits of one thread; a traced path ends at its P&L', () => {
    const request: ReplayRequest = {
      market,
      model: bates,
      position: [
        { type: 'put', strike: 95, expiry: 14 / 365, quantity: -2 },
        { type: 'call', strike: 105, expiry: 21 / 365, quantity: 1 },
      ],
      hedge: { method: 'model-delta', rebalancesPerDay: 1, costBps: 2 },
      paths: 5000,
      seed: 11,
    };
    const whole = replay(request);
    // two "workers", each with its own plan, taking alternate blocks
    const plans = [planReplay(request), planReplay(request)];
    const blocks = Array.from({ length: blockCountFor(request.paths) }, (_, b) =>
      replayBlock(plans[b % 2], b),
    );
    const pooled = combineReplay(plans[0], blocks, 0);
    expect(pooled.digest).toBe(whole.digest);
    expect(pooled.pnl).toEqual(whole.pnl);
    expect(pooled.attribution).toEqual(whole.attribution);
    const other = replay({ ...request, seed: 12 });
    expect(other.digest).not.toBe(whole.digest);

    const trace = tracePath(plans[1], whole.worstPath);
    expect(trace.times).toHaveLength(pooled.steps + 1);
    const last = trace.pnl[trace.pnl.length - 1];
    expect(last * discountFactor(market, 21 / 365)).toBe(pooled.pnlByPath[whole.worstPath]);
    expect(pooled.pnlByPath[whole.worstPath]).toBe(whole.pnl.worst);
    // the worst path of a short put under negative mean jumps has a jump (common practice)
    expect(trace.jumps.length).toBeGreaterThan(0);
    for (const j of trace.jumps) expect(trace.times).toContainEqual(j.time);
  }, 60000);

  it('a saved run that is recomputed says "matches"; a changed engine version or changed bits is reported, not hidden', () => {
    const request: ReplayRequest = {
      market,
      model: bates,
      position: [{ type: 'put', strike: 97, expiry: 10 / 365, quantity: -1 }],
      hedge: { method: 'bs-delta', rebalancesPerDay: 2, costBps: 0 },
      paths: 3000,
      seed: 5,
    };
    const saved: SavedReplayRun = {
      kind: 'replay',
      id: 'run-1',
      savedAt: '2026-12-02T00:00:00Z',
      engineVersion: '0.1.0',
      request,
      seed: 5,
      summaries: [summaryOf(replay(request))],
    };
    // through JSON, as it is stored in the scenario
    const stored = JSON.parse(JSON.stringify(saved)) as SavedReplayRun;
    const again = [summaryOf(replay(stored.request))];
    expect(checkReplay(stored, again, '0.1.0')).toMatchObject({ matches: true });
    const nudged = [
      summaryOf(replay({ ...stored.request, hedge: { ...request.hedge, costBps: 1e-9 } })),
    ];
    const newer = checkReplay(stored, nudged, '0.2.0');
    expect(newer.matches).toBe(false);
    expect(newer.message).toContain('saved with engine 0.1.0 and this is engine 0.2.0');
    const same = checkReplay(stored, nudged, '0.1.0');
    expect(same.matches).toBe(false);
    expect(same.message).toContain('the engine version is the same');
    expect(same.message).toContain('if it was computed in another browser');
    expect(same.message).toContain(saved.summaries[0].digest);
    // a run that records its JavaScript engine: another browser is named as the likely cause
    const chromium =
      'Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/156.0.0.0 Safari/537.36';
    const firefox = 'Mozilla/5.0 (X11; Linux x86_64; rv:140.0) Gecko/20100101 Firefox/140.0';
    const recorded = { ...stored, runtime: chromium };
    expect(checkReplay(recorded, again, '0.1.0', firefox).matches).toBe(true);
    const elsewhere = checkReplay(recorded, nudged, '0.1.0', firefox);
    expect(elsewhere.message).toContain('computed under Chrome 156 and now under Firefox 140');
    expect(checkReplay(recorded, nudged, '0.1.0', chromium).message).toContain(
      'the browser are the same, so this is a defect to report',
    );
  }, 60000);

  it('names the browser a run was computed in by its most specific product token', () => {
    const edge =
      'Mozilla/5.0 (Windows NT 10.0; Win64; x64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/131.0.0.0 Safari/537.36 Edg/131.0.0.0';
    const safari =
      'Mozilla/5.0 (Macintosh; Intel Mac OS X 10_15_7) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/18.1 Safari/605.1.15';
    expect(runtimeName(edge)).toBe('Edge 131');
    expect(runtimeName(safari)).toBe('Safari 18');
    expect(runtimeName('Node v20.20.2')).toBe('Node 20');
    expect(runtimeName('x'.repeat(80))).toHaveLength(58);
  });
});
