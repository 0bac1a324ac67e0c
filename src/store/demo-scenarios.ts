/**
 * Demo scenarios of an invented desk on invented underlyings, put on a device the first time
 * it has none: an index with a crash-prone short end and a single stock with earnings-like
 * jumps.
 */
import {
  defaultMoneyness,
  TENORS,
  SCENARIO_FORMAT,
  type ScenarioDocument,
  NO_STRESS,
} from '../engine/core';

const grid = {
  expiries: TENORS.slice(0, 5).map((t) => t.years),
  moneyness: defaultMoneyness(),
  strikeSpacing: 'standard-deviations' as const,
};

/** The invented index's market: named, so a book never adds its P&L to another underlying's. */
const LKX_MARKET = {
  underlying: 'LKX 40',
  currency: 'EUR',
  spot: 4250,
  rate: 0.031,
  dividendYield: 0.017,
};

export function demoScenarios(valuationDate: string): ScenarioDocument[] {
  return [
    {
      format: SCENARIO_FORMAT,
      id: '6f1d3a52-58c4-4c2e-9a57-1c2d6c0e4a01',
      name: 'LKX 40 index — base',
      notes:
        'Larkspur 40 index (invented). Bates base calibrated by the desk: crashes of about 7 % a few times a decade, almost never upward.',
      valuationDate,
      market: { ...LKX_MARKET },
      model: {
        kind: 'bates',
        v0: 0.0225,
        kappa: 2.1,
        theta: 0.03,
        volOfVol: 0.55,
        rho: -0.72,
        jumpIntensity: 0.35,
        jumpMean: -0.07,
        jumpStdev: 0.04,
      },
      stress: { ...NO_STRESS },
      grid,
      runs: [],
    },
    {
      format: SCENARIO_FORMAT,
      id: '6f1d3a52-58c4-4c2e-9a57-1c2d6c0e4a02',
      name: 'LKX 40 index — crash week',
      notes: 'More frequent and deeper crashes on the base.',
      valuationDate,
      market: { ...LKX_MARKET },
      model: {
        kind: 'bates',
        v0: 0.0225,
        kappa: 2.1,
        theta: 0.03,
        volOfVol: 0.55,
        rho: -0.72,
        jumpIntensity: 0.35,
        jumpMean: -0.07,
        jumpStdev: 0.04,
      },
      stress: { ...NO_STRESS, jumpIntensityScale: 3, jumpMeanShift: -0.05 },
      grid,
      runs: [],
    },
    {
      format: SCENARIO_FORMAT,
      id: '6f1d3a52-58c4-4c2e-9a57-1c2d6c0e4a03',
      name: 'Corvane Minerals — two-sided jumps',
      notes: 'Single stock (invented) with double-exponential jumps.',
      valuationDate,
      market: {
        underlying: 'Corvane Minerals',
        currency: 'EUR',
        spot: 38.5,
        rate: 0.031,
        dividendYield: 0.0,
      },
      model: {
        kind: 'heston-kou',
        v0: 0.09,
        kappa: 1.2,
        theta: 0.1,
        volOfVol: 0.8,
        rho: -0.35,
        jumpIntensity: 1.5,
        upProbability: 0.4,
        upMean: 0.06,
        downMean: 0.09,
      },
      stress: { ...NO_STRESS },
      grid,
      runs: [],
    },
  ];
}
