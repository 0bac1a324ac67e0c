/** The page side of the engine worker: created on first use, one per tab. */
import { wrap, type Remote } from 'comlink';
import type { EngineApi } from './engine-api';

let remote: Remote<EngineApi> | undefined;

export function engineWorker(): Remote<EngineApi> {
  if (!remote) {
    const worker = new Worker(new URL('./engine.worker.ts', import.meta.url), {
      type: 'module',
      name: 'saltation-engine',
    });
    remote = wrap<EngineApi>(worker);
  }
  return remote;
}
