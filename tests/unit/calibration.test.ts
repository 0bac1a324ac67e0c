import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import {
  calibrate,
  modelVols,
  type VolQuote,
  jumpsVerdict,
  levenbergMarquardt,
} from '../../src/engine/fit';
import { impliedVol } from '../../src/engine/analytic';
import { discountFactor, forwardPrice, type Market, type Model } from '../../src/engine/core';
import { quantlibHestonPrices } from '../support/quantlib';

const market: Market = { spot: 100, rate: 0.02, dividendYield: 0.01 };
const DAYS = [7, 14, 30, 61, 91, 182, 365, 730];

function surface(model: Model, noiseVolPoints: number, seed: string): VolQuote[] {
  const quotes: VolQuote[] = [];
  for (const d of DAYS)
    for (let i = 0; i < 13; i++)
      quotes.push({
        expiry: d / 365,
        strike: 100 * Math.exp(0.2 * Math.sqrt(d / 365) * (-2.5 + (5 * i) / 12)),
        impliedVol: 0,
      });
  const vols = modelVols(market, model, quotes);
  const rng = seedrandom(seed);
  quotes.forEach((q, i) => (q.impliedVol = vols[i]! + (noiseVolPoints / 100) * (2 * rng() - 1)));
  return quotes;
}

describe('Levenberg-Marquardt', () => {
  it('solves Rosenbrock’s problem from (−1.2, 1) (Moré, Garbow & Hillstrom 1981, problem 1)', () => {
    const r = levenbergMarquardt(
      (x) => new Float64Array([10 * (x[1] - x[0] ** 2), 1 - x[0]]),
      [-1.2, 1],
    );
    expect(r.x[0]).toBeCloseTo(1, 8);
    expect(r.x[1]).toBeCloseTo(1, 8);
  });
});

describe('calibration', () => {
  it('recovers known Bates parameters from a noisy 13 × 8 surface, RMSE below the noise', () => {
    const truth: Model = {
      kind: 'bates',
      v0: 0.03,
      kappa: 2.5,
      theta: 0.045,
      volOfVol: 0.6,
      rho: -0.65,
      jumpIntensity: 0.4,
      jumpMean: -0.12,
      jumpStdev: 0.1,
    };
    const quotes = surface(truth, 0.05, 'round-trip'); // uniform noise of ±0.05 vol points: RMS 0.029
    const guess: Model = {
      kind: 'bates',
      v0: 0.04,
      kappa: 1.5,
      theta: 0.04,
      volOfVol: 0.5,
      rho: -0.5,
      jumpIntensity: 0.3,
      jumpMean: -0.05,
      jumpStdev: 0.1,
    };
    const r = calibrate({ market, model: guess, quotes });
    const m = r.model as Extract<Model, { kind: 'bates' }>;
    expect(r.rmseVolPoints).toBeLessThan(0.05 / Math.sqrt(3));
    expect(m.v0).toBeCloseTo(0.03, 3);
    expect(m.theta).toBeCloseTo(0.045, 2);
    expect(m.rho).toBeCloseTo(-0.65, 1);
    expect(Math.abs(m.jumpMean + 0.12)).toBeLessThan(0.01);
    expect(Math.abs(m.jumpIntensity - 0.4)).toBeLessThan(0.05);
    expect(Math.abs(m.jumpStdev - 0.1)).toBeLessThan(0.01);
    expect(Math.abs(m.kappa - 2.5)).toBeLessThan(0.3);
  });

  it('recovers Heston parameters from a surface priced by QuantLib’s AnalyticHestonEngine', () => {
    const p = { kappa: 1.8, theta: 0.05, volOfVol: 0.55, rho: -0.7, v0: 0.035 };
    const legs: { type: 'call' | 'put'; strike: number; days: number }[] = [];
    for (const days of [30, 91, 182, 365, 730])
      for (const m of [0.8, 0.9, 0.95, 1, 1.05, 1.1, 1.2])
        legs.push({ type: m < 1 ? 'put' : 'call', strike: 100 * m, days });
    const prices = quantlibHestonPrices(market.spot, market.rate!, market.dividendYield!, p, legs);
    const quotes = legs.map((l, i) => {
      const T = l.days / 365;
      const iv = impliedVol({
        price: prices[i],
        forward: forwardPrice(market, T),
        strike: l.strike,
        expiry: T,
        discount: discountFactor(market, T),
        isCall: l.type === 'call',
      });
      return { strike: l.strike, expiry: T, impliedVol: iv.vol! };
    });
    const r = calibrate({
      market,
      model: { kind: 'heston', v0: 0.04, kappa: 1, theta: 0.04, volOfVol: 0.3, rho: -0.3 },
      quotes,
    });
    const m = r.model as Extract<Model, { kind: 'heston' }>;
    expect(r.rmseVolPoints).toBeLessThan(1e-3);
    expect(m.v0).toBeCloseTo(p.v0, 4);
    expect(m.theta).toBeCloseTo(p.theta, 3);
    expect(m.rho).toBeCloseTo(p.rho, 2);
    expect(m.volOfVol).toBeCloseTo(p.volOfVol, 2);
    expect(m.kappa).toBeCloseTo(p.kappa, 1);
  });

  it('holds fixed parameters where they are', () => {
    const truth: Model = {
      kind: 'heston',
      v0: 0.04,
      kappa: 2,
      theta: 0.05,
      volOfVol: 0.5,
      rho: -0.6,
    };
    const r = calibrate({
      market,
      model: { ...truth, kappa: 3, rho: -0.2 } as Model,
      fixed: ['kappa'],
      quotes: surface(truth, 0, 'fixed'),
    });
    expect((r.model as Extract<Model, { kind: 'heston' }>).kappa).toBe(3);
  });

  it('says the jumps earn their keep on a Bates surface with a steep short end, and not on a Heston one', () => {
    const bates: Model = {
      kind: 'bates',
      v0: 0.03,
      kappa: 2,
      theta: 0.04,
      volOfVol: 0.5,
      rho: -0.6,
      jumpIntensity: 0.6,
      jumpMean: -0.12,
      jumpStdev: 0.08,
    };
    const hestonGuess = {
      kind: 'heston' as const,
      v0: 0.04,
      kappa: 1.5,
      theta: 0.04,
      volOfVol: 0.5,
      rho: -0.5,
    };
    const yes = jumpsVerdict({
      market,
      quotes: surface(bates, 0.05, 'verdict-yes'),
      hestonGuess,
      screen: 8,
      refine: 2,
    });
    expect(yes.jumpsEarnTheirKeep).toBe(true);
    expect(yes.buckets[0].bates!).toBeLessThan(yes.buckets[0].heston!);
    const heston: Model = {
      kind: 'heston',
      v0: 0.03,
      kappa: 2,
      theta: 0.04,
      volOfVol: 0.5,
      rho: -0.6,
    };
    const no = jumpsVerdict({
      market,
      quotes: surface(heston, 0.05, 'verdict-no'),
      hestonGuess,
      screen: 8,
      refine: 2,
    });
    expect(no.jumpsEarnTheirKeep).toBe(false);
  }, 30000);
});
