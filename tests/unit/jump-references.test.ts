import { describe, expect, it } from 'vitest';
import type { Model } from '../../src/engine/core';
import { cosPrice, lewisPrice, market } from './helpers';

const merton = (
  sigma: number,
  jumpIntensity: number,
  jumpMean: number,
  jumpStdev: number,
): Model => ({
  kind: 'merton',
  sigma,
  jumpIntensity,
  jumpMean,
  jumpStdev,
});

describe('Merton (1976) jump-diffusion against published values', () => {
  it('BENCHOP Problem 5: calls at S0 = 90/100/110 (σ=0.15, λ=0.4, μJ=−0.5, σJ=0.4, r=3%, T=1)', () => {
    const m = merton(0.15, 0.4, -0.5, 0.4);
    const table: [number, number][] = [
      [90, 7.542526012669795],
      [100, 14.33625088531066],
      [110, 22.35996956518987],
    ];
    for (const [S, v] of table)
      expect(Math.abs(cosPrice(market(S, 0.03), m, 'call', 100, 1) - v)).toBeLessThan(1e-10);
  });

  it('Surkov 2009 Table 2.2: put 18.0036289358 (T=10) and Table C.1: call 4.3912456892 (T=0.25)', () => {
    expect(
      Math.abs(
        cosPrice(market(100, 0.05, 0.02), merton(0.15, 0.1, -1.08, 0.4), 'put', 100, 10) -
          18.0036289358,
      ),
    ).toBeLessThan(1e-9);
    // published 4.391243; the high-precision value is 4.3912456892
    expect(
      Math.abs(
        cosPrice(market(100, 0.05), merton(0.15, 0.1, -0.9, 0.45), 'call', 100, 0.25) -
          4.3912456892,
      ),
    ).toBeLessThan(1e-9);
  });
});

describe('Bates (Heston × Merton jumps)', () => {
  const bates: Model = {
    kind: 'bates',
    kappa: 1.5768,
    theta: 0.0398,
    volOfVol: 0.5751,
    rho: -0.5711,
    v0: 0.0175,
    jumpIntensity: 0.5,
    jumpMean: -0.1,
    jumpStdev: 0.15,
  };

  it('prices the computed reference 7.558073816048 (Fang & Oosterlee Heston set + λ=0.5, μJ=−0.1, σJ=0.15)', () => {
    // computed reference: three independent methods agreeing to 1e-10 (not a published table)
    expect(Math.abs(cosPrice(market(100), bates, 'call', 100, 1) - 7.558073816048)).toBeLessThan(
      1e-10,
    );
    expect(Math.abs(lewisPrice(market(100), bates, 'call', 100, 1) - 7.558073816048)).toBeLessThan(
      1e-10,
    );
  });

  it('becomes Merton when vol-of-vol vanishes and v0 = θ (Merton series 9.164898622)', () => {
    const limit: Model = {
      kind: 'bates',
      v0: 0.04,
      theta: 0.04,
      kappa: 1,
      volOfVol: 0,
      rho: 0,
      jumpIntensity: 0.5,
      jumpMean: -0.1,
      jumpStdev: 0.15,
    };
    const series = 9.164898622; // computed reference (Merton series), printed to 1e-9
    expect(Math.abs(cosPrice(market(100), limit, 'call', 100, 1) - series)).toBeLessThan(1e-9);
    expect(
      Math.abs(cosPrice(market(100), merton(0.2, 0.5, -0.1, 0.15), 'call', 100, 1) - series),
    ).toBeLessThan(1e-9);
    // and continuously (with ρ = 0 the effect of ξ is of order ξ²): no cancellation blow-up
    const tolerance: [number, number][] = [
      [1e-4, 1e-7],
      [1e-6, 1e-9],
      [1e-9, 1e-9],
    ];
    for (const [xi, tol] of tolerance) {
      const near = cosPrice(market(100), { ...limit, volOfVol: xi } as Model, 'call', 100, 1);
      expect(Math.abs(near - series)).toBeLessThan(tol);
    }
  });

  it('becomes Black-Scholes when jumps and vol-of-vol vanish (Hull: call 4.7594, put 0.8086)', () => {
    const m: Model = {
      kind: 'bates',
      v0: 0.04,
      theta: 0.04,
      kappa: 2,
      volOfVol: 0,
      rho: 0,
      jumpIntensity: 0,
      jumpMean: -0.1,
      jumpStdev: 0.15,
    };
    expect(cosPrice(market(42, 0.1), m, 'call', 40, 0.5)).toBeCloseTo(4.7594, 4);
    expect(cosPrice(market(42, 0.1), m, 'put', 40, 0.5)).toBeCloseTo(0.8086, 4);
    const bs: Model = { kind: 'black-scholes', sigma: 0.2 };
    expect(
      Math.abs(
        cosPrice(market(42, 0.1), m, 'call', 40, 0.5) -
          cosPrice(market(42, 0.1), bs, 'call', 40, 0.5),
      ),
    ).toBeLessThan(1e-11);
  });

  it('agrees with the independent Lewis integral from 1 day to 10 years, strikes ±40 %, within 1e-8 × spot', () => {
    for (const T of [1 / 365, 7 / 365, 30 / 365, 0.25, 1, 5, 10]) {
      for (const K of [60, 80, 95, 100, 105, 120, 140]) {
        const type = K < 100 ? 'put' : 'call';
        const diff = Math.abs(
          cosPrice(market(100, 0.02, 0.01), bates, type, K, T) -
            lewisPrice(market(100, 0.02, 0.01), bates, type, K, T),
        );
        expect(diff, `T=${T} K=${K}`).toBeLessThan(1e-8 * 100);
      }
    }
  });
});

describe('Heston with double-exponential (Kou 2002) jumps', () => {
  const hk: Model = {
    kind: 'heston-kou',
    v0: 0.04,
    kappa: 1.5,
    theta: 0.04,
    volOfVol: 0.5,
    rho: -0.6,
    jumpIntensity: 1,
    upProbability: 0.35,
    upMean: 0.05,
    downMean: 0.1,
  };

  it('agrees with the independent Lewis integral from 1 day to 5 years', () => {
    for (const T of [1 / 365, 14 / 365, 0.5, 5]) {
      for (const K of [70, 90, 100, 110, 130]) {
        const type = K < 100 ? 'put' : 'call';
        expect(
          Math.abs(
            cosPrice(market(100, 0.02), hk, type, K, T) -
              lewisPrice(market(100, 0.02), hk, type, K, T),
          ),
          `T=${T} K=${K}`,
        ).toBeLessThan(1e-8 * 100);
      }
    }
  });

  it('becomes Kou’s model (constant volatility) when vol-of-vol vanishes and v0 = θ', () => {
    // Kou's model has no Heston part; with ξ = 0 and v0 = θ the variance is the constant θ.
    const limit: Model = { ...hk, volOfVol: 0 } as Model;
    // ρ ≠ 0 makes the effect of ξ first order, so "tiny" is 1e-11 here
    const tiny: Model = { ...hk, volOfVol: 1e-11 } as Model;
    for (const K of [80, 100, 120]) {
      const type = K < 100 ? 'put' : 'call';
      const a = cosPrice(market(100), limit, type, K, 0.5);
      const b = cosPrice(market(100), tiny, type, K, 0.5);
      expect(Math.abs(a - b)).toBeLessThan(1e-9);
      expect(Math.abs(a - lewisPrice(market(100), limit, type, K, 0.5))).toBeLessThan(1e-9);
    }
  });
});
