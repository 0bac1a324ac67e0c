/**
 * Where a COS series ends. The tolerances bound the terms left out: Σ|φ(u_n)|/(1 + u_n²) for a
 * price and Σ(2/(b − a))|φ(u_n)| for the density. Checked against outside references:
 * - the normal law, whose characteristic function and Black-Scholes prices are exact (Black &
 *   Scholes 1973), so the neglected tail can be summed exactly;
 * - the Lewis (2001) integral, an independent Fourier route, for the Bates jump split, and the
 *   density by Fourier inversion (Gil-Pelaez 1951) for gamma at short expiries, where a series
 *   that stopped on the price tolerance alone left the density's tail behind;
 * - the bound on the N ≥ 1 jump part: |e^z − 1| ≤ e^{|z|} − 1 (the power series, term by term),
 *   checked against that part computed from the whole and the jump-free characteristic functions.
 */
import { describe, expect, it } from 'vitest';
import {
  blackPrice,
  DEFAULT_COS_SETTINGS,
  lewisDensity,
  lewisPrice,
  logCharacteristic,
  modelSpec,
  priceOptions,
  seriesStrip,
  type CosSettings,
} from '../../src/engine/analytic';
import { cosSeries } from '../../src/engine/analytic/cos-series';
import { lognormalPartEnvelope } from '../../src/engine/analytic/cos-jump-split';
import {
  DEFAULT_BATES,
  discountFactor,
  forwardPrice,
  NO_JUMPS,
  type Market,
  type Model,
} from '../../src/engine/core';
import seedrandom from 'seedrandom';
import { randomHestonFamily } from './helpers';

/** ln φ of N(−σ²/2, σ²) at w = iu: −½σ²(u² + iu). */
function normalLogCf(variance: number) {
  return (
    _wr: Float64Array,
    wi: Float64Array,
    re: Float64Array,
    im: Float64Array,
    count: number,
  ): void => {
    for (let k = 0; k < count; k++) {
      re[k] = -0.5 * variance * wi[k] * wi[k];
      im[k] = -0.5 * variance * wi[k];
    }
  };
}

describe('a series ends where its neglected terms meet the tolerances', () => {
  const variance = 0.2 ** 2 * (7 / 365);
  const [a, b] = [-0.5, 0.5];
  const step = Math.PI / (b - a);
  const settings: CosSettings = { ...DEFAULT_COS_SETTINGS };
  const series = cosSeries(a, b, settings, false, normalLogCf(variance));
  const modulus = (n: number) => Math.exp(-0.5 * variance * (n * step) ** 2);
  const tail = (from: number) => {
    let price = 0;
    let density = 0;
    for (let n = from; n < from + 10_000; n++) {
      price += modulus(n) / (1 + (n * step) ** 2);
      density += ((2 * step) / Math.PI) * modulus(n);
    }
    return { price, density };
  };

  it('leaves out less than the tolerances, and one term fewer would not (exact normal tail)', () => {
    const left = tail(series.terms);
    expect(left.price).toBeLessThan(settings.tailTolerance);
    expect(left.density).toBeLessThan(settings.densityTolerance);
    const oneFewer = tail(series.terms - 1);
    expect(
      oneFewer.price >= settings.tailTolerance || oneFewer.density >= settings.densityTolerance,
    ).toBe(true);
  });

  it('ends at fewer terms than whole blocks, with Black-Scholes prices kept within 1e-14', () => {
    const blocks = cosSeries(a, b, { ...settings, trimTerms: false }, false, normalLogCf(variance));
    expect(series.terms).toBeLessThan(blocks.terms);
    const ks = Float64Array.from({ length: 21 }, (_, i) => -0.15 + 0.015 * i);
    const out = Array.from({ length: 4 }, () => new Float64Array(ks.length));
    seriesStrip(series, ks, out[0], out[1], out[2], out[3]);
    const sigma = Math.sqrt(variance / (7 / 365));
    ks.forEach((k, j) => {
      const strike = Math.exp(k);
      const common = { forward: 1, strike, sigma, expiry: 7 / 365, discount: 1 };
      expect(Math.abs(out[0][j] - blackPrice({ ...common, isCall: true }))).toBeLessThan(1e-14);
      expect(Math.abs(out[1][j] - blackPrice({ ...common, isCall: false }))).toBeLessThan(1e-14);
    });
  });
});

