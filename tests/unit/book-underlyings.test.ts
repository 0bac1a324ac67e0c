/**
 * Contract multipliers, currencies and underlyings in a book. A listed option's value, delta
 * and P&L are the per-unit figures times quantity times the contract multiplier (common
 * practice: an index option on a 10-per-point contract is worth ten times its quoted price).
 * P&L is never added up across underlyings, and totals are kept per currency.
 */
import { describe, expect, it } from 'vitest';
import {
  inUnderlyingUnits,
  otherUnderlying,
  parsePositionsCsv,
  revalueSet,
  type BookScenario,
  type Position,
} from '../../src/engine/book';
import { DEFAULT_BATES, type Market } from '../../src/engine/core';

const market: Market = {
  underlying: 'LKX 40',
  currency: 'EUR',
  spot: 4250,
  rate: 0.031,
  dividendYield: 0.017,
};
const base: BookScenario = { id: 'base', name: 'Base', market, model: DEFAULT_BATES };
const ladder = { from: -0.1, to: 0.05, steps: 4 };
const put = (extra: Partial<Position> = {}): Position => ({
  id: 'P4000',
  type: 'put',
  strike: 4000,
  expiry: 30 / 365,
  quantity: -3,
  tradePrice: 20,
  ...extra,
});

describe('contract multipliers and currencies', () => {
  it('scales every figure of a leg by its multiplier (common practice), exactly as that many units', () => {
    const scenario = { ...base, id: 's', name: 'Stress', stress: { spotShift: -0.05 } };
    const contracts = revalueSet(base, [scenario], [put({ multiplier: 10 })], ladder);
    const units = revalueSet(base, [scenario], [put({ quantity: -30 })], ladder);
    expect(contracts.base.legs[0]).toEqual(units.base.legs[0]);
    expect(contracts.scenarios[0].total).toBe(units.scenarios[0].total);
    expect(contracts.baseLadder).toEqual(units.baseLadder);
    // P&L since trade: the trade price is per unit, as the value is
    expect(contracts.sinceTrade.total).toBe(units.sinceTrade.total);
    expect(contracts.sinceTrade.total).toBeCloseTo(units.base.legs[0].value - -30 * 20, 9);
    // applying the multiplier twice is not possible: it is dropped once applied
    expect(inUnderlyingUnits(inUnderlyingUnits([put({ multiplier: 10 })]))[0].quantity).toBe(-30);
  });

  it('keeps totals per currency, with legs that name none in the base scenario’s currency', () => {
    const legs = [
      put({ multiplier: 10 }),
      put({ id: 'P3900', strike: 3900, multiplier: 10, currency: 'EUR' }),
      put({ id: 'P3900-usd', strike: 3900, quantity: 2, currency: 'USD' }),
    ];
    const r = revalueSet(base, [], legs, ladder);
    expect(r.totals.map((t) => [t.underlying, t.currency, t.legs])).toEqual([
      ['LKX 40', 'EUR', 2],
      ['LKX 40', 'USD', 1],
    ]);
    expect(r.totals[0].value).toBeCloseTo(r.base.legs[0].value + r.base.legs[1].value, 9);
    expect(r.totals[1].value).toBe(r.base.legs[2].value);
    expect(r.totals[1].sinceTrade).toBeCloseTo(r.base.legs[2].value - 2 * 20, 9);
  });

  it('reads multiplier and currency columns from a positions file, and refuses bad ones by line', () => {
    const csv = [
      'id,type,strike,expiry,quantity,multiplier,currency',
      'a,put,4000,2027-01-15,-5,10,eur',
      'b,put,4000,2027-01-15,-5,0,EUR',
      'c,put,4000,2027-01-15,-5,10,EURO',
      'd,underlying,,,2,,',
    ].join('\n');
    const r = parsePositionsCsv(csv, '2026-12-02');
    expect(r.positions.map((p) => [p.id, p.multiplier, p.currency])).toEqual([
      ['a', 10, 'EUR'],
      ['d', undefined, undefined],
    ]);
    expect(r.issues.map((i) => [i.line, i.field])).toEqual([
      [3, 'multiplier'],
      [4, 'currency'],
    ]);
  });
});

describe('one underlying per book', () => {
  const single: Market = { ...market, underlying: 'Corvane Minerals', spot: 38.5 };

  it('leaves a scenario on another underlying out of the totals instead of adding it up', () => {
    const other: BookScenario = { id: 'o', name: 'Corvane', market: single, model: DEFAULT_BATES };
    const same: BookScenario = { ...base, id: 'b2', name: 'Same index' };
    const r = revalueSet(base, [same, other], [put()], ladder);
    expect(Math.abs(r.scenarios[0].total!)).toBeLessThan(1e-9);
    expect(r.scenarios[1]).toMatchObject({ total: null, legPnl: null, ladder: null });
    expect(r.scenarios[1].issues[0].path).toBe('market.underlying');
    expect(r.scenarios[1].issues[0].message).toMatch(/Corvane Minerals, not on the book's LKX 40/);
  });

  it('decides by name when both scenarios name their underlying, by spot when one does not', () => {
    expect(otherUnderlying(market, { ...market, underlying: 'lkx 40' })).toBeNull();
    // named the same: a 60 % lower spot is a (large) stress of the same index, not another one
    expect(otherUnderlying(market, { ...market, spot: 1700 })).toBeNull();
    const unnamed = { spot: 4250 };
    expect(otherUnderlying(unnamed, { spot: 4000 })).toBeNull();
    expect(otherUnderlying(unnamed, { spot: 38.5 })).toMatch(/another underlying/);
    expect(otherUnderlying(market, { spot: 38.5 })).toMatch(/another underlying/);
  });
});
