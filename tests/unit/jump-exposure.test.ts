import { describe, expect, it } from 'vitest';
import {
  DEFAULT_VOL_REACTION,
  bookJumpExposure,
  revalueSet,
  suggestWingHedge,
  type Position,
} from '../../src/engine/book';
import { priceOptions } from '../../src/engine/analytic';
import { DEFAULT_BATES, normCdf, normInv, type Market, type Model } from '../../src/engine/core';
import { replay, suggestWingHedgeByReplay } from '../../src/engine/replay';

const market: Market = { spot: 100, rate: 0.02, dividendYield: 0.01 };
const bates: Model = { ...DEFAULT_BATES, jumpIntensity: 0.8, jumpStdev: 0.12 };
/** rare, large, negative jumps: about one a year, −12 % ± 8 % */
const merton: Model = {
  kind: 'merton',
  sigma: 0.15,
  jumpIntensity: 1,
  jumpMean: -0.12,
  jumpStdev: 0.08,
};
const kou: Model = {
  kind: 'heston-kou',
  v0: 0.03,
  kappa: 2,
  theta: 0.03,
  volOfVol: 0.4,
  rho: -0.6,
  jumpIntensity: 1.2,
  upProbability: 0.3,
  upMean: 0.04,
  downMean: 0.08,
};
const book: Position[] = [
  { id: 'short 92 put', type: 'put', strike: 92, expiry: 21 / 365, quantity: -10 },
  { id: 'long 105 call', type: 'call', strike: 105, expiry: 60 / 365, quantity: 4 },
  { id: 'stock', type: 'underlying', quantity: 2 },
];
const ladder = { from: -0.3, to: 0.1, steps: 9 };

/** The book's value with spot moved by m, priced afresh with the market's spot moved. */
function bookValue(model: Model, m: number): number {
  const moved = { ...market, spot: market.spot * (1 + m) };
  const options = book.filter((p) => p.type !== 'underlying');
  const priced = priceOptions(
    moved,
    model,
    options.map((p) => ({ type: p.type as 'call' | 'put', strike: p.strike!, expiry: p.expiry! })),
  );
  return options.reduce((a, p, i) => a + p.quantity * priced[i].price, 0) + 2 * moved.spot;
}

const scenario = (model: Model) => ({ id: 'b', name: 'base', market, model });

