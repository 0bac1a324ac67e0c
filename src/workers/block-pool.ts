/**
 * A pool of workers for block-seeded work (hardwareConcurrency − 1, at least 1). Blocks are
 * dealt out round-robin; the caller's `work` runs each worker's queue and puts the answers back
 * in block order, so the result does not depend on the pool size. Cancel terminates every
 * worker at once; the workers are also terminated when the work ends.
 */
import { wrap, type Remote } from 'comlink';
import { CancelledError } from './fit-client';

export interface PoolRun<R> {
  result: Promise<R>;
  cancel: () => void;
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
): PoolRun<R> {
  const workers = Array.from({ length: Math.max(1, Math.min(size, blocks)) }, makeWorker);
  const queues = workers.map((_, w) =>
    Array.from({ length: blocks }, (_, b) => b).filter((b) => b % workers.length === w),
  );
  let rejectCancel: (e: Error) => void = () => undefined;
  const cancelled = new Promise<never>((_, reject) => (rejectCancel = reject));
  const apis = workers.map((w) => wrap<Api>(w));
  const result = Promise.race([work(apis, queues), cancelled]).finally(() =>
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

/** Batches of at most `size` from a queue, in order. */
export function batches(queue: number[], size: number): number[][] {
  const out: number[][] = [];
  for (let i = 0; i < queue.length; i += size) out.push(queue.slice(i, i + size));
  return out;
}
