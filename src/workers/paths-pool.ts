/**
 * The Monte Carlo on the worker pool: blocks go out in batches of four; the sums come back
 * transferred, are put in block order and combined exactly as a single thread would, so the
 * result does not depend on the pool size.
 */
import { proxy } from 'comlink';
import {
  blockCount,
  combineBlocks,
  type PathsView,
  type BlockSums,
  type SimulationResult,
  type SimulationSettings,
} from '../engine/paths';
import type { Market, Model } from '../engine/core';
import { batches, poolSize, startPool, type PoolRun } from './block-pool';
import type { PathsApi } from './paths-api';

export interface PathsOutcome {
  summary: SimulationResult;
  view: PathsView | null;
  /** counts of ln(S_T/S_0) over all paths, on settings.histogram's bins */
  histogram: number[] | null;
  workers: number;
}

export type PathsRun = PoolRun<PathsOutcome>;

export function runPaths(
  market: Market,
  model: Model,
  unsorted: SimulationSettings,
  onProgress: (fraction: number) => void,
  signal: AbortSignal,
  size = poolSize(),
): PathsRun {
  // blocks look options up in expiry order (as simulate() does); answers go back in the caller's
  const order = unsorted.options.map((o, i) => ({ o, i })).sort((a, b) => a.o.expiry - b.o.expiry);
  const settings = { ...unsorted, options: order.map((x) => x.o) };
  const total = blockCount(settings);
  let done = 0;
  const tick = proxy(() => onProgress(++done / total));
  let view: PathsView | null = null;
  const started = performance.now();
  const run: PathsRun = startPool<PathsApi, PathsOutcome>(
    () =>
      new Worker(new URL('./paths.worker.ts', import.meta.url), {
        type: 'module',
        name: 'saltation-paths',
      }),
    size,
    total,
    async (apis, queues) => {
      const blocks: BlockSums[] = new Array(total);
      await Promise.all(
        apis.map(async (api, w) => {
          for (const batch of batches(queues[w], 4)) {
            const out = await api.runBlocks(market, model, settings, batch, tick);
            batch.forEach((b, j) => (blocks[b] = out.sums[j]));
            if (out.view) view = out.view;
          }
        }),
      );
      const combined = combineBlocks(market, settings, blocks, performance.now() - started);
      const estimates = new Array(order.length);
      order.forEach((x, j) => (estimates[x.i] = combined.estimates[j]));
      const summary = { ...combined, estimates };
      let histogram: number[] | null = null;
      if (settings.histogram) {
        histogram = new Array(settings.histogram.bins).fill(0);
        for (const b of blocks) b.histogram?.forEach((c, i) => (histogram![i] += c));
      }
      return { summary, view, histogram, workers: run.workers };
    },
    signal,
  );
  return run;
}
