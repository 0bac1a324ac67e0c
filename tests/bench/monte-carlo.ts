/**
 * Benchmark: Bates with QE variance and jumps, one core — path-steps per second, and time to a
 * standard error of 0.01 for an ATM 1-year call with weekly steps — against QuantLib's Monte Carlo
 * in the same run (its Black-Scholes engine: the Heston one fails in this port), scaled the same
 * way (time × (s.e./0.01)²). Then the same simulation split across 2 worker threads, which must
 * give bit-identical numbers.
 */
import {
  blockCount,
  combineBlocks,
  simulate,
  type BlockSums,
  type SimulationSettings,
} from '../../src/engine/paths';
import { type Market, type Model, DEFAULT_BATES } from '../../src/engine/core';
import { quantlibMcBlackScholesCall } from '../support/quantlib';
import { blocksInThreads } from './threads';
import { fmt } from './timing';

const market: Market = { spot: 100, rate: 0.02, dividendYield: 0.01 };
const model: Model = DEFAULT_BATES;
const settings: SimulationSettings = {
  horizon: 1,
  stepsPerYear: 52,
  paths: 65536,
  seed: 7,
  antithetic: true,
  scheme: 'qe',
  options: [{ type: 'call', strike: 100, expiry: 1 }],
};

async function runInThreads(workers: number) {
  const { ms, blocks } = await blocksInThreads<BlockSums>(
    new URL('./mc-thread.mjs', import.meta.url),
    workers,
    blockCount(settings),
    { market, model, settings },
  );
  return { ms, result: combineBlocks(market, settings, blocks, 0) };
}

export async function benchMonteCarlo(): Promise<Record<string, string>[]> {
  simulate(market, model, { ...settings, paths: 4096 }); // warm-up
  const t0 = performance.now();
  const ours = simulate(market, model, settings);
  const oursMs = performance.now() - t0;
  const pathSteps = settings.paths * 52;
  const oursTo001 = oursMs * (ours.estimates[0].stdError / 0.01) ** 2;
  const t1 = performance.now();
  const peer = quantlibMcBlackScholesCall(100, 0.02, 0.01, 0.2, 100, 365, 52, 4096);
  const peerMs = performance.now() - t1;
  const peerTo001 = peerMs * (peer.stdError / 0.01) ** 2;
  const one = await runInThreads(1);
  const two = await runInThreads(2);
  const identical = JSON.stringify(two.result.estimates) === JSON.stringify(ours.estimates);
  return [
    {
      case: 'Saltation, Bates QE + jumps, 65,536 paths × 52 steps',
      'path-steps/s': fmt(pathSteps / (oursMs / 1000), 3),
      'time to s.e. 0.01': `${fmt(oursTo001 / 1000, 3)} s`,
      note: `s.e. ${fmt(ours.estimates[0].stdError, 3)} in ${fmt(oursMs, 4)} ms`,
    },
    {
      case: 'QuantLib MCEuropeanEngine (Black-Scholes), 4,096 paths × 52 steps',
      'path-steps/s': fmt((4096 * 52) / (peerMs / 1000), 3),
      'time to s.e. 0.01': `${fmt(peerTo001 / 1000, 3)} s`,
      note: `s.e. ${fmt(peer.stdError, 3)} in ${fmt(peerMs, 4)} ms`,
    },
    {
      case: 'ratio (QuantLib time to 0.01 / Saltation time to 0.01)',
      'path-steps/s': '',
      'time to s.e. 0.01': `${fmt(peerTo001 / oursTo001, 3)}×`,
      note: '',
    },
    {
      case: '1 worker thread / 2 worker threads (wall clock, incl. start-up)',
      'path-steps/s': '',
      'time to s.e. 0.01': `${fmt(one.ms, 4)} ms / ${fmt(two.ms, 4)} ms = ${fmt(one.ms / two.ms, 3)}×`,
      note: identical ? 'bit-identical to one thread' : 'NOT identical',
    },
  ];
}