describe('the N ≥ 1 jump part of Merton/Bates is bounded by its Gaussian envelope', () => {
  const cases = [
    { lambdaT: 1e-3, jumpStdev: 0.15 },
    { lambdaT: 0.05, jumpStdev: 0.02 },
    { lambdaT: 2, jumpStdev: 0.3 },
  ];
  for (const { lambdaT, jumpStdev } of cases) {
    it(`Λ = ${lambdaT}, σJ = ${jumpStdev}: the envelope is at least |ψ(u)| from 0 to 60/σJ`, () => {
      const T = 0.1;
      const model: Model = {
        ...DEFAULT_BATES,
        jumpIntensity: lambdaT / T,
        jumpMean: -0.08,
        jumpStdev,
      };
      const spec = modelSpec(model);
      const quiet = { diffusion: spec.diffusion, jumps: NO_JUMPS };
      const p0 = Math.exp(-lambdaT);
      const pJump = -Math.expm1(-lambdaT);
      const envelope = lognormalPartEnvelope(jumpStdev, lambdaT, p0, pJump);
      const count = 400;
      const wi = Float64Array.from({ length: count }, (_, i) => ((60 / jumpStdev) * i) / count);
      const wr = new Float64Array(count);
      const [re, im, qre, qim] = Array.from({ length: 4 }, () => new Float64Array(count));
      logCharacteristic(spec, T, wr, wi, re, im, count);
      logCharacteristic(quiet, T, wr, wi, qre, qim, count);
      // ψ = (φ − e^{−Λ}φ₀·e^{−iuΛκ̄})/(1 − e^{−Λ}); |ψ| does not depend on the shift's phase
      const kbar = Math.expm1(model.jumpMean + 0.5 * jumpStdev ** 2);
      for (let i = 0; i < count; i++) {
        const shift = -lambdaT * kbar * wi[i];
        const fr = Math.exp(re[i]) * Math.cos(im[i]);
        const fi = Math.exp(re[i]) * Math.sin(im[i]);
        const qr = p0 * Math.exp(qre[i]) * Math.cos(qim[i] + shift);
        const qi = p0 * Math.exp(qre[i]) * Math.sin(qim[i] + shift);
        const psi = Math.hypot(fr - qr, fi - qi) / pJump;
        // the reference's own error: ln φ and ln φ₀ are good to about 1e-12 relative in φ where
        // they are large, and their difference's error grows as 1/(1 − e^{−Λ})
        const rounding = (1e-12 * (Math.exp(re[i]) + p0 * Math.exp(qre[i]))) / pJump;
        expect(psi).toBeLessThanOrEqual(envelope(wi[i]) * (1 + 1e-12) + rounding);
      }
    });
  }
});

describe('prices and Greeks from trimmed series against whole blocks and the Lewis integral', () => {
  const market: Market = { spot: 100, rate: 0.03, dividendYield: 0.01 };
  const options = [1, 7, 30, 91, 365].flatMap((days) =>
    [-3, -1.5, 0, 1.5, 3].map((z) => {
      const T = days / 365;
      const strike = 100 * Math.exp(z * 0.2 * Math.sqrt(T));
      return { type: z < 0 ? ('put' as const) : ('call' as const), strike, expiry: T };
    }),
  );
  it('Bates: the same within 1e-12 × spot (delta 1e-11, gamma × spot² 1e-10 × spot)', () => {
    const trimmed = priceOptions(market, DEFAULT_BATES, options);
    const blocks = priceOptions(market, DEFAULT_BATES, options, {
      ...DEFAULT_COS_SETTINGS,
      trimTerms: false,
    });
    trimmed.forEach((t, i) => {
      const w = blocks[i];
      expect(Math.abs(t.price - w.price)).toBeLessThan(1e-12 * market.spot);
      expect(Math.abs(t.delta - w.delta)).toBeLessThan(1e-11);
      expect(Math.abs(t.gamma - w.gamma) * market.spot).toBeLessThan(1e-10);
      expect(Math.abs(t.theta - w.theta)).toBeLessThan(1e-10 * market.spot);
      const lewis = lewisPrice(
        market,
        DEFAULT_BATES,
        options[i].type,
        options[i].strike,
        options[i].expiry,
      );
      expect(Math.abs(t.price - lewis)).toBeLessThan(1e-11 * market.spot);
    });
  });
});

describe('gamma at short expiries against the density by Fourier inversion', () => {
  // Heston's |φ| falls only exponentially: where its price weight |φ|/(1 + u²) has fallen below
  // 1e-14 the density's Σ(2/(b − a))|φ| need not have fallen below 1e-10. Random laws of every
  // Heston-based kind, 1 to 30 days, strikes within ±2 standard deviations.
  it('agrees within 2e-10 (gamma × spot) over 60 random laws', () => {
    const rng = seedrandom('short gamma');
    const u = (lo: number, hi: number) => lo + (hi - lo) * rng();
    const market: Market = { spot: 100, rate: 0.02, dividendYield: 0.01 };
    for (let i = 0; i < 60; i++) {
      const { model, v0 } = randomHestonFamily(i, u);
      const T = Math.exp(u(Math.log(1 / 365), Math.log(30 / 365)));
      const F = forwardPrice(market, T);
      const df = discountFactor(market, T);
      const sd = Math.sqrt(v0 * T);
      const options = [-2, -1, 0, 1, 2].map((z) => ({
        type: 'call' as const,
        strike: F * Math.exp(z * sd),
        expiry: T,
      }));
      priceOptions(market, model, options).forEach((o, j) => {
        const k = Math.log(options[j].strike / F);
        const gamma = (df * options[j].strike * lewisDensity(model, k, T)) / market.spot ** 2;
        expect(
          Math.abs(o.gamma - gamma) * market.spot,
          `${JSON.stringify(model)} T=${T}`,
        ).toBeLessThan(2e-10);
      });
    }
  });
});
