/**
 * A pool of workers for block-seeded work (hardwareConcurrency − 1, at least 1). Blocks are
 * dealt out round-robin; the caller's `work` runs each worker's queue and puts the answers back
 * in block order, so the result does not depend on the pool size. Aborting the signal
 * terminates every worker at once; the workers are also terminated when the work ends.
 */
import { wrap, type Remote } from 'comlink';
import { abortable } from './cancellation';

export interface PoolRun<R> {
  result: Promise<R>;
  workers: number;
}

export function poolSize(): number {
  const cores = typeof navigator !== 'undefined' ? navigator.hardwareConcurrency || 2 : 2;
  return Math.max(1, cores - 1);
}

export function startPool<Api, R>(
  makeWorker: () => Worker,
  size: number,
  blocks: number,
  work: (apis: Remote<Api>[], queues: number[][]) => Promise<R>,
  signal: AbortSignal,
): PoolRun<R> {
  const workers = Array.from({ length: Math.max(1, Math.min(size, blocks)) }, makeWorker);
  const queues = workers.map((_, w) =>
    Array.from({ length: blocks }, (_, b) => b).filter((b) => b % workers.length === w),
  );
  const apis = workers.map((w) => wrap<Api>(w));
  const result = abortable(work(apis, queues), signal, () => workers.forEach((w) => w.terminate()));
  return { result, workers: workers.length };
}

/** Batches of at most `size` from a queue, in order. */
export function batches(queue: number[], size: number): number[][] {
  const out: number[][] = [];
  for (let i = 0; i < queue.length; i += size) out.push(queue.slice(i, i + size));
  return out;
}
