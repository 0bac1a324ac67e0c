/**
 * Benchmark: what scheduled moves and an intensity schedule cost. The 328-option surface with
 * prices and Greeks (8 expiries × 41 strikes, through `priceOptions`) for Bates with three
 * scheduled moves against plain Bates (target: at most 1.5×), and Monte Carlo path-steps per
 * second with moves and a schedule against without (target: no more than 10 % slower). Both sides run in the
 * same process, alternated, so the machine's load falls on both.
 */
import { priceOptions } from '../../src/engine/analytic';
import { DEFAULT_BATES, type Market, type Model } from '../../src/engine/core';
import { surfaceOptions } from './surface-options';
import { simulate, type SimulationSettings } from '../../src/engine/paths';
import { fmt, pairedMedianMs } from './timing';

const market: Market = { spot: 100, rate: 0.03, dividendYield: 0.01 };
const plain: Model = DEFAULT_BATES;
const dated: Model = {
  ...DEFAULT_BATES,
  events: [
    { time: 3.5 / 365, law: 'two-point', up: 0.05, down: -0.06, upProbability: 0.55 },
    { time: 20 / 365, law: 'normal', stdev: 0.03 },
    { time: 45 / 365, law: 'normal', stdev: 0.02 },
  ],
};
const scheduled: Model = {
  ...dated,
  jumpIntensitySchedule: [
    [14 / 365, 1.5],
    [60 / 365, 0.8],
  ],
};

const options = surfaceOptions(market);

const mc: SimulationSettings = {
  horizon: 0.25,
  stepsPerYear: 365,
  paths: 32768,
  seed: 11,
  antithetic: true,
  scheme: 'qe',
  options: [{ type: 'put', strike: 95, expiry: 0.25 }],
};

export function benchScheduledMoves(): Record<string, string>[] {
  const surface = (m: Model) => () => priceOptions(market, m, options);
  const timed = pairedMedianMs(surface(plain), surface(dated));
  const surfacePlain = timed.a;
  const surfaceDated = timed.b;
  simulate(market, plain, { ...mc, paths: 2048 }); // warm-up
  const pathSteps = (m: Model) => {
    const t0 = performance.now();
    const r = simulate(market, m, mc);
    return (mc.paths * r.steps) / ((performance.now() - t0) / 1000);
  };
  const rates = { plain: [] as number[], dated: [] as number[] };
  for (let i = 0; i < 3; i++) {
    rates.plain.push(pathSteps(plain));
    rates.dated.push(pathSteps(scheduled));
  }
  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[1];
  const mcPlain = median(rates.plain);
  const mcDated = median(rates.dated);
  return [
    {
      case: '328 options with Greeks: Bates',
      value: `${fmt(surfacePlain, 3)} ms`,
      target: '',
    },
    {
      case: '328 options with Greeks: Bates with 3 scheduled moves',
      value: `${fmt(surfaceDated, 3)} ms`,
      target: '',
    },
    {
      case: 'ratio (with moves / without)',
      value: `${fmt(timed.ratio, 3)}×`,
      target: `at most 1.5×: ${timed.ratio <= 1.5 ? 'met' : 'MISSED'}`,
    },
    {
      case: 'Monte Carlo path-steps/s, Bates (3M daily, 32,768 paths)',
      value: fmt(mcPlain, 3),
      target: '',
    },
    {
      case: 'Monte Carlo path-steps/s, with 3 moves and a schedule',
      value: fmt(mcDated, 3),
      target: '',
    },
    {
      case: 'ratio (with / without)',
      value: `${fmt(mcDated / mcPlain, 3)}×`,
      target: `no more than 10 % slower: ${mcDated / mcPlain >= 0.9 ? 'met' : 'MISSED'}`,
    },
  ];
}
