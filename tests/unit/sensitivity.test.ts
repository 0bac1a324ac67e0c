import { describe, expect, it } from 'vitest';
import { smileSensitivities } from '../../src/engine/analytic';

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
