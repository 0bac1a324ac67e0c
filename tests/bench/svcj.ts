/**
 * Benchmark: the 328-option surface with prices and Greeks (8 expiries × 41 strikes, through
 * `priceOptions`) under SVCJ against Bates with the same Heston part and price jumps, in the same
 * run (target: at most 1.5×).
 */
import { priceOptions } from '../../src/engine/analytic';
import { DEFAULT_BATES, type Market, type Model } from '../../src/engine/core';
import { surfaceOptions } from './surface-options';
import { fmt, pairedMedianMs } from './timing';

const market: Market = { spot: 100, rate: 0.03, dividendYield: 0.01 };
const bates: Model = DEFAULT_BATES;
const svcj: Model = {
  ...DEFAULT_BATES,
  kind: 'svcj',
  varianceJumpMean: 0.05,
  jumpCorrelation: -0.5,
};

const options = surfaceOptions(market);

export function benchSvcj(): Record<string, string>[] {
  const timed = pairedMedianMs(
    () => priceOptions(market, bates, options),
    () => priceOptions(market, svcj, options),
  );
  const batesMs = timed.a;
  const svcjMs = timed.b;
  return [
    { case: '328 options with Greeks: Bates', value: `${fmt(batesMs, 3)} ms`, target: '' },
    { case: '328 options with Greeks: SVCJ', value: `${fmt(svcjMs, 3)} ms`, target: '' },
    {
      case: 'ratio (SVCJ / Bates)',
      value: `${fmt(timed.ratio, 3)}×`,
      target: `at most 1.5×: ${timed.ratio <= 1.5 ? 'met' : 'MISSED'}`,
    },
  ];
}
