/**
 * Calendar theta from one COS strip (the coefficients' time slopes) against the central
 * difference the engine used before: V at T + h with the dated risk moved with the valuation,
 * minus V at T − h, over 2h (a central difference in calendar time is common practice; its
 * error is O(h²)). Every model kind, scheduled moves, an intensity schedule and zero curves.
 */
import { describe, expect, it } from 'vitest';
import { modelSpec, priceOptions, priceStrip } from '../../src/engine/analytic';
import { specFrom } from '../../src/engine/core/model-spec';
import type { Market, Model, OptionSpec } from '../../src/engine/core';
import { CASE_HESTON, MODEL_CASES } from './helpers';

const SVCJ = {
  kind: 'svcj',
  ...CASE_HESTON,
  jumpIntensity: 0.6,
  jumpMean: -0.05,
  jumpStdev: 0.06,
  varianceJumpMean: 0.05,
  jumpCorrelation: -0.8,
} as Model;
const MODELS: Record<string, Model> = {
  'black-scholes': { kind: 'black-scholes', sigma: 0.22 },
  ...MODEL_CASES,
  svcj: SVCJ,
  'bates with scheduled moves and an intensity schedule': {
    ...MODEL_CASES.bates,
    events: [
      { time: 10 / 365, law: 'normal', stdev: 0.04 },
      { time: 40 / 365, law: 'two-point', up: 0.05, down: -0.08, upProbability: 0.6 },
    ],
    jumpIntensitySchedule: [
      [15 / 365, 3],
      [0.25, 1.2],
    ],
  },
  'svcj with an intensity schedule': {
    ...SVCJ,
    jumpIntensitySchedule: [[0.1, 2.5]],
  },
} as Record<string, Model>;

const FLAT: Market = { spot: 100, rate: 0.03, dividendYield: 0.01 };
const CURVES: Market = {
  spot: 100,
  rateCurve: [
    [0.1, 0.02],
    [0.5, 0.035],
    [2, 0.04],
  ],
  dividendCurve: [
    [0.25, 0.01],
    [1, 0.015],
  ],
};

/** Today's central difference in calendar time, from one-strike strips. */
function centralTheta(market: Market, model: Model, o: OptionSpec): number {
  const spec = modelSpec(model);
  const h = Math.min(1e-3 * o.expiry, 1 / 365);
  const value = (dt: number) => {
    const v = priceStrip(specFrom(spec, -dt), market, o.expiry + dt, [0]);
    const k = Math.log(o.strike / v.forward);
    const strip = priceStrip(specFrom(spec, -dt), market, o.expiry + dt, [k]);
    return strip.discount * strip.forward * (o.type === 'call' ? strip.call[0] : strip.put[0]);
  };
  return -(value(h) - value(-h)) / (2 * h);
}

describe('one-pass theta', () => {
  // off the curves' nodes, where r(t)·t has a kink and the difference an O(h) error
  const expiries = [1 / 365, 7 / 365, 30 / 365, 0.45, 1.7];
  for (const [name, model] of Object.entries(MODELS)) {
    for (const [marketName, market] of [
      ['flat rates', FLAT],
      ['zero curves', CURVES],
    ] as const) {
      it(`${name}, ${marketName}: matches the central difference`, () => {
        const options: OptionSpec[] = expiries.flatMap((T) =>
          [0.8, 0.95, 1, 1.05, 1.25].flatMap((m) => [
            { type: 'call' as const, strike: 100 * m, expiry: T },
            { type: 'put' as const, strike: 100 * m, expiry: T },
          ]),
        );
        const priced = priceOptions(market, model, options);
        options.forEach((o, i) => {
          const reference = centralTheta(market, model, o);
          // the difference's O(h²) error and the strips' rounding over 2h: 1e-6 of spot
          // (measured: at most 6e-6 in price units per year, spot 100)
          expect(Math.abs(priced[i].theta - reference)).toBeLessThan(1e-6 * 100);
        });
      });
    }
  }
});
