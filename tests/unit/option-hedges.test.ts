import { describe, expect, it } from 'vitest';
import {
  buildHedgeTable,
  lookupGreeks,
  planReplay,
  replay,
  replayRequestSchema,
  runRequests,
  tracePath,
  type ReplayRequest,
} from '../../src/engine/replay';
import { priceOptions } from '../../src/engine/analytic';
import { DEFAULT_BATES, normPdf, type Model } from '../../src/engine/core';

const market = { spot: 100, rate: 0.02, dividendYield: 0 };
const bs: Model = { kind: 'black-scholes', sigma: 0.2 };
/** the project's default Bates model (core's DEFAULT_BATES) */
const bates: Model = DEFAULT_BATES;

describe('option overlays in a replay', () => {
  it('a short put with the same put long as overlay has a P&L of exactly 0 on every path, and its delta hedge never trades (exactness: the book is flat)', () => {
    const put = { type: 'put' as const, strike: 95, expiry: 0.1, quantity: -3 };
    const req: ReplayRequest = {
      market,
      model: bates,
      position: [put],
      overlay: [{ ...put, quantity: 3 }],
      hedge: { method: 'model-delta', rebalancesPerDay: 1, costBps: 2 },
      paths: 3000,
      seed: 11,
    };
    const r = replay(req);
    expect(Math.abs(r.pnl.worst)).toBeLessThanOrEqual(1e-9 * market.spot);
    expect(r.pnl.stdev).toBeLessThanOrEqual(1e-9 * market.spot);
    expect(r.overlayPremium).toBeCloseTo(-r.premium, 12);
    // the overlay on its own is a long put: it pays on the paths that fall
    expect(r.overlayPnl!.stdev).toBeGreaterThan(1);
    const plan = planReplay(req);
    for (const path of [0, r.worstPath, 2999]) {
      const trace = tracePath(plan, path);
      expect(trace.shares.every((s) => Math.abs(s) <= 1e-12)).toBe(true);
    }
    expect(replay(req).digest).toBe(r.digest);
  });

  it('the overlay P&L is its payoff less its premium: on average its premium is fair, within 3 standard errors (risk-neutral pricing, common practice)', () => {
    const r = replay({
      market,
      model: bates,
      position: [{ type: 'put', strike: 95, expiry: 0.1, quantity: -1 }],
      overlay: [{ type: 'put', strike: 85, expiry: 0.1, quantity: 2 }],
      hedge: { method: 'none', rebalancesPerDay: 1, costBps: 0 },
      paths: 20000,
      seed: 5,
    });
    const o = r.overlayPnl!;
    expect(Math.abs(o.mean)).toBeLessThan(3 * (o.stdev / Math.sqrt(20000)));
    const [p85] = priceOptions(market, bates, [{ type: 'put', strike: 85, expiry: 0.1 }]);
    expect(r.overlayPremium).toBeCloseTo(2 * p85.price, 12);
  });
});

