/**
 * Calibrations run in a worker of their own, one per job, so that cancelling is immediate:
 * the worker is terminated, and nothing half-done is kept.
 */
import { proxy, wrap } from 'comlink';
import type { FitApi, Progress } from './fit-api';

export class CancelledError extends Error {
  constructor() {
    super('cancelled');
  }
}

export interface FitJob<T> {
  result: Promise<T>;
  cancel: () => void;
}

export function runFit<T>(
  call: (api: ReturnType<typeof wrap<FitApi>>, progress: Progress) => Promise<T>,
  onProgress: Progress,
): FitJob<T> {
  const worker = new Worker(new URL('./fit.worker.ts', import.meta.url), {
    type: 'module',
    name: 'saltation-fit',
  });
  const api = wrap<FitApi>(worker);
  let rejectCancel: (e: Error) => void = () => undefined;
  const cancelled = new Promise<never>((_, reject) => (rejectCancel = reject));
  const result = Promise.race([call(api, proxy(onProgress)), cancelled]).finally(() =>
    worker.terminate(),
  );
  return {
    result,
    cancel: () => {
      worker.terminate();
      rejectCancel(new CancelledError());
    },
  };
}
