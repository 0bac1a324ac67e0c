import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { priceOptions } from '../../src/engine/analytic';
import { legValuesAtMoves, type Position } from '../../src/engine/book';
import { jumpMoveProbabilities } from '../../src/engine/book/jump-law';
import { type Market, type Model } from '../../src/engine/core';
import { calibrate, jumpsVerdict, modelVols, type VolQuote } from '../../src/engine/fit';

const market: Market = { spot: 100, rate: 0.02, dividendYield: 0.01 };
const heston = {
  kind: 'heston',
  v0: 0.03,
  kappa: 2,
  theta: 0.04,
  volOfVol: 0.5,
  rho: -0.7,
} as const;
const MOVE_DAY = 9;

function quotesOf(model: Model, noiseVolPoints: number): VolQuote[] {
  const quotes: VolQuote[] = [];
  for (const d of [3, 7, 14, 21, 30, 61, 91, 182])
    for (let i = 0; i < 9; i++)
      quotes.push({
        expiry: d / 365,
        strike: 100 * Math.exp(0.25 * Math.sqrt(d / 365) * (-2 + i / 2)),
        impliedVol: 0,
      });
  const vols = modelVols(market, model, quotes);
  const rng = seedrandom('dated');
  quotes.forEach((q, i) => (q.impliedVol = vols[i]! + (noiseVolPoints / 100) * (2 * rng() - 1)));
  return quotes;
}

describe('fitting a scheduled move', () => {
  const truth: Model = {
    ...heston,
    events: [{ time: MOVE_DAY / 365, law: 'normal', stdev: 0.045 }],
  };

  it('recovers a move size alone, with the model held fixed, to 1e-4', () => {
    const quotes = quotesOf(truth, 0);
    const r = calibrate({
      market,
      model: { ...heston, events: [{ time: MOVE_DAY / 365, law: 'normal', stdev: 0.01 }] },
      fixed: ['v0', 'kappa', 'theta', 'volOfVol', 'rho'],
      fitEventSizes: [0],
      quotes,
    });
    const e = r.model.events![0];
    expect(e.law === 'normal' && Math.abs(e.stdev - 0.045)).toBeLessThan(1e-4);
    expect(r.rmseVolPoints).toBeLessThan(1e-3);
  });

  it('leaves expiries before the date untouched: their residuals do not depend on the move', () => {
    const quotes = quotesOf(truth, 0);
    const before = quotes.filter((q) => q.expiry * 365 < MOVE_DAY);
    const without = modelVols(market, heston, before);
    const withMove = modelVols(market, truth, before);
    expect(withMove).toEqual(without);
  });

  it('on quotes made by Heston with a dated move, prefers "one scheduled move" to the jumps by BIC', () => {
    const quotes = quotesOf(truth, 0.05);
    const v = jumpsVerdict({
      market,
      quotes,
      hestonGuess: { ...heston },
      moveTime: MOVE_DAY / 365,
      refine: 2,
    });
    expect(v.move).toBeDefined();
    expect(v.bic.move!).toBeLessThan(v.bic.bates);
    expect(v.move!.rmseVolPoints).toBeLessThan(0.1);
    expect(v.summary).toMatch(/One scheduled move/);
  });
});

describe('the book under dated risk', () => {
  const positions: Position[] = [
    { id: 'c', type: 'call', strike: 100, expiry: 14 / 365, quantity: -10 },
    { id: 'p', type: 'put', strike: 95, expiry: 14 / 365, quantity: -10 },
  ];

  it('revalues the ladder through the move: at zero move each leg is worth its price with the move', () => {
    const dated: Model = {
      ...heston,
      events: [{ time: 5 / 365, law: 'two-point', up: 0.05, down: -0.06, upProbability: 0.5 }],
    };
    const [atZero] = legValuesAtMoves(market, dated, positions, [0]);
    const direct = priceOptions(market, dated, positions as never);
    positions.forEach((p, i) =>
      expect(Math.abs(atZero[i] - p.quantity * direct[i].price)).toBeLessThan(1e-8),
    );
    const [plain] = legValuesAtMoves(market, heston, positions, [0]);
    // a short straddle is worth less (more negative) when a move is due before expiry
    expect(atZero[0] + atZero[1]).toBeLessThan(plain[0] + plain[1]);
  });

  it('weighs the jump odds by the scheduled intensity: 1 − e^{−Λ(h)}', () => {
    const bates: Model = {
      ...heston,
      kind: 'bates',
      jumpIntensity: 0.5,
      jumpMean: -0.1,
      jumpStdev: 0.05,
    };
    const scheduled = { ...bates, jumpIntensitySchedule: [[30 / 365, 5]] } as Model;
    const moves = [-0.2, -0.1, 0];
    const flat = jumpMoveProbabilities({ ...bates, jumpIntensity: 5 }, moves, 1 / 365);
    expect(jumpMoveProbabilities(scheduled, moves, 1 / 365)).toEqual(flat);
  });
});