describe('jump exposure of a book', () => {
  it('at each ladder point it is the P&L of the instant move less the delta part, V(S(1+m)) − V(S) − Δ·S·m, repriced at the moved spot (definition; the models scale with spot)', () => {
    for (const model of [bates, kou]) {
      const r = revalueSet(scenario(model), [], book, ladder);
      const e = bookJumpExposure(scenario(model), book, ladder);
      const now = bookValue(model, 0);
      e.moves.forEach((m, i) => {
        const direct = bookValue(model, m) - now - r.base.total.delta * market.spot * m;
        expect(Math.abs(e.model[i] - direct)).toBeLessThan(1e-8 * market.spot);
        expect(e.volReaction[i]).toBeCloseTo(
          r.volReactionLadder[i] - r.base.total.delta * market.spot * m,
          10,
        );
      });
      expect(r.volReaction).toBe(DEFAULT_VOL_REACTION);
    }
  });

  it('the expected jump P&L per year matches a direct integration over the jump law (trapezoid with one Romberg step on a fine grid) within 1e-8 relative', () => {
    const cases: [Model, (y: number) => number, number, number][] = [
      [
        bates,
        (y) => Math.exp(-0.5 * ((y + 0.1) / 0.12) ** 2) / (0.12 * Math.sqrt(2 * Math.PI)),
        -0.1 - 12 * 0.12,
        -0.1 + 12 * 0.12,
      ],
      [
        kou,
        (y) => (y >= 0 ? (0.3 / 0.04) * Math.exp(-y / 0.04) : (0.7 / 0.08) * Math.exp(y / 0.08)),
        -30 * 0.08,
        30 * 0.04,
      ],
    ];
    for (const [model, density, lo, hi] of cases) {
      const r = revalueSet(scenario(model), [], book, ladder);
      const e = bookJumpExposure(scenario(model), book, ladder);
      const now = bookValue(model, 0);
      const delta = r.base.total.delta;
      const g = (y: number) =>
        density(y) * (bookValue(model, Math.expm1(y)) - now - delta * market.spot * Math.expm1(y));
      // the trapezoid on each side of 0 (where the double-exponential density has its kink), at
      // n and n/2 panels from the same points, with one Richardson step (Romberg)
      const romberg = (a: number, b: number, n: number) => {
        const h = (b - a) / n;
        const f = Array.from({ length: n + 1 }, (_, i) => g(a + i * h));
        const fine = h * (f.reduce((x, y) => x + y, 0) - 0.5 * (f[0] + f[n]));
        const coarse =
          2 *
          h *
          (f.filter((_, i) => i % 2 === 0).reduce((x, y) => x + y, 0) - 0.5 * (f[0] + f[n]));
        return (4 * fine - coarse) / 3;
      };
      const lambda = (model as { jumpIntensity: number }).jumpIntensity;
      const direct = lambda * (romberg(lo, 0, 2000) + romberg(0, hi, 1000));
      expect(e.jumpsPerYear).toBe(lambda);
      expect(Math.abs(e.expectedJumpPnlPerYear / direct - 1)).toBeLessThan(1e-8);
    }
  });

  it("a stock holding's 1-day 99 % VaR under Black-Scholes is S·q·(e^{(r−q−σ²/2)h + σ√h·z₀.₀₁} − 1) (common practice), and no share of it comes from jumps", () => {
    const bs: Model = { kind: 'black-scholes', sigma: 0.25 };
    const e = bookJumpExposure(
      scenario(bs),
      [{ id: 's', type: 'underlying', quantity: 10 }],
      ladder,
    );
    const h = 1 / 365;
    const z = normInv(0.01);
    const expected = 10 * 100 * Math.expm1((0.01 - 0.5 * 0.0625) * h + 0.25 * Math.sqrt(h) * z);
    // the day's bins are 1/60 s.d. wide in the body: the quantile drawn between their centres
    expect(Math.abs(e.oneDay.var99 / expected - 1)).toBeLessThan(1e-4);
    // expected shortfall of a normal: −σ√h·φ(z)/0.01, to first order in the move
    expect(e.oneDay.es99).toBeLessThan(e.oneDay.var99);
    expect(e.oneDay.jumpShare).toBe(0);
    expect(e.expectedJumpPnlPerYear).toBe(0);
    expect(normCdf(z)).toBeCloseTo(0.01, 12);
  });

  it("a stock holding's 1-day 99 % VaR under Merton is at the 1 % point of his Poisson mixture of normals for the day's log-move (Merton 1976)", () => {
    const {
      sigma,
      jumpIntensity: lambda,
      jumpMean: mu,
      jumpStdev: delta,
    } = merton as {
      sigma: number;
      jumpIntensity: number;
      jumpMean: number;
      jumpStdev: number;
    };
    const h = 1 / 365;
    const kbar = Math.exp(mu + 0.5 * delta * delta) - 1;
    // ln(S_h/F_h) = −λκ̄h − σ²h/2 + σ√h·Z + Σ_{i≤N} J_i, N ~ Poisson(λh), J_i ~ N(μ, δ²)
    const cdf = (y: number) => {
      let total = 0;
      let weight = Math.exp(-lambda * h);
      for (let n = 0; n < 12; n++) {
        if (n > 0) weight *= (lambda * h) / n;
        const mean = -lambda * kbar * h - 0.5 * sigma * sigma * h + n * mu;
        total += weight * normCdf((y - mean) / Math.sqrt(sigma * sigma * h + n * delta * delta));
      }
      return total;
    };
    let lo = -1;
    let hi = 0;
    for (let i = 0; i < 200; i++) {
      const mid = 0.5 * (lo + hi);
      if (cdf(mid) < 0.01) lo = mid;
      else hi = mid;
    }
    const growth = Math.exp((0.02 - 0.01) * h);
    const expected = 10 * 100 * (growth * Math.exp(lo) - 1);
    const e = bookJumpExposure(
      scenario(merton),
      [{ id: 's', type: 'underlying', quantity: 10 }],
      ladder,
    );
    expect(Math.abs(e.oneDay.var99 / expected - 1)).toBeLessThan(1e-4);
  });

  it("with rare jumps (1 a year) a short put's 1-day expected shortfall comes mostly from jump days (common practice: jumps live in the tail)", () => {
    const e = bookJumpExposure(scenario(merton), [book[0]], ladder);
    expect(e.oneDay.jumpShare).toBeGreaterThan(0.5);
    expect(e.expectedJumpPnlPerYear).toBeLessThan(0);
  });
});

