import { expose, transfer } from 'comlink';
import {
  joinBlocks,
  planReplay,
  replayBlock,
  replayResult,
  tracePath,
  type ReplayPlan,
} from '../engine/replay';
import { sharedHistograms } from '../engine/replay-summary';
import type { ReplayApi, ReplayBlocksDone } from './replay-api';

// the plan (hedge table included) of the last request, reused while its blocks come in
let last: { key: string; plan: ReplayPlan } | null = null;
const planFor = (request: Parameters<ReplayApi['trace']>[0]) => {
  const key = JSON.stringify(request);
  if (last?.key !== key) last = { key, plan: planReplay(request) };
  return last.plan;
};

const api: ReplayApi = {
  runBlocks(request, blocks, onBlock) {
    const plan = planFor(request);
    const done: ReplayBlocksDone = {
      pnl: [],
      onJumps: [],
      premium: plan.premium,
      steps: plan.steps,
    };
    for (const b of blocks) {
      const out = replayBlock(plan, b);
      done.pnl.push(out.pnl);
      done.onJumps.push(out.onJumps);
      void onBlock();
    }
    const buffers = [...done.pnl, ...done.onJumps].map((a) => a.buffer as ArrayBuffer);
    return transfer(done, buffers);
  },
  trace(request, path) {
    return tracePath(planFor(request), path);
  },
  finish(runs, bins) {
    const joined = runs.map((r) => joinBlocks(r.meta.request.paths, r.blocks));
    return {
      results: runs.map((r, i) =>
        replayResult(r.meta, joined[i].pnl, joined[i].onJumps, r.elapsedMs),
      ),
      histograms: sharedHistograms(
        joined.map((j) => j.pnl),
        bins,
      ),
    };
  },
};

expose(api);
