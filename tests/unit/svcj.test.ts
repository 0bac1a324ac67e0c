import { describe, expect, it } from 'vitest';
import {
  gaussLegendre,
  logCharacteristicAt,
  modelSpec,
  priceOptions,
} from '../../src/engine/analytic';
import { validateModel, type Model, type OptionSpec } from '../../src/engine/core';
import {
  blockCount,
  combineBlocks,
  simulate,
  simulateBlock,
  type SimulationSettings,
} from '../../src/engine/paths';
import { cosPrice, lewisPrice, market } from './helpers';

const svcj = (over: Partial<Record<string, number>> = {}): Model =>
  ({
    kind: 'svcj',
    v0: 0.03,
    kappa: 2,
    theta: 0.035,
    volOfVol: 0.6,
    rho: -0.7,
    jumpIntensity: 0.6,
    jumpMean: -0.05,
    jumpStdev: 0.06,
    varianceJumpMean: 0.05,
    jumpCorrelation: -0.8,
    ...over,
  }) as Model;

/** The Bates model with the same price-jump law (Z_S ~ N(μS, σS²), no variance jump). */
const batesOf = (m: Model): Model => {
  const rest: Record<string, unknown> = { ...m, kind: 'bates' };
  delete rest.varianceJumpMean;
  delete rest.jumpCorrelation;
  return rest as Model;
};

describe('SVCJ reduces to Bates without a variance jump', () => {
  it('prices exactly as Bates when μV = 0, for the Bates references (computed reference and the Merton limit)', () => {
    // the Fang & Oosterlee Heston set + λ=0.5, μJ=−0.1, σJ=0.15 (computed reference 7.558073816048)
    const fo = svcj({
      kappa: 1.5768,
      theta: 0.0398,
      volOfVol: 0.5751,
      rho: -0.5711,
      v0: 0.0175,
      jumpIntensity: 0.5,
      jumpMean: -0.1,
      jumpStdev: 0.15,
      varianceJumpMean: 0,
    });
    expect(Math.abs(cosPrice(market(100), fo, 'call', 100, 1) - 7.558073816048)).toBeLessThan(1e-9);
    expect(cosPrice(market(100), fo, 'call', 100, 1)).toBe(
      cosPrice(market(100), batesOf(fo), 'call', 100, 1),
    );
    // Bates with ξ → 0 and v0 = θ is Merton: 9.164898622 (series; computed reference)
    const merton = svcj({
      v0: 0.04,
      theta: 0.04,
      kappa: 1,
      volOfVol: 1e-4,
      rho: 0,
      jumpIntensity: 0.5,
      jumpMean: -0.1,
      jumpStdev: 0.15,
      varianceJumpMean: 0,
    });
    expect(Math.abs(cosPrice(market(100), merton, 'call', 100, 1) - 9.164898622)).toBeLessThan(
      1e-7,
    );
  });

  it('through its own kernel, a vanishing variance jump (μV = 1e-12) prices as Bates within 1e-12 × spot', () => {
    const m = market(100, 0.02, 0.01);
    const tiny = svcj({ varianceJumpMean: 1e-12 });
    for (const T of [1 / 365, 30 / 365, 1, 5])
      for (const K of [80, 100, 120]) {
        const diff = cosPrice(m, tiny, 'put', K, T) - cosPrice(m, batesOf(tiny), 'put', K, T);
        expect(Math.abs(diff), `T=${T} K=${K}`).toBeLessThan(1e-12 * 100);
      }
  });
});

