import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import type { Market, Model } from '../../src/engine/core';
import { calibrate, modelVols, type VolQuote } from '../../src/engine/fit';

const market: Market = { spot: 100, rate: 0.02, dividendYield: 0.01 };
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

function grid(): VolQuote[] {
  const quotes: VolQuote[] = [];
  for (const d of [7, 14, 30, 61, 91, 182, 365, 730])
    for (let i = 0; i < 13; i++)
      quotes.push({
        expiry: d / 365,
        strike: 100 * Math.exp(0.2 * Math.sqrt(d / 365) * (-2.5 + (5 * i) / 12)),
        impliedVol: 0,
      });
  return quotes;
}

const clean = grid();
const truthVols = modelVols(market, truth, clean) as number[];

/** The surface with Gaussian vol noise of `sd` vol points (Box-Muller on a seeded generator). */
function noisy(seed: number, sd: number): VolQuote[] {
  const rng = seedrandom(`noise-${seed}`);
  return clean.map((q, i) => {
    const z = Math.sqrt(-2 * Math.log(1 - rng())) * Math.cos(2 * Math.PI * rng());
    return { ...q, impliedVol: truthVols[i] + (sd / 100) * z };
  });
}

const fit = (quotes: VolQuote[], extra: object = {}) =>
  calibrate({ market, model: truth, quotes, screen: 2, refine: 1, ...extra });

describe('parameter standard errors', () => {
  it('match the spread of the estimates over 50 noisy refits within a factor of 1.5 (Seber & Wild 1989: the Jacobian covariance is the estimates’ asymptotic covariance)', () => {
    const names = ['v0', 'rho', 'jumpIntensity', 'jumpMean'] as const;
    const estimates = names.map(() => [] as number[]);
    // the reported error of each refit, averaged (each refit reports its own, from its own noise)
    const reported = names.map(() => 0);
    for (let s = 0; s < 50; s++) {
      const r = fit(noisy(s, 0.3));
      names.forEach((n, j) => {
        estimates[j].push(r.model[n] as number);
        reported[j] += r.errors.standardErrors[r.errors.names.indexOf(n)]! / 50;
      });
    }
    names.forEach((n, j) => {
      const xs = estimates[j];
      const mean = xs.reduce((a, b) => a + b, 0) / xs.length;
      const spread = Math.sqrt(xs.reduce((a, b) => a + (b - mean) ** 2, 0) / (xs.length - 1));
      const ratio = reported[j] / spread;
      expect(ratio, `${n}: reported ${reported[j]} vs spread ${spread}`).toBeGreaterThan(1 / 1.5);
      expect(ratio, `${n}: reported ${reported[j]} vs spread ${spread}`).toBeLessThan(1.5);
    });
  }, 240_000);
});

describe('anchoring a fit to yesterday’s', () => {
  const yesterday: Model = { ...truth, jumpIntensity: 0.6, jumpMean: -0.09, v0: 0.035 };
  const quotes = noisy(99, 0.3);

  it('with weight 0 is identical to the plain fit', () => {
    const plain = fit(quotes);
    const anchored = fit(quotes, { anchor: { model: yesterday, weight: 0 } });
    expect(anchored.model).toEqual(plain.model);
    expect(anchored.sseVolPoints).toBe(plain.sseVolPoints);
  });

  it('with a large weight stays at yesterday’s parameters within 1e-6, and reports the extra misfit', () => {
    const plain = fit(quotes);
    const anchored = fit(quotes, { anchor: { model: yesterday, weight: 1e16 } });
    for (const n of [
      'v0',
      'kappa',
      'theta',
      'volOfVol',
      'rho',
      'jumpIntensity',
      'jumpMean',
      'jumpStdev',
    ])
      expect(
        Math.abs(
          (anchored.model[n as keyof Model] as number) - (yesterday[n as keyof Model] as number),
        ),
        n,
      ).toBeLessThan(1e-6);
    expect(anchored.sseVolPoints).toBeGreaterThan(plain.sseVolPoints);
    expect(anchored.anchorPenalty).toBeDefined();
  });
});
