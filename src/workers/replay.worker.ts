import { expose, transfer } from 'comlink';
import {
  joinBlocks,
  planReplay,
  replayBlock,
  replayResult,
  tracePath,
  type ReplayPlan,
  sharedHistograms,
  suggestWingHedgeByReplay,
} from '../engine/replay';
import type { ReplayApi, ReplayBlocksDone } from './replay-api';

// plans (hedge tables included) of the last few requests: a comparison traces two hedges of
// one position in turn, and a one-entry cache rebuilt both tables on every drill-down
const plans = new Map<string, ReplayPlan>();
const planFor = (request: Parameters<ReplayApi['trace']>[0]) => {
  const key = JSON.stringify(request);
  let plan = plans.get(key);
  if (!plan) {
    plan = planReplay(request);
    if (plans.size >= 4) plans.delete(plans.keys().next().value!);
    plans.set(key, plan);
  }
  return plan;
};

const api: ReplayApi = {
  runBlocks(request, blocks, onBlock) {
    const plan = planFor(request);
    const done: ReplayBlocksDone = {
      pnl: [],
      onJumps: [],
      onEvents: [],
      overlay: [],
      premium: plan.premium,
      overlayPremium: plan.overlayPremium,
      steps: plan.steps,
    };
    for (const b of blocks) {
      const out = replayBlock(plan, b);
      done.pnl.push(out.pnl);
      done.onJumps.push(out.onJumps);
      done.onEvents.push(out.onEvents);
      done.overlay.push(out.overlay);
      void onBlock();
    }
    const buffers = [...done.pnl, ...done.onJumps, ...done.onEvents, ...done.overlay].map(
      (a) => a.buffer as ArrayBuffer,
    );
    return transfer(done, buffers);
  },
  trace(request, path) {
    return tracePath(planFor(request), path);
  },
  wingPilot: suggestWingHedgeByReplay,
  finish(runs, bins) {
    const joined = runs.map((r) => joinBlocks(r.meta.request.paths, r.blocks));
    return {
      results: runs.map((r, i) => replayResult(r.meta, joined[i], r.elapsedMs)),
      histograms: sharedHistograms(
        joined.map((j) => j.pnl),
        bins,
      ),
    };
  },
};

expose(api);