describe('the closed-form jump term (Duffie, Pan & Singleton 2000)', () => {
  /** λ∫₀ᵀ (E[e^{wZ_S + D(τ)Z_V}] − 1) dτ − wλmT by Gauss-Legendre panels, doubled until settled. */
  function quadrature(model: Record<string, number>, T: number, wr: number, wi: number) {
    const { jumpIntensity: lam, jumpMean: muS, jumpStdev: sS } = model;
    const { varianceJumpMean: muV, jumpCorrelation: rhoJ } = model;
    const varianceOnly = modelSpec({ ...model, kind: 'heston', v0: 1, theta: 0 } as Model);
    const integrand = (tau: number): [number, number] => {
      const [dr, di] = logCharacteristicAt(varianceOnly, tau, wr, wi);
      // θ0 = e^{wμS + ½w²σS²}; denominator 1 − (D + wρJ)μV
      const er = muS * wr + 0.5 * sS * sS * (wr * wr - wi * wi);
      const ei = muS * wi + sS * sS * wr * wi;
      const nr = Math.exp(er) * Math.cos(ei);
      const ni = Math.exp(er) * Math.sin(ei);
      const denr = 1 - (dr + wr * rhoJ) * muV;
      const deni = -(di + wi * rhoJ) * muV;
      const dm = denr * denr + deni * deni;
      return [(nr * denr + ni * deni) / dm - 1, (ni * denr - nr * deni) / dm];
    };
    const rule = gaussLegendre(20);
    const integrate = (panels: number): [number, number] => {
      let sr = 0;
      let si = 0;
      const h = T / panels;
      for (let p = 0; p < panels; p++)
        for (let i = 0; i < rule.x.length; i++) {
          const [fr, fi] = integrand(h * (p + 0.5 * (rule.x[i] + 1)));
          sr += 0.5 * h * rule.w[i] * fr;
          si += 0.5 * h * rule.w[i] * fi;
        }
      return [sr, si];
    };
    let panels = 4;
    let prev = integrate(panels);
    for (let it = 0; it < 10; it++) {
      panels *= 2;
      const next = integrate(panels);
      const done = Math.hypot(next[0] - prev[0], next[1] - prev[1]) < 1e-15;
      prev = next;
      if (done) break;
    }
    const kbar = Math.exp(muS + 0.5 * sS * sS) / (1 - rhoJ * muV) - 1;
    return [lam * prev[0] - wr * lam * kbar * T, lam * prev[1] - wi * lam * kbar * T];
  }

  it('agrees with a quadrature of the integral within 1e-12, on the COS line (w = iu) and the Lewis line (w = ½ + iu)', () => {
    const cases = [
      svcj(),
      svcj({ volOfVol: 1.5, rho: -0.9, varianceJumpMean: 0.1, jumpCorrelation: -1 }),
      svcj({ volOfVol: 0.3, kappa: 0.5, varianceJumpMean: 0.02, jumpCorrelation: 0.5 }),
    ];
    for (const model of cases) {
      const spec = modelSpec(model);
      const heston = modelSpec({ ...model, kind: 'heston' } as Model);
      for (const T of [1 / 365, 0.25, 2])
        for (const wr of [0, 0.5])
          for (const u of [0.3, 4, 40, 300]) {
            const [fr, fi] = logCharacteristicAt(spec, T, wr, u);
            const [hr, hi] = logCharacteristicAt(heston, T, wr, u);
            const [qr, qi] = quadrature(model as never, T, wr, u);
            expect(Math.abs(fr - hr - qr), `T=${T} w=${wr}+${u}i re`).toBeLessThan(1e-12);
            expect(Math.abs(fi - hi - qi), `T=${T} w=${wr}+${u}i im`).toBeLessThan(1e-12);
          }
    }
  });
});

describe('SVCJ prices against the Lewis (2001) validation pricer', () => {
  it('agree within 1e-9 × spot from 1 day to 5 years, ξ up to 1.5, ρJ from −1 to 0.5', () => {
    const m = market(100, 0.03, 0.01);
    const cases = [
      svcj({ volOfVol: 1.5, rho: -0.8, jumpCorrelation: -1, varianceJumpMean: 0.08 }),
      svcj({ volOfVol: 0.4, jumpCorrelation: 0.5, varianceJumpMean: 0.03, jumpIntensity: 1.5 }),
      svcj({ volOfVol: 0.9, jumpCorrelation: 0, varianceJumpMean: 0.05, rho: -0.3 }),
    ];
    for (const model of cases)
      for (const T of [1 / 365, 7 / 365, 0.25, 1, 5])
        for (const K of [80, 95, 100, 105, 125])
          for (const type of ['call', 'put'] as const) {
            const diff = cosPrice(m, model, type, K, T) - lewisPrice(m, model, type, K, T);
            expect(Math.abs(diff), `T=${T} K=${K} ${type}`).toBeLessThan(1e-9 * 100);
          }
  });

  it('a variance jump lifts the short-expiry smile above Bates with the same price jumps', () => {
    const m = market(100);
    const withJump = cosPrice(m, svcj({ jumpCorrelation: 0 }), 'put', 90, 0.25);
    const bates = cosPrice(m, batesOf(svcj({ jumpCorrelation: 0 })), 'put', 90, 0.25);
    expect(withJump).toBeGreaterThan(bates);
  });
});

