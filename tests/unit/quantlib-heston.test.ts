import { describe, expect, it } from 'vitest';
import { priceOptions } from '../../src/engine/analytic';
import type { Model } from '../../src/engine/core';
import { quantlibHestonPrices, type QlHestonParams } from '../support/quantlib';

// Outside reference: @quantlib/ql's AnalyticHestonEngine (adaptive Gauss-Lobatto, rel. tol 1e-13).
const SETS: Record<string, { p: QlHestonParams; r: number; q: number }> = {
  'Fang & Oosterlee 2008': {
    p: { kappa: 1.5768, theta: 0.0398, volOfVol: 0.5751, rho: -0.5711, v0: 0.0175 },
    r: 0,
    q: 0,
  },
  'Lewis reference set': {
    p: { kappa: 4, theta: 0.25, volOfVol: 1, rho: -0.5, v0: 0.04 },
    r: 0.01,
    q: 0.02,
  },
  'Andersen 2008 Case I': {
    p: { kappa: 0.5, theta: 0.04, volOfVol: 1, rho: -0.9, v0: 0.04 },
    r: 0,
    q: 0,
  },
  'Broadie & Kaya 2006 case 1': {
    p: { kappa: 6.21, theta: 0.019, volOfVol: 0.61, rho: -0.7, v0: 0.010201 },
    r: 0.0319,
    q: 0,
  },
  'BENCHOP Problem 4': {
    p: { kappa: 2, theta: 0.0225, volOfVol: 0.25, rho: -0.5, v0: 0.0225 },
    r: 0.03,
    q: 0,
  },
};

const DAYS = [1, 7, 30, 91, 365, 1825, 3650];

describe('Heston against QuantLib’s AnalyticHestonEngine, 1 day to 10 years', () => {
  for (const [name, { p, r, q }] of Object.entries(SETS)) {
    it(`agrees within 1e-8 × spot over strikes ±2.5 standard deviations (${name})`, () => {
      const spot = 100;
      const options: { type: 'call' | 'put'; strike: number; days: number }[] = [];
      for (const days of DAYS) {
        const T = days / 365;
        const sd = Math.sqrt(
          p.theta * T + ((p.v0 - p.theta) * (1 - Math.exp(-p.kappa * T))) / p.kappa,
        );
        const fwd = spot * Math.exp((r - q) * T);
        for (const z of [-2.5, -1.5, -0.5, 0, 0.5, 1.5, 2.5]) {
          const strike = fwd * Math.exp(z * sd);
          options.push({ type: z < 0 ? 'put' : 'call', strike, days });
        }
      }
      const reference = quantlibHestonPrices(spot, r, q, p, options);
      const model: Model = { kind: 'heston', ...p };
      const ours = priceOptions(
        { spot, rate: r, dividendYield: q },
        model,
        options.map((o) => ({ type: o.type, strike: o.strike, expiry: o.days / 365 })),
      );
      let worst = 0;
      ours.forEach((o, i) => (worst = Math.max(worst, Math.abs(o.price - reference[i]))));
      expect(worst).toBeLessThan(1e-8 * spot);
    });
  }
});
