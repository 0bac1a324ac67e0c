import { describe, expect, it } from 'vitest';
import {
  blackPrice,
  impliedEventMove,
  impliedEventMoves,
  priceOptions,
  smileSurface,
} from '../../src/engine/analytic';
import {
  forwardPrice,
  discountFactor,
  integratedIntensity,
  twoPointOutcomes,
  validateModel,
  type Market,
  type Model,
  type ScheduledMove,
} from '../../src/engine/core';
import { cosPrice, lewisPrice, market } from './helpers';

const bs = (sigma: number, events?: ScheduledMove[]): Model => ({
  kind: 'black-scholes',
  sigma,
  ...(events ? { events } : {}),
});

const blackAt = (m: Market, sigma: number, K: number, T: number, isCall: boolean, F?: number) =>
  blackPrice({
    forward: F ?? forwardPrice(m, T),
    strike: K,
    sigma,
    expiry: T,
    discount: discountFactor(m, T),
    isCall,
  });

describe('a normal scheduled move on Black-Scholes (common practice: Gaussian log-moves add variance)', () => {
  const m = market(100, 0.03, 0.01);
  const s = 0.05;
  const sigma = 0.2;

  it('prices as Black-Scholes with total variance σ²T + s², for 1 day to 1 year, within 1e-10 × spot', () => {
    for (const T of [2 / 365, 7 / 365, 30 / 365, 0.25, 1]) {
      const model = bs(sigma, [{ time: T / 2, law: 'normal', stdev: s }]);
      const total = Math.sqrt(sigma * sigma + (s * s) / T);
      for (const K of [80, 95, 100, 105, 120]) {
        for (const isCall of [true, false]) {
          const got = cosPrice(m, model, isCall ? 'call' : 'put', K, T);
          expect(Math.abs(got - blackAt(m, total, K, T, isCall))).toBeLessThan(1e-10 * 100);
        }
      }
    }
  });

  it('moves the implied vol to √(σ² + s²/T)', () => {
    const T = 14 / 365;
    const model = bs(sigma, [{ time: 3 / 365, law: 'normal', stdev: s }]);
    const [r] = priceOptions(m, model, [{ type: 'call', strike: 100, expiry: T }]);
    expect(Math.abs(r.impliedVol! - Math.sqrt(sigma ** 2 + s ** 2 / T))).toBeLessThan(1e-9);
  });

  it('leaves an option expiring before, or on, the event date untouched', () => {
    const T = 10 / 365;
    for (const time of [T, T + 1 / 365, 0.5]) {
      const model = bs(sigma, [{ time, law: 'normal', stdev: s }]);
      expect(
        Math.abs(cosPrice(m, model, 'put', 97, T) - blackAt(m, sigma, 97, T, false)),
      ).toBeLessThan(1e-10 * 100);
    }
  });
});

describe('a two-point scheduled move on Black-Scholes (common practice: a mixture of two lognormals)', () => {
  const m = market(100, 0.02, 0);
  const sigma = 0.18;
  const event = { law: 'two-point', up: 0.04, down: -0.06, upProbability: 0.55 } as const;

  it('prices as the p / 1−p mixture of Black-Scholes prices at the shifted forwards, within 1e-10 × spot', () => {
    const { up, down, p } = twoPointOutcomes(event);
    for (const T of [1 / 365, 3 / 365, 30 / 365, 0.5]) {
      const model = bs(sigma, [{ ...event, time: T / 3 }]);
      const F = forwardPrice(m, T);
      for (const K of [85, 94, 100, 104, 115]) {
        for (const isCall of [true, false]) {
          const mix =
            p * blackAt(m, sigma, K, T, isCall, F * Math.exp(up)) +
            (1 - p) * blackAt(m, sigma, K, T, isCall, F * Math.exp(down));
          const got = cosPrice(m, model, isCall ? 'call' : 'put', K, T);
          expect(Math.abs(got - mix)).toBeLessThan(1e-10 * 100);
        }
      }
    }
  });

  it('is compensated: E[e^X] = 1, so the forward is unchanged (put–call parity holds at the forward)', () => {
    const { up, down, p } = twoPointOutcomes(event);
    expect(Math.abs(p * Math.exp(up) + (1 - p) * Math.exp(down) - 1)).toBeLessThan(1e-15);
  });
});