describe('validation of SVCJ', () => {
  it('refuses ρJ·μV ≥ 1 with the field path', () => {
    expect(validateModel(svcj({ jumpCorrelation: 2, varianceJumpMean: 0.6 }))).toEqual([
      { path: 'jumpCorrelation', message: 'jump correlation × mean variance jump must be below 1' },
    ]);
    expect(validateModel(svcj({ varianceJumpMean: -0.1 }))[0].path).toBe('varianceJumpMean');
  });
});

describe('SVCJ Monte Carlo: exact jumps in price and variance, Andersen QE between them', () => {
  const settings = (horizon: number, options: OptionSpec[]): SimulationSettings => ({
    horizon,
    stepsPerYear: 96,
    paths: 65536,
    seed: 16,
    antithetic: true,
    scheme: 'qe',
    options,
  });
  const m = { spot: 100, rate: 0.02, dividendYield: 0.01 };

  it('agrees with COS within 3 standard errors on three cases', () => {
    const cases: [Model, number][] = [
      [svcj(), 0.5],
      [svcj({ varianceJumpMean: 0.1, jumpCorrelation: -1, jumpIntensity: 1 }), 1],
      [svcj({ volOfVol: 0.3, jumpCorrelation: 0.5, varianceJumpMean: 0.03 }), 0.25],
    ];
    for (const [model, T] of cases) {
      const options: OptionSpec[] = [
        { type: 'put', strike: 85, expiry: T },
        { type: 'put', strike: 100, expiry: T },
        { type: 'call', strike: 110, expiry: T },
      ];
      const r = simulate(m, model, settings(T, options));
      const exact = priceOptions(m, model, options);
      r.estimates.forEach((e, i) =>
        expect(Math.abs(e.price - exact[i].price), `T=${T} option ${i}`).toBeLessThan(
          3 * e.stdError,
        ),
      );
    }
  });

  it('gives bit-identical numbers however the blocks are shared out (1, 2 or 3 workers)', () => {
    const s = { ...settings(0.25, [{ type: 'put', strike: 90, expiry: 0.25 }]), paths: 8000 };
    const model = svcj({ varianceJumpMean: 0.1 });
    const whole = simulate(m, model, s);
    for (const workers of [1, 2, 3]) {
      const blocks = new Array(blockCount(s));
      for (let w = workers - 1; w >= 0; w--)
        for (let b = w; b < blockCount(s); b += workers) blocks[b] = simulateBlock(m, model, s, b);
      const combined = combineBlocks(m, s, blocks, 0);
      expect(combined.estimates).toEqual(whole.estimates);
      expect(combined.terminalVariance).toEqual(whole.terminalVariance);
    }
  });

  it('has the affine mean variance E[v_T] = θ + (v0 − θ)e^{−κT} + (λμV/κ)(1 − e^{−κT}) within 3 standard errors', () => {
    // dE[v]/dt = κ(θ − E[v]) + λμV: a linear ODE whose solution is the mean above, i.e. the
    // Heston mean with θ replaced by θ + λμV/κ (the variance jumps add λμV per unit time)
    const model = svcj({ varianceJumpMean: 0.08, jumpIntensity: 1.2 });
    const {
      v0,
      kappa,
      theta,
      jumpIntensity: lam,
      varianceJumpMean: muV,
    } = model as never as Record<string, number>;
    for (const T of [0.25, 1]) {
      const r = simulate(m, model, { ...settings(T, []), paths: 32768 });
      const decay = Math.exp(-kappa * T);
      const mean = theta + (v0 - theta) * decay + ((lam * muV) / kappa) * (1 - decay);
      expect(Math.abs(r.terminalVariance.mean - mean)).toBeLessThan(
        3 * r.terminalVariance.stdError,
      );
    }
  });
});
