import { describe, expect, it } from 'vitest';
import { smileSurface } from '../../src/engine/analytic';
import type { Model } from '../../src/engine/core';

// Facts of the trade (common practice): how the Bates jump parameters shape the smile.
// Measured at fixed moneyness: skew = σ(0.9F) − σ(1.1F), curvature = (σ(0.9F) + σ(1.1F))/2 − σ(F).
const base: Model = {
  kind: 'bates',
  v0: 0.04,
  theta: 0.04,
  kappa: 2,
  volOfVol: 0.4,
  rho: -0.6,
  jumpIntensity: 0.5,
  jumpMean: -0.05,
  jumpStdev: 0.1,
};
const EXPIRIES = [7 / 365, 14 / 365, 30 / 365, 91 / 365, 1, 5];
const K = [Math.log(0.9), 0, Math.log(1.1)];

function shape(model: Model) {
  return smileSurface({ spot: 100 }, model, EXPIRIES, K).slices.map((s) => {
    const [lo, atm, hi] = s.impliedVols as number[];
    return { level: atm, skew: lo - hi, curvature: (lo + hi) / 2 - atm, rr25: s.rr25 as number };
  });
}

// Each shock doubles the jumps' annual variance λ(μJ² + σJ²), so the three are comparable.
const deeperMean = { ...base, jumpMean: -0.1225 } as Model;
const moreJumps = { ...base, jumpIntensity: 1 } as Model;
const widerJumps = { ...base, jumpStdev: 0.15 } as Model;

describe('what the jump parameters do to the smile (common practice)', () => {
  const b = shape(base);
  const mean = shape(deeperMean);
  const intensity = shape(moreJumps);
  const spread = shape(widerJumps);

  it('a deeper mean jump steepens the 1-week skew far more than more or wider jumps do', () => {
    const dMean = mean[0].skew - b[0].skew;
    const dIntensity = intensity[0].skew - b[0].skew;
    const dSpread = spread[0].skew - b[0].skew;
    expect(dMean).toBeGreaterThan(0.02); // two vol points and more
    expect(dMean).toBeGreaterThan(4 * Math.max(Math.abs(dIntensity), Math.abs(dSpread)));
  });

  it('more or wider jumps mostly lift the level and the curvature of the short end', () => {
    for (const shocked of [intensity, spread]) {
      const dCurv = shocked[0].curvature - b[0].curvature;
      expect(shocked[0].level).toBeGreaterThan(b[0].level);
      expect(dCurv).toBeGreaterThan(Math.abs(shocked[0].skew - b[0].skew));
    }
  });

  it('the jump part of the skew is largest at the shortest expiry and fades until Bates looks like Heston', () => {
    const heston = shape({
      kind: 'heston',
      v0: 0.04,
      theta: 0.04,
      kappa: 2,
      volOfVol: 0.4,
      rho: -0.6,
    });
    const jumpSkew = b.map((x, i) => x.skew - heston[i].skew);
    for (let i = 1; i < 4; i++) expect(jumpSkew[i]).toBeLessThan(jumpSkew[i - 1]);
    const last = EXPIRIES.length - 1;
    expect(Math.abs(jumpSkew[last])).toBeLessThan(0.2 * jumpSkew[0]);
    expect(Math.abs(b[last].curvature - heston[last].curvature)).toBeLessThan(0.001);
  });

  it('the 25-delta risk reversal falls at every expiry when the mean jump deepens', () => {
    mean.forEach((m, i) => expect(m.rr25).toBeLessThan(b[i].rr25));
  });
});
