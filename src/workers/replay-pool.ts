/**
 * Hedge replays on the worker pool. Several requests on the same paths (the same market, model,
 * seed and path count, different hedges) run one after another in one pool; each one's blocks
 * come back transferred and are combined in block order (in one of the workers), so the answer
 * does not depend on the pool size. A separate long-lived worker follows single paths for drill-down.
 */
import { proxy, transfer, wrap, type Remote } from 'comlink';
import {
  blockCountFor,
  type PilotWingHedge,
  type PilotWingRequest,
  type PnlHistogram,
  type ReplayRequest,
  type ReplayResult,
} from '../engine/replay';
import { batches, poolSize, startPool, type PoolRun } from './block-pool';
import type { FinishedRun, ReplayApi } from './replay-api';

export interface ReplayOutcome {
  results: ReplayResult[];
  /** one per request, on shared bins */
  histograms: PnlHistogram[];
  workers: number;
}

/** bins of the P&L histograms */
const BINS = 60;

const makeWorker = () =>
  new Worker(new URL('./replay.worker.ts', import.meta.url), {
    type: 'module',
    name: 'saltation-replay',
  });

export function runReplays(
  requests: ReplayRequest[],
  onProgress: (fraction: number) => void,
  signal: AbortSignal,
  size = poolSize(),
): PoolRun<ReplayOutcome> {
  const perRequest = requests.map((r) => blockCountFor(r.paths));
  const total = perRequest.reduce((a, b) => a + b, 0);
  let done = 0;
  const tick = proxy(() => onProgress(++done / total));
  const run = startPool<ReplayApi, ReplayOutcome>(
    makeWorker,
    size,
    Math.max(...perRequest),
    async (apis, queues) => {
      const finished: FinishedRun[] = [];
      for (const request of requests) {
        const started = performance.now();
        const count = blockCountFor(request.paths);
        const pnl = new Array<Float64Array>(count);
        const onJumps = new Array<Float64Array>(count);
        const onEvents = new Array<Float64Array>(count);
        const overlay = new Array<Float64Array>(count);
        let meta = { request, steps: 0, premium: 0, overlayPremium: 0 };
        await Promise.all(
          apis.map(async (api, w) => {
            const mine = queues[w].filter((b) => b < count);
            for (const batch of batches(mine, 2)) {
              const out = await api.runBlocks(request, batch, tick);
              meta = {
                request,
                steps: out.steps,
                premium: out.premium,
                overlayPremium: out.overlayPremium,
              };
              batch.forEach((b, j) => {
                pnl[b] = out.pnl[j];
                onJumps[b] = out.onJumps[j];
                onEvents[b] = out.onEvents[j];
                overlay[b] = out.overlay[j];
              });
            }
          }),
        );
        const blocks = pnl.map((p, b) => ({
          pnl: p,
          onJumps: onJumps[b],
          onEvents: onEvents[b],
          overlay: overlay[b],
        }));
        finished.push({ meta, blocks, elapsedMs: performance.now() - started });
      }
      // joining, sorting for VaR/ES and the histograms run in a worker, not on the page's thread
      const buffers = finished.flatMap((f) =>
        f.blocks.flatMap((b) =>
          [b.pnl, b.onJumps, b.onEvents, b.overlay].map((a) => a.buffer as ArrayBuffer),
        ),
      );
      const { results, histograms } = await apis[0].finish(transfer(finished, buffers), BINS);
      return { results, histograms, workers: apis.length };
    },
    signal,
  );
  return run;
}

let tracer: Remote<ReplayApi> | null = null;

/** One path of a replay, step by step (rebuilds nothing when the same request ran last). */
export function tracePathInWorker(request: ReplayRequest, path: number) {
  tracer ??= wrap<ReplayApi>(makeWorker());
  return tracer.trace(request, path);
}

let pilot: Remote<ReplayApi> | null = null;

/** A wing hedge by a pilot replay's ES99, in a worker of its own. */
export function wingPilotInWorker(request: PilotWingRequest): Promise<PilotWingHedge> {
  pilot ??= wrap<ReplayApi>(makeWorker());
  return pilot.wingPilot(request);
}
