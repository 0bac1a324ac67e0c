/**
 * Calibrations run in a worker of their own, one per job, so that cancelling is immediate:
 * aborting the job's signal terminates the worker, and nothing half-done is kept.
 */
import { proxy, wrap } from 'comlink';
import { abortable } from './cancellation';
import type { FitApi, Progress } from './fit-api';

export { CancelledError } from './cancellation';

export function runFit<T>(
  call: (api: ReturnType<typeof wrap<FitApi>>, progress: Progress) => Promise<T>,
  onProgress: Progress,
  signal: AbortSignal,
): Promise<T> {
  const worker = new Worker(new URL('./fit.worker.ts', import.meta.url), {
    type: 'module',
    name: 'saltation-fit',
  });
  const api = wrap<FitApi>(worker);
  return abortable(call(api, proxy(onProgress)), signal, () => worker.terminate());
}
