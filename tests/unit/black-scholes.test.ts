import { describe, expect, it } from 'vitest';
import {
  blackPrice,
  blackScholesGreeks,
  normalisedBlack,
  impliedVol,
  normCdf,
  normInv,
  modelSpec,
  smileSlice,
} from '../../src/engine/analytic';

/** Inputs with S, r, q as Hull and Haug state them: F = S e^{(r−q)T}, DF = e^{−rT}. */
function bs(S: number, K: number, r: number, q: number, sigma: number, T: number, isCall: boolean) {
  const discount = Math.exp(-r * T);
  const forward = S * Math.exp((r - q) * T);
  return blackScholesGreeks({ forward, strike: K, sigma, expiry: T, discount, isCall, spot: S });
}

describe('Black-Scholes prices and Greeks', () => {
  it('matches Hull’s BSM worked example (S=42, K=40, r=10%, σ=20%, T=0.5): call 4.7594, put 0.8086', () => {
    // Hull, Options, Futures, and Other Derivatives, BSM worked example
    expect(bs(42, 40, 0.1, 0, 0.2, 0.5, true).price).toBeCloseTo(4.7594, 4);
    expect(bs(42, 40, 0.1, 0, 0.2, 0.5, false).price).toBeCloseTo(0.8086, 4);
  });

  it('matches Haug’s call delta 0.5946 (S=105, K=100, r=q=10%, σ=36%, T=0.5)', () => {
    // Haug 1998, via QuantLib europeanoption.cpp
    expect(bs(105, 100, 0.1, 0.1, 0.36, 0.5, true).delta).toBeCloseTo(0.5946, 4);
  });

  it('matches Haug’s gamma 0.0278 and vega 18.9358 (S=55, K=60, r=10%, σ=30%, T=0.75)', () => {
    // Haug 1998, via QuantLib europeanoption.cpp
    const g = bs(55, 60, 0.1, 0, 0.3, 0.75, true);
    expect(g.gamma).toBeCloseTo(0.0278, 4);
    expect(g.vega).toBeCloseTo(18.9358, 4);
  });

  it('matches Fang & Oosterlee Table 2 calls (S=100, r=10%, T=0.1, σ=25%)', () => {
    // Fang & Oosterlee 2008, Table 2: K=80/100/120
    const expected: [number, number][] = [
      [80, 20.799226309],
      [100, 3.659968453],
      [120, 0.044577814],
    ];
    for (const [K, v] of expected)
      expect(bs(100, K, 0.1, 0, 0.25, 0.1, true).price).toBeCloseTo(v, 8);
  });

  it('matches the Let’s Be Rational reference values for Black and normalised Black', () => {
    // Jäckel, "Let's Be Rational" reference implementation tests
    const undiscounted = blackPrice({
      forward: 100,
      strike: 100,
      sigma: 0.2,
      expiry: 0.5,
      discount: 1,
      isCall: true,
    });
    expect(Math.abs(undiscounted - 5.637197779701664)).toBeLessThan(1e-13);
    const x = Math.log(100 / 95);
    const s = 0.3 * Math.sqrt(0.5);
    expect(Math.abs(normalisedBlack(x, s, -1) / 0.061296663817558904 - 1)).toBeLessThan(1e-14);
    expect(Math.abs(normalisedBlack(x, s, 1) / 0.11259558142181655 - 1)).toBeLessThan(1e-14);
    expect(Math.abs(normalisedBlack(10, 0.25, 1) / 148.4064211555775 - 1)).toBeLessThan(1e-14);
    expect(Math.abs(normalisedBlack(-1, 0.25, 1) / 1.7736606889378084e-6 - 1)).toBeLessThan(1e-12);
  });
});

describe('normalised Black at extreme total vol', () => {
  it('tends to its bound e^{x/2} as σ√T grows, where φ at the centre underflows (common practice: a call is worth at most the forward)', () => {
    for (const x of [-0.3, -2]) {
      for (const s of [80, 200]) {
        const b = normalisedBlack(x, s, 1);
        // b = e^{x/2}Φ(x/s + s/2) − e^{−x/2}Φ(x/s − s/2), both Φ within 1e-300 of 1 and 0
        expect(Math.abs(b / Math.exp(0.5 * x) - 1), `x=${x} s=${s}`).toBeLessThan(1e-15);
      }
    }
  });
});