describe('a jump-intensity schedule', () => {
  const schedule: [number, number][] = [
    [7 / 365, 3],
    [21 / 365, 1.2],
  ];

  it('integrates the intensity piece by piece, with the model intensity after the last point', () => {
    const base = 0.4;
    expect(integratedIntensity(base, schedule, 3 / 365)).toBeCloseTo((3 * 3) / 365, 15);
    expect(integratedIntensity(base, schedule, 0.25)).toBeCloseTo(
      (3 * 7) / 365 + (1.2 * 14) / 365 + base * (0.25 - 21 / 365),
      15,
    );
  });

  it('prices as the constant intensity at the schedule average up to T (Bates and Heston-Kou), within 1e-10 × spot', () => {
    const m = market(100, 0.01, 0.0);
    const bates: Model = {
      kind: 'bates',
      v0: 0.03,
      kappa: 2,
      theta: 0.04,
      volOfVol: 0.6,
      rho: -0.7,
      jumpIntensity: 0.4,
      jumpMean: -0.08,
      jumpStdev: 0.1,
    };
    const kou: Model = {
      kind: 'heston-kou',
      v0: 0.03,
      kappa: 2,
      theta: 0.04,
      volOfVol: 0.6,
      rho: -0.7,
      jumpIntensity: 0.4,
      upProbability: 0.3,
      upMean: 0.04,
      downMean: 0.07,
    };
    for (const model of [bates, kou]) {
      for (const T of [3 / 365, 14 / 365, 0.25]) {
        const average = integratedIntensity(0.4, schedule, T) / T;
        const dated = { ...model, jumpIntensitySchedule: schedule } as Model;
        const flat = { ...model, jumpIntensity: average } as Model;
        for (const K of [90, 100, 108]) {
          expect(
            Math.abs(cosPrice(m, dated, 'put', K, T) - cosPrice(m, flat, 'put', K, T)),
          ).toBeLessThan(1e-10 * 100);
        }
      }
    }
  });
});

describe('Bates with two events and a schedule against the Lewis (2001) validation pricer', () => {
  it('agrees from 1 day to 1 year within 1e-9 × spot', () => {
    const m = market(100, 0.03, 0.01);
    const model: Model = {
      kind: 'bates',
      v0: 0.04,
      kappa: 1.5,
      theta: 0.04,
      volOfVol: 0.5,
      rho: -0.7,
      jumpIntensity: 0.5,
      jumpMean: -0.1,
      jumpStdev: 0.15,
      events: [
        { time: 0.5 / 365, law: 'normal', stdev: 0.03 },
        { time: 20 / 365, law: 'two-point', up: 0.05, down: -0.07, upProbability: 0.6 },
      ],
      jumpIntensitySchedule: [
        [14 / 365, 2],
        [60 / 365, 1],
      ],
    };
    for (const T of [1 / 365, 7 / 365, 30 / 365, 0.25, 1]) {
      for (const K of [85, 97, 100, 103, 115]) {
        for (const type of ['call', 'put'] as const) {
          const cos = cosPrice(m, model, type, K, T);
          const lewis = lewisPrice(m, model, type, K, T);
          expect(Math.abs(cos - lewis)).toBeLessThan(1e-9 * 100);
        }
      }
    }
  });
});