describe('hedging with a second option', () => {
  const request = (method: ReplayRequest['hedge']['method']): ReplayRequest => ({
    market,
    model: bs,
    position: [{ type: 'call', strike: 100, expiry: 1 / 12, quantity: -1 }],
    hedge: {
      method,
      rebalancesPerDay: 1,
      costBps: 0,
      instrument: { type: 'call', strike: 100, expiry: 2 / 12 },
    },
    paths: 4000,
    seed: 7,
  });

  it('in a Black-Scholes world the delta-gamma hedge with a 2-month call has at most a third of the delta hedge s.d. for a 1-month ATM short call, daily (common practice: the hedging error falls from order √Δt to order Δt)', () => {
    const delta = replay(request('model-delta'));
    const gamma = replay(request('model-delta-gamma'));
    expect(gamma.pnl.stdev).toBeLessThanOrEqual(delta.pnl.stdev / 3);
    expect(Math.abs(gamma.pnl.mean)).toBeLessThan(0.02);
  });

  it('the delta-vega hedge leaves the residual gamma Γ − (V/Vᵢ)Γᵢ: its s.d. ratio to the delta hedge matches the leading-order discrete-hedging error ½σ²S²Γ(Z²−1)Δt per step (Boyle & Emanuel 1980) within 10 %', () => {
    const delta = replay(request('model-delta'));
    const vega = replay(request('model-delta-vega'));
    // the expectation, by quadrature over the lognormal spot at each rebalance
    const { sigma: sig } = bs as { sigma: number };
    const r = market.rate;
    const n = Math.round((365 / 12) * 1);
    const dt = 1 / 12 / n;
    const d1 = (S: number, tau: number) =>
      (Math.log(S / 100) + (r + 0.5 * sig * sig) * tau) / (sig * Math.sqrt(tau));
    const gam = (S: number, tau: number) => normPdf(d1(S, tau)) / (S * sig * Math.sqrt(tau));
    const veg = (S: number, tau: number) => S * normPdf(d1(S, tau)) * Math.sqrt(tau);
    let varDelta = 0;
    let varVega = 0;
    for (let k = 0; k < n; k++) {
      const t = k * dt;
      for (let z = -8; z <= 8; z += 0.01) {
        const w = normPdf(z) * 0.01;
        const S = 100 * Math.exp((r - 0.5 * sig * sig) * t + sig * Math.sqrt(t) * z);
        const book = -gam(S, 1 / 12 - t);
        const residual = book + (veg(S, 1 / 12 - t) / veg(S, 2 / 12 - t)) * gam(S, 2 / 12 - t);
        const f = 0.5 * (sig * sig * dt * S * S) ** 2;
        varDelta += w * f * book * book;
        varVega += w * f * residual * residual;
      }
    }
    const expected = Math.sqrt(varVega / varDelta);
    const seen = vega.pnl.stdev / delta.pnl.stdev;
    expect(Math.abs(seen / expected - 1)).toBeLessThan(0.1);
    // and it sits between the delta hedge and the delta-gamma hedge
    expect(vega.pnl.stdev).toBeGreaterThan(replay(request('model-delta-gamma')).pnl.stdev);
  });

  it("the table's gamma and vega match Black-Scholes closed forms (Hull, the Greek letters) within 1e-3 relative at the money", () => {
    const leg = { type: 'call' as const, strike: 100, expiry: 0.25, quantity: 1 };
    const table = buildHedgeTable(market, bs, [leg], [0, 0.1], { vega: true });
    const g = lookupGreeks(table, 1, 0, Math.log(101 / 100), 100);
    const tau = 0.15;
    const d1 = (Math.log(101 / 100) + (0.02 + 0.02) * tau) / (0.2 * Math.sqrt(tau));
    expect(Math.abs(g.gamma / (normPdf(d1) / (101 * 0.2 * Math.sqrt(tau))) - 1)).toBeLessThan(1e-3);
    expect(Math.abs(g.vega / (101 * normPdf(d1) * Math.sqrt(tau)) - 1)).toBeLessThan(1e-3);
  });

  it('costs apply to the option trades on their premium, and a bad instrument is refused with its path', () => {
    const free = replay(request('model-delta-gamma'));
    const costly = replay({
      ...request('model-delta-gamma'),
      hedge: { ...request('model-delta-gamma').hedge, costBps: 50 },
    });
    expect(costly.pnl.mean).toBeLessThan(free.pnl.mean);
    const missing = replayRequestSchema.safeParse({
      ...request('model-delta-vega'),
      hedge: { method: 'model-delta-vega', rebalancesPerDay: 1, costBps: 0 },
    });
    expect(missing.success).toBe(false);
    expect(missing.error!.issues[0].path.join('.')).toBe('hedge.instrument');
    const early = replayRequestSchema.safeParse({
      ...request('model-delta-gamma'),
      hedge: {
        ...request('model-delta-gamma').hedge,
        instrument: { type: 'call', strike: 100, expiry: 0.05 },
      },
    });
    expect(early.error!.issues[0].path.join('.')).toBe('hedge.instrument.expiry');
  });
});

describe('saved runs with an overlay', () => {
  it('recompute as each hedge without the overlay, then with it, in the order the page ran them', () => {
    const request: ReplayRequest = {
      market,
      model: bs,
      position: [{ type: 'put', strike: 95, expiry: 0.1, quantity: -1 }],
      overlay: [{ type: 'put', strike: 85, expiry: 0.1, quantity: 2 }],
      hedge: { method: 'model-delta', rebalancesPerDay: 1, costBps: 0 },
      paths: 100,
      seed: 1,
    };
    const runs = runRequests({
      request,
      compare: { method: 'bs-delta', rebalancesPerDay: 1, costBps: 0 },
    });
    expect(runs.map((r) => [r.hedge.method, r.overlay?.length ?? 0])).toEqual([
      ['model-delta', 0],
      ['model-delta', 1],
      ['bs-delta', 0],
      ['bs-delta', 1],
    ]);
    expect(runRequests({ request: { ...request, overlay: undefined } })).toHaveLength(1);
  });
});
