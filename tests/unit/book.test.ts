import { describe, expect, it } from 'vitest';
import {
  bookTotal,
  ladderMoves,
  legRisks,
  legValuesAtMoves,
  sumRow,
  revalueSet,
  type Position,
  type BookScenario,
} from '../../src/engine/book';
import type { Market, Model } from '../../src/engine/core';

const bates: Model = {
  kind: 'bates',
  v0: 0.04,
  kappa: 2,
  theta: 0.04,
  volOfVol: 0.5,
  rho: -0.7,
  jumpIntensity: 0.5,
  jumpMean: -0.08,
  jumpStdev: 0.1,
};
const market: Market = { spot: 100, rate: 0.03, dividendYield: 0 };

describe('book revaluation', () => {
  it('values a Black-Scholes call as Hull’s worked example (S=42, K=40, r=10%, σ=20%, T=0.5: 4.7594 each)', () => {
    // Hull, Options, Futures, and Other Derivatives, BSM worked example
    const [leg] = legRisks({ spot: 42, rate: 0.1 }, { kind: 'black-scholes', sigma: 0.2 }, [
      { id: 'c', type: 'call', strike: 40, expiry: 0.5, quantity: 10 },
    ]);
    expect(leg.value / 10).toBeCloseTo(4.7594, 4);
  });

  it('has Haug’s Greeks per option: delta 0.5946 (S=105, K=100, r=q=10%, σ=36%, T=0.5); gamma 0.0278, vega 18.9358 (S=55, K=60)', () => {
    // Haug 1998, via QuantLib europeanoption.cpp; our vega is per vol point, so ×100
    const [d] = legRisks(
      { spot: 105, rate: 0.1, dividendYield: 0.1 },
      { kind: 'black-scholes', sigma: 0.36 },
      [{ id: 'a', type: 'call', strike: 100, expiry: 0.5, quantity: 1 }],
    );
    expect(d.delta).toBeCloseTo(0.5946, 4);
    const [g] = legRisks({ spot: 55, rate: 0.1 }, { kind: 'black-scholes', sigma: 0.3 }, [
      { id: 'b', type: 'call', strike: 60, expiry: 0.75, quantity: 1 },
    ]);
    expect(g.gamma).toBeCloseTo(0.0278, 4);
    expect(g.vega * 100).toBeCloseTo(18.9358, 3);
  });

  it('values the book as the sum of its legs', () => {
    const book: Position[] = [
      { id: 'p', type: 'put', strike: 90, expiry: 7 / 365, quantity: -30 },
      { id: 'c', type: 'call', strike: 110, expiry: 0.25, quantity: 12 },
      { id: 'u', type: 'underlying', quantity: 5 },
    ];
    const legs = legRisks(market, bates, book);
    const total = bookTotal(legs);
    expect(total.value).toBeCloseTo(
      legs.reduce((a, l) => a + l.value, 0),
      10,
    );
    expect(total.delta).toBeCloseTo(
      legs.reduce((a, l) => a + l.delta, 0),
      10,
    );
  });

  it('revalues a position and its exact offset to zero under every scenario and ladder point', () => {
    const leg: Position = { id: 'p', type: 'put', strike: 95, expiry: 14 / 365, quantity: 40 };
    const book: Position[] = [leg, { ...leg, id: 'p-offset', quantity: -40 }];
    const base: BookScenario = { id: 'b', name: 'base', market, model: bates };
    const crash: BookScenario = {
      id: 's',
      name: 'crash',
      market,
      model: bates,
      stress: { jumpIntensityScale: 4, jumpMeanShift: -0.1, spotShift: -0.05 },
    };
    const r = revalueSet(base, [base, crash], book, { from: -0.3, to: 0.1, steps: 41 });
    for (const s of r.scenarios) {
      expect(Math.abs(s.total!)).toBeLessThan(1e-9);
      for (const v of s.ladder!) expect(Math.abs(v)).toBeLessThan(1e-9);
    }
    for (const v of r.baseLadder) expect(Math.abs(v)).toBeLessThan(1e-9);
  });

  it('holds put-call parity across a conversion: long put + long stock − long call is worth K·DF at every ladder point (q = 0)', () => {
    const T = 0.5;
    const K = 100;
    const conversion: Position[] = [
      { id: 'p', type: 'put', strike: K, expiry: T, quantity: 1 },
      { id: 'u', type: 'underlying', quantity: 1 },
      { id: 'c', type: 'call', strike: K, expiry: T, quantity: -1 },
    ];
    const moves = ladderMoves({ from: -0.3, to: 0.1, steps: 9 });
    for (const row of legValuesAtMoves(market, bates, conversion, moves)) {
      expect(Math.abs(sumRow(row) - K * Math.exp(-0.03 * T))).toBeLessThan(1e-9);
    }
  });

  it('a long put’s ladder gains on down moves and is convex (common practice)', () => {
    const r = revalueSet(
      { id: 'b', name: 'base', market, model: bates },
      [],
      [{ id: 'p', type: 'put', strike: 95, expiry: 30 / 365, quantity: 1 }],
      { from: -0.3, to: 0.1, steps: 41 },
    );
    const zero = r.moves.indexOf(0);
    for (let i = 0; i < zero; i++) expect(r.baseLadder[i]).toBeGreaterThan(0);
    for (let i = 1; i < r.moves.length - 1; i++) {
      expect(r.baseLadder[i - 1] - 2 * r.baseLadder[i] + r.baseLadder[i + 1]).toBeGreaterThan(
        -1e-9,
      );
    }
  });

  it('with a deeper mean jump, out-of-the-money puts are worth more than under base (common practice: jump risk is priced into the wings)', () => {
    const puts: Position[] = [80, 85, 90].map((K) => ({
      id: `p${K}`,
      type: 'put',
      strike: K,
      expiry: 14 / 365,
      quantity: 1,
    }));
    const base: BookScenario = { id: 'b', name: 'base', market, model: bates };
    const deeper: BookScenario = {
      id: 'd',
      name: 'deeper',
      market,
      model: bates,
      stress: { jumpMeanShift: -0.07 },
    };
    const r = revalueSet(base, [deeper], puts, { from: -0.2, to: 0, steps: 5 });
    for (const pnl of r.scenarios[0].legPnl!) expect(pnl).toBeGreaterThan(0);
  });

  it('draws the jump law: more jump probability within a week than within a day, none for Black-Scholes', () => {
    const r = revalueSet(
      { id: 'b', name: 'base', market, model: bates },
      [],
      [{ id: 'u', type: 'underlying', quantity: 1 }],
      { from: -0.3, to: 0.1, steps: 41 },
    );
    const day = r.jumpPerDay.reduce((a, b) => a + b, 0);
    const week = r.jumpPerWeek.reduce((a, b) => a + b, 0);
    expect(week).toBeGreaterThan(day * 5);
    expect(day).toBeCloseTo(1 - Math.exp(-0.5 / 365), 4);
    const bs = revalueSet(
      { id: 'b', name: 'bs', market, model: { kind: 'black-scholes', sigma: 0.2 } },
      [],
      [{ id: 'u', type: 'underlying', quantity: 1 }],
      { from: -0.3, to: 0.1, steps: 41 },
    );
    expect(bs.jumpPerDay.every((p) => p === 0)).toBe(true);
  });
});

describe('the ladder’s interpolated strip', () => {
  it('matches direct pricing at each moved spot within 1e-8 × spot, 1 day to 1 year, many strikes', () => {
    const positions: Position[] = [];
    for (const days of [1, 7, 30, 365]) {
      for (let i = 0; i < 60; i++) {
        const strike = 70 + i;
        positions.push({
          id: `${days}-${i}`,
          type: strike < 100 ? 'put' : 'call',
          strike,
          expiry: days / 365,
          quantity: 1,
        });
      }
    }
    const moves = ladderMoves({ from: -0.3, to: 0.1, steps: 41 });
    const values = legValuesAtMoves(market, bates, positions, moves);
    for (const mi of [0, 10, 25, 40]) {
      const direct = legRisks({ ...market, spot: market.spot * (1 + moves[mi]) }, bates, positions);
      direct.forEach((d, i) =>
        expect(
          Math.abs(values[mi][i] - d.value),
          `move ${moves[mi]} leg ${positions[i].id}`,
        ).toBeLessThan(1e-8 * market.spot),
      );
    }
  });
});