describe('validation of dated risk', () => {
  const base = {
    kind: 'bates',
    v0: 0.04,
    kappa: 1,
    theta: 0.04,
    volOfVol: 0.5,
    rho: -0.5,
    jumpIntensity: 0.5,
    jumpMean: -0.1,
    jumpStdev: 0.1,
  };

  it('names the bad field of an event', () => {
    const issues = validateModel({
      ...base,
      events: [
        { time: 0.1, law: 'normal', stdev: 0.02 },
        { time: 0.2, law: 'normal', stdev: 0.02 },
        { time: 0.3, law: 'two-point', up: 0.05, down: -0.05, upProbability: 1.2 },
      ],
    });
    expect(issues).toEqual([
      { path: 'events.2.upProbability', message: 'must be between 0 and 1' },
    ]);
  });

  it('refuses a two-point move whose down is not a fall, a time in the past, and too many events', () => {
    expect(
      validateModel({
        ...base,
        events: [{ time: 0.1, law: 'two-point', up: 0.05, down: 0.01, upProbability: 0.5 }],
      })[0].path,
    ).toBe('events.0.down');
    expect(
      validateModel({ ...base, events: [{ time: 0, law: 'normal', stdev: 0.02 }] })[0].path,
    ).toBe('events.0.time');
    const many = Array.from({ length: 51 }, (_, i) => ({
      time: (i + 1) / 365,
      law: 'normal',
      stdev: 0.01,
    }));
    expect(validateModel({ ...base, events: many })[0].message).toBe('at most 50 events');
  });

  it('refuses a schedule out of order, and a schedule on a model without jumps', () => {
    expect(
      validateModel({
        ...base,
        jumpIntensitySchedule: [
          [0.2, 1],
          [0.1, 2],
        ],
      })[0],
    ).toEqual({ path: 'jumpIntensitySchedule', message: 'times must be strictly increasing' });
    expect(
      validateModel({ kind: 'black-scholes', sigma: 0.2, jumpIntensitySchedule: [[0.1, 1]] })[0]
        .path,
    ).toBe('jumpIntensitySchedule');
  });
});

describe('the implied event move from the ATM term structure (common practice: forward-variance arithmetic)', () => {
  const m = market(100, 0.02, 0.01);
  const grid = [3 / 365, 7 / 365, 14 / 365, 30 / 365];

  it('recovers a known normal move from a Black-Scholes surface within 0.1 vol points', () => {
    const model = bs(0.18, [{ time: 10 / 365, law: 'normal', stdev: 0.045 }]);
    const surface = smileSurface(m, model, grid, [0]);
    const [est] = impliedEventMoves(
      [10 / 365],
      grid,
      surface.slices.map((s) => s.atm),
    );
    expect(est.before.expiry).toBe(7 / 365);
    expect(est.after.expiry).toBe(14 / 365);
    expect(Math.abs(est.impliedMove! - 0.045)).toBeLessThan(0.001);
  });

  it('recovers a known normal move from a Bates surface within 0.1 vol points, with the base vol from the same surface without the move', () => {
    const bates: Model = {
      kind: 'bates',
      v0: 0.03,
      kappa: 2,
      theta: 0.04,
      volOfVol: 0.4,
      rho: -0.6,
      jumpIntensity: 0.3,
      jumpMean: -0.06,
      jumpStdev: 0.08,
    };
    const plain = smileSurface(m, bates, grid, [0]).slices.map((s) => s.atm!);
    const dated = smileSurface(
      m,
      { ...bates, events: [{ time: 10 / 365, law: 'normal', stdev: 0.04 }] },
      grid,
      [0],
    );
    const [T1, T2] = [grid[1], grid[2]];
    const forwardVol = Math.sqrt((plain[2] ** 2 * T2 - plain[1] ** 2 * T1) / (T2 - T1));
    const [est] = impliedEventMoves(
      [10 / 365],
      grid,
      dated.slices.map((s) => s.atm),
      forwardVol,
    );
    expect(Math.abs(est.impliedMove! - 0.04)).toBeLessThan(0.001);
  });

  it('gives no estimate without an expiry after the event', () => {
    expect(
      impliedEventMoves(
        [0.5],
        grid,
        grid.map(() => 0.2),
      ),
    ).toEqual([]);
    expect(impliedEventMove(0.3, 0.1, 0.2, 0.2, 0.3)).toBeNull();
  });
});