describe('wing-hedge suggestion', () => {
  it('in a Merton world, the suggested overlay halves the ES99 of a model-delta-hedged short OTM put on the same paths, within the premium budget, and the jump steps carry less of the tail (common practice: only options hedge a gap)', () => {
    const expiry = 30 / 365;
    const put: Position = { id: 'p', type: 'put', strike: 92, expiry, quantity: -10 };
    const strikes = [80, 85, 90];
    const budget = 2;
    const w = suggestWingHedge(market, merton, [put], {
      instruments: strikes.map((strike) => ({ type: 'put', strike, expiry })),
      budget,
    });
    expect(w.premium).toBeLessThanOrEqual(budget + 1e-9);
    expect(w.worstAfter).toBeGreaterThan(w.worstBefore / 3);
    const base = {
      market,
      model: merton,
      position: [{ type: 'put' as const, strike: 92, expiry, quantity: -10 }],
      hedge: { method: 'model-delta' as const, rebalancesPerDay: 1, costBps: 1 },
      paths: 10000,
      seed: 3,
    };
    const overlay = strikes
      .map((strike, j) => ({ type: 'put' as const, strike, expiry, quantity: w.quantities[j] }))
      .filter((l) => l.quantity > 0);
    const before = replay(base);
    const after = replay({ ...base, overlay });
    expect(after.overlayPremium).toBeCloseTo(w.premium, 9);
    expect(after.pnl.es99).toBeLessThanOrEqual(0.5 * before.pnl.es99);
    const jumpShare = (r: typeof before) =>
      r.attribution.tailJumps / (r.attribution.tailJumps + r.attribution.tailDiffusion);
    expect(jumpShare(after)).toBeLessThan(jumpShare(before));
    expect(Math.abs(after.attribution.tailJumps)).toBeLessThan(
      0.5 * Math.abs(before.attribution.tailJumps),
    );
  });

  it('with no budget it buys nothing, and the ladder after equals the ladder before', () => {
    const w = suggestWingHedge(market, bates, book, {
      instruments: [{ type: 'put', strike: 85, expiry: 30 / 365 }],
      budget: 0,
    });
    expect(w.quantities).toEqual([0]);
    expect(w.after).toEqual(w.before);
  });
});

describe('wing hedge by a pilot replay', () => {
  it('without costs the hedged P&L is linear in the overlay, so the pilot ES99 after the hedge is the replay of that overlay on the same paths, to 1e-9 × spot; it halves the ES99 within budget (Rockafellar & Uryasev 2000, CVaR by linear programming)', () => {
    const expiry = 30 / 365;
    const request = {
      market,
      model: merton,
      position: [{ type: 'put' as const, strike: 92, expiry, quantity: -10 }],
      hedge: { method: 'model-delta' as const, rebalancesPerDay: 1, costBps: 0 },
      paths: 1000,
      seed: 9,
    };
    const instruments = [80, 85, 90].map((strike) => ({ type: 'put' as const, strike, expiry }));
    const w = suggestWingHedgeByReplay({ replay: request, instruments, budget: 3 });
    expect(w.premium).toBeLessThanOrEqual(3 + 1e-9);
    expect(w.esAfter).toBeGreaterThan(0.5 * w.esBefore); // ES is negative: a loss at most half
    const overlay = instruments.map((o, j) => ({ ...o, quantity: w.quantities[j] }));
    const after = replay({ ...request, overlay });
    // the pilot's own base run carries every candidate at quantity 0 (one spot grid for all)
    const before = replay({ ...request, overlay: overlay.map((o) => ({ ...o, quantity: 0 })) });
    // and the position alone differs from it only by the table's interpolation
    expect(Math.abs(replay(request).pnl.es99 - before.pnl.es99)).toBeLessThan(1e-5 * market.spot);
    expect(Math.abs(-after.pnl.es99 - w.esAfter)).toBeLessThan(1e-9 * market.spot);
    expect(Math.abs(-before.pnl.es99 - w.esBefore)).toBeLessThan(1e-9 * market.spot);
  });
});
