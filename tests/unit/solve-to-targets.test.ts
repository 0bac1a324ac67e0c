import { describe, expect, it } from 'vitest';
import { modelVols, solveToTargets, type TargetVol } from '../../src/engine/fit';
import { forwardPrice, applyStress, type Market, type Model } from '../../src/engine/core';

const market: Market = { spot: 100, rate: 0.03, dividendYield: 0.01 };
const base: Model = {
  kind: 'bates',
  v0: 0.04,
  kappa: 1.5,
  theta: 0.04,
  volOfVol: 0.5,
  rho: -0.7,
  jumpIntensity: 0.5,
  jumpMean: -0.1,
  jumpStdev: 0.15,
};

describe('fit to a sketch', () => {
  it('finds the stress that produced a set of short-dated target vols', () => {
    const hidden = { jumpIntensityScale: 2, jumpMeanShift: -0.05, jumpStdevScale: 0.8 };
    const truth = applyStress(market, base, hidden).model;
    const targets: TargetVol[] = [];
    for (const expiry of [7 / 365, 30 / 365, 91 / 365])
      for (const k of [-0.2, -0.1, -0.05, 0, 0.05])
        targets.push({ expiry, logMoneyness: k * Math.sqrt(expiry / 0.25), impliedVol: 0 });
    const vols = modelVols(
      market,
      truth,
      targets.map((t) => ({
        expiry: t.expiry,
        strike: forwardPrice(market, t.expiry) * Math.exp(t.logMoneyness),
        impliedVol: 0,
      })),
    );
    targets.forEach((t, i) => (t.impliedVol = vols[i]!));
    const s = solveToTargets(market, base, {}, targets, {});
    expect(s.fit.rmseVolPoints).toBeLessThan(0.01);
    expect(s.stress.jumpIntensityScale).toBeCloseTo(2, 1);
    expect(s.stress.jumpMeanShift).toBeCloseTo(-0.05, 2);
    expect(s.stress.jumpStdevScale).toBeCloseTo(0.8, 1);
    expect(s.model).toEqual(base); // only the stress moved
  });

  it('refuses a model without jumps', () => {
    expect(() =>
      solveToTargets(
        market,
        { kind: 'heston', v0: 0.04, kappa: 1.5, theta: 0.04, volOfVol: 0.5, rho: -0.7 },
        {},
        [{ expiry: 0.1, logMoneyness: 0, impliedVol: 0.2 }],
        {},
      ),
    ).toThrow(/model with jumps/);
  });
});
