/**
 * Benchmark: a book of 2,000 legs over 40 expiries revalued under a set of 20 scenarios with a
 * 41-point gap ladder, in one thread (as in one worker). Peer: the same revaluation done leg by
 * leg through the general pricing call (`priceOptions` at each ladder spot), in the same run.
 */
import {
  bookJumpExposure,
  jumpQuadrature,
  revalueSet,
  type BookScenario,
  type Position,
} from '../../src/engine/book';
import { modelSpec } from '../../src/engine/analytic/characteristic';
import { priceOptions } from '../../src/engine/analytic';
import { type Market, type Model, DEFAULT_BATES } from '../../src/engine/core';
import { fmt } from './timing';

const market: Market = { spot: 100, rate: 0.03, dividendYield: 0.01 };
const model: Model = DEFAULT_BATES;

function book(legs: number, expiries: number): Position[] {
  return Array.from({ length: legs }, (_, i) => {
    const T = (1 + (i % expiries) * 9) / 365;
    const strike = 70 + ((i * 7919) % 61);
    return {
      id: `L${i}`,
      type: strike < 100 ? 'put' : 'call',
      strike,
      expiry: T,
      quantity: (i % 2 === 0 ? 1 : -1) * (1 + (i % 9)),
    };
  });
}

export function benchBook(): Record<string, string>[] {
  const positions = book(2000, 40);
  const scenarios: BookScenario[] = Array.from({ length: 20 }, (_, i) => ({
    id: `s${i}`,
    name: `s${i}`,
    market,
    model,
    stress: { jumpIntensityScale: 1 + 0.25 * i, jumpMeanShift: -0.005 * i },
  }));
  const ladder = { from: -0.3, to: 0.1, steps: 41 };
  revalueSet(
    { id: 'b', name: 'base', market, model },
    scenarios.slice(0, 1),
    positions.slice(0, 50),
    ladder,
  ); // warm-up
  const runs: number[] = [];
  for (let r = 0; r < 3; r++) {
    const t0 = performance.now();
    revalueSet({ id: 'b', name: 'base', market, model }, scenarios, positions, ladder);
    runs.push(performance.now() - t0);
  }
  runs.sort((a, b) => a - b);
  const ours = runs[1];
  const cells = positions.length * scenarios.length * ladder.steps;
  // peer: one scenario's ladder leg by leg through priceOptions, scaled to 20 scenarios
  const t0 = performance.now();
  for (let m = 0; m < ladder.steps; m++) {
    const spot = market.spot * (1 - 0.3 + (0.4 * m) / (ladder.steps - 1));
    priceOptions(
      { ...market, spot },
      model,
      positions.map((p) => ({
        type: p.type as 'call' | 'put',
        strike: p.strike!,
        expiry: p.expiry!,
      })),
    );
  }
  const peer = (performance.now() - t0) * scenarios.length;
  // the jump exposure, asked for on its own after the revaluation; peer: the general pricing
  // call at as many moves as it revalues (the day's 1,601, the jump quadrature's nodes and
  // the two 41-point ladders), from the per-move cost just measured
  const exposureRuns: number[] = [];
  for (let r = 0; r < 3; r++) {
    const t1 = performance.now();
    bookJumpExposure({ id: 'b', name: 'base', market, model }, positions, ladder);
    exposureRuns.push(performance.now() - t1);
  }
  exposureRuns.sort((a, b) => a - b);
  const exposure = exposureRuns[1];
  const exposureMoves = 1601 + jumpQuadrature(modelSpec(model).jumps).y.length + 2 * ladder.steps;
  const exposurePeer = (peer / scenarios.length / ladder.steps) * exposureMoves;
  return [
    {
      case: '2,000 legs × 40 expiries × 20 scenarios × 41 ladder points',
      'Saltation ms (median of 3)': fmt(ours, 4),
      'leg-points per second': `${fmt(cells / (ours / 1000), 3)}`,
      'peer ms (priceOptions at every point)': `${fmt(peer, 4)} (×20 scenarios)`,
      'speed-up': `${fmt(peer / ours)}×`,
    },
    {
      case: `its jump exposure, asked for after it (base only, ${exposureMoves} moves)`,
      'Saltation ms (median of 3)': fmt(exposure, 4),
      'leg-points per second': `${fmt((positions.length * exposureMoves) / (exposure / 1000), 3)}`,
      'peer ms (priceOptions at every point)': fmt(exposurePeer, 4),
      'speed-up': `${fmt(exposurePeer / exposure)}×`,
    },
  ];
}