describe('normal distribution', () => {
  it('is symmetric and its inverse round-trips to a few ulps from 1e-300 to 1 − 1e-12', () => {
    for (const x of [-37, -20, -8, -3, -1, -0.1, 0, 0.4, 2, 6]) {
      expect(Math.abs(normCdf(x) + normCdf(-x) - 1)).toBeLessThan(2e-16);
    }
    for (const p of [1e-300, 1e-100, 1e-20, 1e-8, 0.001, 0.3, 0.5, 0.77, 0.999, 1 - 1e-12]) {
      const x = normInv(p);
      if (p < 0.5)
        expect(Math.abs(normCdf(x) / p - 1)).toBeLessThan(
          p < 1e-200 ? 1e-12 : p < 1e-10 ? 1e-13 : 1e-14,
        );
      else expect(Math.abs(1 - normCdf(-x) - p)).toBeLessThan(2e-16);
    }
  });
});

describe('implied volatility', () => {
  it('recovers Hull’s example σ = 0.2345 from c = 1.875 (S=21, K=20, r=10%, T=0.25)', () => {
    // Hull, implied-volatility example: 0.235 (0.234513)
    const r = impliedVol({
      price: 1.875,
      forward: 21 * Math.exp(0.025),
      strike: 20,
      expiry: 0.25,
      discount: Math.exp(-0.025),
      isCall: true,
    });
    expect(r.vol).toBeCloseTo(0.234513, 5);
  });

  it('recovers σ = 0.232323232 from the Let’s Be Rational price 6.54635543387 (F=K=100, T=0.5)', () => {
    // Jäckel, "Let's Be Rational" reference tests
    const r = impliedVol({
      price: 6.54635543387,
      forward: 100,
      strike: 100,
      expiry: 0.5,
      discount: 1,
      isCall: true,
    });
    expect(r.vol!).toBeCloseTo(0.232323232, 9);
  });

  it('round-trips out-of-the-money prices to 1e-11 relative for |ln K/F| up to 6σ√T and T from 1 day to 10 years', () => {
    let worst = 0;
    let count = 0;
    for (const T of [1 / 365, 7 / 365, 0.25, 1, 10]) {
      for (const sigma of [0.01, 0.05, 0.2, 0.8, 2]) {
        for (let z = -6; z <= 6; z += 0.25) {
          const K = 100 * Math.exp(z * sigma * Math.sqrt(T));
          const isCall = K >= 100;
          const price = blackPrice({
            forward: 100,
            strike: K,
            sigma,
            expiry: T,
            discount: 0.95,
            isCall,
          });
          if (price < 1e-200) continue;
          const r = impliedVol({
            price,
            forward: 100,
            strike: K,
            expiry: T,
            discount: 0.95,
            isCall,
          });
          expect(r.vol).not.toBeNull();
          worst = Math.max(worst, Math.abs(r.vol! / sigma - 1));
          count++;
        }
      }
    }
    expect(count).toBeGreaterThan(1000);
    expect(worst).toBeLessThan(1e-11);
  });

  it('returns null below intrinsic and at or above the upper bound', () => {
    const base = { forward: 100, strike: 90, expiry: 1, discount: 1, isCall: true };
    expect(impliedVol({ ...base, price: 9.5 })).toEqual({ vol: null, failure: 'below-intrinsic' });
    expect(impliedVol({ ...base, price: 100 })).toEqual({ vol: null, failure: 'above-maximum' });
    expect(impliedVol({ ...base, price: Number.NaN }).vol).toBeNull();
  });
});

describe('10-delta and 25-delta strikes', () => {
  it("under Black-Scholes they invert Hull's forward delta N(d1): K = F·exp(−σ√T·N⁻¹(Δ) + σ²T/2), and the flat smile has no risk reversal or butterfly", () => {
    const market = { spot: 100, rate: 0.03, dividendYield: 0.01 };
    for (const T of [1 / 365, 0.5]) {
      const sigma = 0.25;
      const s = smileSlice(modelSpec({ kind: 'black-scholes', sigma }), market, T, [-0.1, 0, 0.1]);
      const strike = (delta: number) =>
        s.forward * Math.exp(-sigma * Math.sqrt(T) * normInv(delta) + 0.5 * sigma * sigma * T);
      expect(s.strike10Call! / strike(0.1) - 1).toBeCloseTo(0, 9);
      expect(s.strike10Put! / strike(0.9) - 1).toBeCloseTo(0, 9);
      expect(s.strike25Call! / strike(0.25) - 1).toBeCloseTo(0, 9);
      expect(Math.abs(s.rr10!)).toBeLessThan(1e-9);
      expect(Math.abs(s.bf10!)).toBeLessThan(1e-9);
    }
  });
});
