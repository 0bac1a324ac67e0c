/**
 * The standard-deviation strike grid of each expiry, and the documents that keep one
 * log-moneyness list. Under Black-Scholes the ATM implied vol is σ itself (common practice), so
 * the grid's ends are ±4·σ·√T exactly.
 */
import { describe, expect, it } from 'vitest';
import { atmVolAt, modelSpec, smileSurface, surfaceGrids } from '../../src/engine/analytic';
import { DEFAULT_BATES, forwardPrice, type Market, type Model } from '../../src/engine/core';

const market: Market = { spot: 100, rate: 0.03, dividendYield: 0.01 };
const BS: Model = { kind: 'black-scholes', sigma: 0.2 };
const bs = modelSpec(BS);

/** Each expiry's ln(K/F) list, as a smile request draws it. */
const strikeGrids = (
  model: Model,
  expiries: number[],
  moneyness: number[],
  spacing?: 'standard-deviations',
) => surfaceGrids(smileSurface(market, model, expiries, moneyness, spacing));

function expectShape(ks: number[], end: number) {
  expect(ks).toHaveLength(41);
  expect(ks[20]).toBe(0);
  expect(ks[0]).toBeCloseTo(-end, 12);
  expect(ks[40]).toBeCloseTo(end, 12);
  for (let i = 1; i < ks.length; i++) expect(ks[i]).toBeGreaterThan(ks[i - 1]);
  for (let i = 0; i < ks.length; i++) expect(ks[i]).toBeCloseTo(-ks[40 - i], 15);
  // closer together near the money than in the wings
  expect(ks[21] - ks[20]).toBeLessThan(0.6 * (ks[40] - ks[39]));
}

describe('standard-deviation strike grid', () => {
  it('a one-day expiry spans ±4 ATM standard deviations: strikes about ±4.3 % around the forward', () => {
    const T = 1 / 365;
    expect(atmVolAt(bs, T)).toBeCloseTo(0.2, 12);
    const [ks] = strikeGrids(BS, [T], [0], 'standard-deviations');
    const end = 4 * 0.2 * Math.sqrt(T); // 0.041874
    expectShape(ks, end);
    const F = forwardPrice(market, T);
    expect(F * Math.exp(ks[0])).toBeCloseTo(F * Math.exp(-0.0418739), 4);
    expect(F * Math.exp(ks[40])).toBeCloseTo(F * Math.exp(0.0418739), 4);
  });

  it('a one-year expiry spans ±0.8 in ln(K/F) at σ = 20 %', () => {
    const [ks] = strikeGrids(BS, [1], [0], 'standard-deviations');
    expectShape(ks, 0.8);
  });

  it("follows the model's own ATM vol under Bates, per expiry", () => {
    const expiries = [1 / 365, 7 / 365, 1];
    const grids = strikeGrids(DEFAULT_BATES, expiries, [0], 'standard-deviations');
    const surface = smileSurface(market, DEFAULT_BATES, expiries, grids);
    surface.slices.forEach((slice, i) => {
      const end = 4 * slice.atm! * Math.sqrt(expiries[i]);
      expectShape(grids[i], end);
      expect(slice.logMoneyness).toEqual(grids[i]);
      expect(slice.impliedVols.every((v) => v !== null)).toBe(true);
    });
  });

  it('a grid without a spacing keeps its one log-moneyness list for every expiry', () => {
    const moneyness = [-0.3, -0.1, 0, 0.1, 0.3];
    const grids = strikeGrids(BS, [1 / 365, 1], moneyness);
    expect(grids).toEqual([moneyness, moneyness]);
  });
});
