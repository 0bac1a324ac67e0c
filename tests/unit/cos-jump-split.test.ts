/**
 * Short expiries with jumps are priced as two COS series, split on whether a jump arrives (no
 * jump: narrow; at least one: smooth). Checked against two outside references:
 * - Merton (1976), "Option pricing when underlying stock returns are discontinuous", J. Financial
 *   Economics 3: the price is Σ_n e^{−λ'T}(λ'T)^n/n! · BS(σ_n, r_n) with λ' = λ(1 + κ̄),
 *   σ_n² = σ² + nδ²/T, r_n = r − λκ̄ + n·ln(1 + κ̄)/T (his eq. 19);
 * - the Lewis (2001) integral, an independent Fourier route, for Bates and SVCJ.
 */
import { describe, expect, it } from 'vitest';
import {
  blackPrice,
  lewisPrice,
  modelSpec,
  prepareCos,
  priceOptions,
} from '../../src/engine/analytic';
import { DEFAULT_BATES, type Market, type Model, type OptionSpec } from '../../src/engine/core';

const market: Market = { spot: 100, rate: 0.03, dividendYield: 0.01 };

function mertonSeries(
  m: Market,
  model: { sigma: number; jumpIntensity: number; jumpMean: number; jumpStdev: number },
  o: OptionSpec,
): number {
  const { sigma, jumpIntensity: lambda, jumpMean: mu, jumpStdev: delta } = model;
  const T = o.expiry;
  const r = m.rate ?? 0;
  const q = m.dividendYield ?? 0;
  const kbar = Math.exp(mu + 0.5 * delta * delta) - 1;
  const lambdaPrime = lambda * (1 + kbar);
  let total = 0;
  let weight = Math.exp(-lambdaPrime * T);
  for (let n = 0; n < 40; n++) {
    if (n > 0) weight *= (lambdaPrime * T) / n;
    const sigmaN = Math.sqrt(sigma * sigma + (n * delta * delta) / T);
    const rN = r - lambda * kbar + (n * Math.log(1 + kbar)) / T;
    total +=
      weight *
      blackPrice({
        forward: m.spot * Math.exp((rN - q) * T),
        strike: o.strike,
        sigma: sigmaN,
        expiry: T,
        discount: Math.exp(-rN * T),
        isCall: o.type === 'call',
      });
  }
  return total;
}

/** Strikes within ±6 standard deviations of a one- or two-day move, and two jump-sized wings. */
function shortStrip(days: number): OptionSpec[] {
  const T = days / 365;
  const sd = 0.2 * Math.sqrt(T);
  const ks = [...Array.from({ length: 25 }, (_, i) => sd * (-6 + i / 2)), -0.25, -0.12, 0.1];
  return ks.map((k) => ({
    type: k < 0 ? ('put' as const) : ('call' as const),
    strike: 100 * Math.exp(k),
    expiry: T,
  }));
}

describe('short expiries with jumps, split on whether a jump arrives', () => {
  const merton = { sigma: 0.18, jumpIntensity: 0.8, jumpMean: -0.08, jumpStdev: 0.12 };

  it('is used at one and two days, and not once jumps are frequent enough', () => {
    const spec = modelSpec({ kind: 'merton', ...merton });
    expect(prepareCos(spec, 1 / 365).parts).not.toBeNull();
    expect(prepareCos(spec, 2 / 365).parts).not.toBeNull();
    expect(prepareCos(spec, 1).parts).toBeNull();
  });

  it("agrees with Merton's Poisson sum of Black-Scholes prices within 1e-10 × spot", () => {
    for (const days of [1, 2]) {
      const options = shortStrip(days);
      const priced = priceOptions(market, { kind: 'merton', ...merton }, options);
      options.forEach((o, i) => {
        expect(Math.abs(priced[i].price - mertonSeries(market, merton, o))).toBeLessThan(
          1e-10 * 100,
        );
      });
    }
  });

  it('has two parts whose weights add to 1 and whose E[e^Y] average to 1, as a martingale', () => {
    const spec = modelSpec(DEFAULT_BATES);
    const parts = prepareCos(spec, 7 / 365).parts;
    expect(parts).toHaveLength(2);
    const [quiet, jump] = parts!;
    // no jump in a week at λ = 0.5 a year: e^{−Λ}, Λ = 0.5 · 7/365
    expect(quiet.weight).toBeCloseTo(Math.exp((-0.5 * 7) / 365), 15);
    expect(quiet.weight + jump.weight).toBeCloseTo(1, 15);
    expect(quiet.weight * quiet.series.mean + jump.weight * jump.series.mean).toBeCloseTo(1, 14);
    // the part with a jump is smooth: no more terms than the no-jump part on a far wider range
    const width = (p: typeof quiet) => p.series.b - p.series.a;
    expect(width(jump)).toBeGreaterThan(3 * width(quiet));
    expect(jump.series.terms).toBeLessThanOrEqual(quiet.series.terms);
  });

  it('agrees with the Lewis integral for Bates within 1e-10 × spot', () => {
    const bates: Model = DEFAULT_BATES;
    expect(prepareCos(modelSpec(bates), 1 / 365).parts).not.toBeNull();
    for (const days of [1, 2]) {
      const options = shortStrip(days);
      const priced = priceOptions(market, bates, options);
      options.forEach((o, i) => {
        const reference = lewisPrice(market, bates, o.type, o.strike, o.expiry);
        expect(Math.abs(priced[i].price - reference)).toBeLessThan(1e-10 * 100);
      });
    }
  });

  it('agrees with the Lewis integral for SVCJ from 1 day to 3 months within 1e-10 × spot', () => {
    const svcj: Model = {
      ...DEFAULT_BATES,
      kind: 'svcj',
      varianceJumpMean: 0.05,
      jumpCorrelation: -0.5,
    };
    expect(prepareCos(modelSpec(svcj), 1 / 365).parts).not.toBeNull();
    for (const days of [1, 7, 30, 91]) {
      const options = shortStrip(days);
      const priced = priceOptions(market, svcj, options);
      options.forEach((o, i) => {
        const reference = lewisPrice(market, svcj, o.type, o.strike, o.expiry);
        expect(Math.abs(priced[i].price - reference)).toBeLessThan(1e-10 * 100);
      });
    }
  });
});
