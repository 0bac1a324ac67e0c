/**
 * A pool of Monte Carlo workers (hardwareConcurrency − 1, at least 1). Blocks are dealt out
 * round-robin in small batches; the sums come back transferred, are put in block order and
 * combined exactly as a single thread would, so the result does not depend on the pool size.
 * Cancel terminates every worker at once.
 */
import { proxy, wrap } from 'comlink';
import {
  blockCount,
  combineBlocks,
  type BlockSums,
  type SimulationResult,
  type SimulationSettings,
} from '../engine/simulate';
import type { Market, Model } from '../engine/types';
import { CancelledError } from './fit-client';
import type { PathsView } from '../engine/paths-view';
import type { PathsApi } from './paths-api';

export interface PathsOutcome {
  summary: SimulationResult;
  view: PathsView | null;
  /** counts of ln(S_T/S_0) over all paths, on settings.histogram's bins */
  histogram: number[] | null;
  workers: number;
}

export interface PathsRun {
  result: Promise<PathsOutcome>;
  cancel: () => void;
  workers: number;
}

export function poolSize(): number {
  const cores = typeof navigator !== 'undefined' ? navigator.hardwareConcurrency || 2 : 2;
  return Math.max(1, cores - 1);
}

export function runPaths(
  market: Market,
  model: Model,
  unsorted: SimulationSettings,
  onProgress: (fraction: number) => void,
  size = poolSize(),
): PathsRun {
  // blocks look options up in expiry order (as simulate() does); answers go back in the caller's
  const order = unsorted.options.map((o, i) => ({ o, i })).sort((a, b) => a.o.expiry - b.o.expiry);
  const settings = { ...unsorted, options: order.map((x) => x.o) };
  const total = blockCount(settings);
  const workers = Array.from(
    { length: Math.min(size, total) },
    () =>
      new Worker(new URL('./paths.worker.ts', import.meta.url), {
        type: 'module',
        name: 'saltation-paths',
      }),
  );
  let done = 0;
  const tick = proxy(() => onProgress(++done / total));
  let view: PathsView | null = null;
  let rejectCancel: (e: Error) => void = () => undefined;
  const cancelled = new Promise<never>((_, reject) => (rejectCancel = reject));
  const started = performance.now();
  const work = (async () => {
    const blocks: BlockSums[] = new Array(total);
    const queues = workers.map((_, w) =>
      Array.from({ length: total }, (_, b) => b).filter((b) => b % workers.length === w),
    );
    await Promise.all(
      workers.map(async (worker, w) => {
        const api = wrap<PathsApi>(worker);
        const mine = queues[w];
        for (let i = 0; i < mine.length; i += 4) {
          const batch = mine.slice(i, i + 4);
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
    return { summary, view, histogram, workers: workers.length };
  })();
  const result = Promise.race([work, cancelled]).finally(() =>
    workers.forEach((w) => w.terminate()),
  );
  return {
    result,
    workers: workers.length,
    cancel: () => {
      workers.forEach((w) => w.terminate());
      rejectCancel(new CancelledError());
    },
  };
}
