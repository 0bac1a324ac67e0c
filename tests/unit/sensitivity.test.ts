import { describe, expect, it } from 'vitest';
import { modelSpec, naturalStep, smileSensitivities, smileSlice } from '../../src/engine/analytic';
import type { Model } from '../../src/engine/core';

describe('smile sensitivities to model parameters', () => {
  it('under Black-Scholes, every point of the smile moves one for one with σ (closed form: ∂σ_impl/∂σ = 1)', () => {
    const [s] = smileSensitivities(
      { spot: 100, rate: 0.02 },
      { kind: 'black-scholes', sigma: 0.25 },
      0.5,
      [-0.2, 0, 0.2],
    );
    expect(s.parameter).toBe('sigma');
    for (const d of s.dVol) expect(d!).toBeCloseTo(1, 6);
  });

  it('under Bates, more frequent jumps lift the short-dated put wing more than the ATM vol (common practice)', () => {
    const model = {
      kind: 'bates' as const,
      v0: 0.04,
      kappa: 2,
      theta: 0.04,
      volOfVol: 0.4,
      rho: -0.6,
      jumpIntensity: 0.5,
      jumpMean: -0.1,
      jumpStdev: 0.1,
    };
    const s = smileSensitivities({ spot: 100 }, model, 14 / 365, [-0.15, 0]);
    const lambda = s.find((x) => x.parameter === 'jumpIntensity')!;
    expect(lambda.dVol[0]!).toBeGreaterThan(lambda.dVol[1]!);
    expect(lambda.dVol[1]!).toBeGreaterThan(0);
    expect(s.map((x) => x.parameter).sort()).toEqual(
      ['jumpIntensity', 'jumpMean', 'jumpStdev', 'kappa', 'rho', 'theta', 'v0', 'volOfVol'].sort(),
    );
  });
});

describe('sensitivities in natural steps', () => {
  it('one vol point of √v₀ moves the Heston ATM vol by what repricing at √v₀ + 0.01 gives, within 3 % (first order)', () => {
    const heston: Model = {
      kind: 'heston',
      v0: 0.04,
      kappa: 1.5,
      theta: 0.04,
      volOfVol: 0.5,
      rho: -0.7,
    };
    const market = { spot: 100, rate: 0.02, dividendYield: 0 };
    const [s] = smileSensitivities(market, heston, 0.25, [0]).filter((x) => x.parameter === 'v0');
    const { step, label } = naturalStep('v0', 0.04);
    expect(label).toBe('+1 vol pt of √v₀');
    expect(step).toBeCloseTo(0.21 ** 2 - 0.04, 15);
    const atm = (v0: number) =>
      smileSlice(modelSpec({ ...heston, v0 } as Model), market, 0.25, [0]).impliedVols[0]!;
    const repriced = atm(0.21 ** 2) - atm(0.04);
    expect(Math.abs((s.dVol[0]! * step) / repriced - 1)).toBeLessThan(0.03);
    expect(naturalStep('jumpMean', -0.1).step).toBe(-0.01);
    expect(naturalStep('jumpStdev', 0.1).step).toBe(0.01);
    expect(naturalStep('volOfVol', 0.5).step).toBe(0.1);
  });
});
