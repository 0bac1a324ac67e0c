import { describe, expect, it } from 'vitest';
import { normPdf } from '../../src/engine/analytic';
import { revalueSet, type Position } from '../../src/engine/book';
import { applyStress, expectedVarianceJump, type Model } from '../../src/engine/core';
import { calibrate, jumpsVerdict, modelVols, type VolQuote } from '../../src/engine/fit';

const market = { spot: 100, rate: 0.02, dividendYield: 0 };
const svcj = (varianceJumpMean: number, jumpCorrelation = 0): Model => ({
  kind: 'svcj',
  v0: 0.03,
  kappa: 2,
  theta: 0.035,
  volOfVol: 0.5,
  rho: -0.7,
  jumpIntensity: 0.5,
  jumpMean: -0.08,
  jumpStdev: 0.05,
  varianceJumpMean,
  jumpCorrelation,
});

describe('E[Z_V | Z_S = y] under the SVCJ jump law', () => {
  it('matches a direct integration over the joint density (Bayes’ rule)', () => {
    const j = { jumpMean: -0.05, jumpStdev: 0.04, varianceJumpMean: 0.06, jumpCorrelation: -0.7 };
    for (const y of [-0.25, -0.1, -0.05, 0, 0.05]) {
      let num = 0;
      let den = 0;
      const dz = 1e-5;
      for (let z = dz / 2; z < 2; z += dz) {
        const w =
          (Math.exp(-z / j.varianceJumpMean) / j.varianceJumpMean) *
          normPdf((y - j.jumpMean - j.jumpCorrelation * z) / j.jumpStdev);
        num += z * w;
        den += w;
      }
      expect(Math.abs(expectedVarianceJump(j, y) - num / den), `y=${y}`).toBeLessThan(1e-7);
    }
  });

  it('is μV when the price and variance jumps are independent (ρJ = 0), 0 without a variance jump', () => {
    expect(
      expectedVarianceJump(
        { jumpMean: -0.1, jumpStdev: 0.1, varianceJumpMean: 0.05, jumpCorrelation: 0 },
        -0.2,
      ),
    ).toBe(0.05);
    expect(
      expectedVarianceJump(
        { jumpMean: -0.1, jumpStdev: 0.1, varianceJumpMean: 0, jumpCorrelation: -1 },
        -0.2,
      ),
    ).toBe(0);
  });

  it('under a spot-gap stress, lifts the initial variance by what a jump of that size brings', () => {
    const m = svcj(0.05, -0.8);
    const s = applyStress(market, m, { spotShift: -0.1 });
    const expected = 0.03 + expectedVarianceJump(m as never, Math.log(0.9));
    expect((s.model as { v0: number }).v0).toBeCloseTo(expected, 15);
    expect(expected).toBeGreaterThan(0.03);
  });
});

describe('the gap ladder when vol reacts', () => {
  const shortPuts: Position[] = [
    { id: 'p1', type: 'put', strike: 95, expiry: 30 / 365, quantity: -100 },
    { id: 'p2', type: 'put', strike: 90, expiry: 60 / 365, quantity: -100 },
  ];
  const ladder = { from: -0.2, to: 0, steps: 5 }; // −20, −15, −10, −5, 0 %
  const lossAt10 = (model: Model) => {
    const r = revalueSet({ id: 'b', name: 'b', market, model }, [], shortPuts, ladder);
    return -r.baseLadder[2];
  };

  it('loses more at −10 % under SVCJ than under Bates with the same price-jump law, and more as μV grows (common practice: vol jumps with a gap)', () => {
    // ρJ = 0: the price jump is N(μS, σS²) in both models; SVCJ adds only the variance jump
    const bates = svcj(0);
    const losses = [0.02, 0.05, 0.1].map((muV) => lossAt10(svcj(muV)));
    expect(losses[0]).toBeGreaterThan(lossAt10(bates));
    expect(losses[1]).toBeGreaterThan(losses[0]);
    expect(losses[2]).toBeGreaterThan(losses[1]);
  });

  it('draws three rules that tell different stories: the vol-reaction line lies below sticky strike for a short-put book', () => {
    const r = revalueSet(
      { id: 'b', name: 'b', market, model: svcj(0.05) },
      [],
      shortPuts,
      ladder,
      0.5,
    );
    // at −10 %: sticky strike, then + 5 vol points, then the model's variance jump
    expect(r.volReactionLadder[2]).toBeLessThan(r.stickyStrikeLadder[2]);
    expect(r.baseLadder[2]).toBeLessThan(r.stickyMoneynessLadder[2]);
    const none = revalueSet(
      { id: 'b', name: 'b', market, model: svcj(0.05) },
      [],
      shortPuts,
      ladder,
      0,
    );
    expect(none.volReactionLadder).toEqual(none.stickyStrikeLadder);
  });
});

describe('fitting SVCJ', () => {
  const truth = svcj(0.05, -0.5);
  const quotes: VolQuote[] = [];
  for (const d of [7, 14, 30, 61, 91, 182, 365])
    for (let i = 0; i < 11; i++)
      quotes.push({
        expiry: d / 365,
        strike: 100 * Math.exp(0.2 * Math.sqrt(d / 365) * (-2.5 + i / 2)),
        impliedVol: 0,
      });
  modelVols(market, truth, quotes).forEach((v, i) => (quotes[i].impliedVol = v!));

  it('recovers the model with μV and ρJ held at their true values, and reports a standard error for each free parameter', () => {
    const r = calibrate({
      market,
      model: { ...truth, v0: 0.05, kappa: 1, jumpIntensity: 0.3 } as Model,
      fixed: ['varianceJumpMean', 'jumpCorrelation'],
      quotes,
    });
    expect(r.rmseVolPoints).toBeLessThan(0.01);
    expect(r.errors.names).toEqual([
      'v0',
      'kappa',
      'theta',
      'volOfVol',
      'rho',
      'jumpIntensity',
      'jumpMean',
      'jumpStdev',
    ]);
    for (const se of r.errors.standardErrors) expect(se).not.toBeNull();
  });

  it('the comparison fits Heston, Bates and SVCJ, with AIC and BIC for each', () => {
    const v = jumpsVerdict({
      market,
      quotes,
      hestonGuess: { kind: 'heston', v0: 0.03, kappa: 2, theta: 0.035, volOfVol: 0.5, rho: -0.7 },
      refine: 1,
      screen: 8,
    });
    expect(v.svcj.model.kind).toBe('svcj');
    expect(v.bic.svcj).toBeLessThan(v.bic.heston);
    expect(v.buckets[0].svcj).not.toBeNull();
  });
});
