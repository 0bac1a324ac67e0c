/**
 * Hedge replay: a position of European legs, bought at the model's price, hedged in the
 * underlying (no hedge, Black-Scholes delta at a hedge vol, or the model's own delta from a
 * precomputed table) at each rebalance, with proportional costs and financing at the scenario's
 * rate, over simulated paths of the scenario's model. Each step's P&L (mark-to-model of the
 * position plus the hedge and cash) is booked to "jumps" when the step had a jump and to
 * "diffusion" otherwise. Paths are seeded per block as in the Monte Carlo, so a replay is
 * bit-identical across machines and worker counts.
 */
import { modelSpec } from '../analytic/characteristic';
import { buildHedgeTable, lookup, type Leg } from './hedge-table';
import { discountFactor, dividendRate, forwardPrice, riskFreeRate } from '../core/market';
import { normCdf } from '../analytic/normal';
import { drawMove, jumpSampler, meanRelativeJump } from '../paths/path-step';
import { settlementStep, stepGrid } from '../paths/step-grid';
import { stepAdvances, BLOCK_PATHS } from '../paths/simulate';
import { priceOptions } from '../analytic/pricing';
import { BlockRandom } from '../paths/random';
import { summariseReplay, type ReplaySummary } from './replay-summary';
import type { Market, Model } from '../core/types';

export interface HedgeSettings {
  method: 'none' | 'bs-delta' | 'model-delta';
  rebalancesPerDay: number;
  /** proportional cost of each trade in the underlying, in basis points of its value */
  costBps: number;
  /** Black-Scholes hedge vol; each leg's implied vol at inception when absent */
  hedgeVol?: number;
}

export interface ReplayRequest {
  market: Market;
  model: Model;
  position: Leg[];
  hedge: HedgeSettings;
  paths: number;
  seed: number;
}

export interface ReplayResult extends ReplaySummary {
  premium: number;
  steps: number;
  paths: number;
  elapsedMs: number;
}

/** One block's per-path P&L, and the parts of it booked on jump steps and on scheduled-move steps. */
export interface BlockPnl {
  pnl: Float64Array;
  onJumps: Float64Array;
  onEvents: Float64Array;
}

/** One path followed step by step, for drill-down: values at each rebalance and at the end. */
export interface PathTrace {
  path: number;
  times: number[];
  spot: number[];
  variance: number[];
  /** shares of the underlying held after the rebalance at that time */
  shares: number[];
  /** cumulative P&L (undiscounted) at that time */
  pnl: number[];
  /** steps that had a jump: the time at the step's end and the log-jump */
  jumps: { time: number; size: number }[];
  /** scheduled moves: their date and the log-move drawn */
  events: { time: number; size: number }[];
}

/** Everything a replay needs before the first path: the grid, the hedge table, the premium. */
export interface ReplayPlan {
  request: ReplayRequest;
  steps: number;
  dt: number;
  horizon: number;
  premium: number;
  runPath: (
    rng: BlockRandom,
    trace: PathTrace | null,
  ) => { total: number; jumpPart: number; eventPart: number };
}

export function blockCountFor(paths: number): number {
  return Math.ceil(paths / BLOCK_PATHS);
}

export function planReplay(req: ReplayRequest): ReplayPlan {
  const { market, model, position, hedge } = req;
  const horizon = Math.max(...position.map((l) => l.expiry));
  const spec = modelSpec(model);
  const r = riskFreeRate(market, horizon);
  const q = dividendRate(market, horizon);
  // even rebalances, with every scheduled move's date a rebalance too (the hedge is set just
  // before the move lands)
  const grid = stepGrid(
    spec,
    horizon,
    Math.max(1, Math.round(horizon * 365 * hedge.rebalancesPerDay)),
    r - q,
    meanRelativeJump(spec.jumps),
  );
  const n = grid.steps;
  const times = Array.from(grid.times.subarray(0, n));
  const dt = horizon / n;
  const advances = stepAdvances(spec, 'qe', grid);
  const jumps = jumpSampler(spec.jumps);
  const varianceJumps = spec.jumps.type === 'price-variance';
  const lam = grid.expectedJumps;
  const p0 = lam.map((l) => Math.exp(-l));
  const table = buildHedgeTable(market, model, position, times);
  const inception = priceOptions(market, model, position);
  const premium = position.reduce((a, l, i) => a + l.quantity * inception[i].price, 0);
  const hedgeVols = inception.map((o) => hedge.hedgeVol ?? o.impliedVol ?? 0.2);
  const cost = hedge.costBps / 1e4;
  const accrual = Float64Array.from(grid.dt, (h) => Math.exp(r * h));
  const v0 = spec.diffusion.type === 'heston' ? spec.diffusion.v0 : 0;
  const state = new Float64Array(2);
  const S0 = market.spot;
  // per rebalance time and leg: forward growth to expiry, the e^{−q τ} carry, √τ
  const nLegs = position.length;
  const growthTo = new Float64Array(n * nLegs);
  const carryTo = new Float64Array(n * nLegs);
  const rootTau = new Float64Array(n * nLegs);
  for (let k = 0; k < n; k++) {
    position.forEach((l, i) => {
      const tau = l.expiry - times[k];
      growthTo[k * nLegs + i] = forwardPrice(market, l.expiry) / forwardPrice(market, times[k]);
      carryTo[k * nLegs + i] =
        (discountFactor(market, l.expiry) / discountFactor(market, times[k])) *
        growthTo[k * nLegs + i];
      rootTau[k * nLegs + i] = tau > 1e-12 ? Math.sqrt(tau) : 0;
    });
  }
  const hedgeDelta = (k: number, x: number, v: number): number => {
    if (hedge.method === 'none') return 0;
    if (hedge.method === 'model-delta') return -lookup(table, k, v, x, S0).delta;
    // Black-Scholes delta e^{−qτ}Φ(±d1) at each leg's hedge vol
    const S = S0 * Math.exp(x);
    let d = 0;
    for (let i = 0; i < nLegs; i++) {
      const st = rootTau[k * nLegs + i];
      if (st === 0) continue;
      const l = position[i];
      const s = hedgeVols[i] * st;
      const d1 = Math.log((S * growthTo[k * nLegs + i]) / l.strike) / s + 0.5 * s;
      const carry = carryTo[k * nLegs + i];
      d += l.quantity * (l.type === 'call' ? carry * normCdf(d1) : -carry * normCdf(-d1));
    }
    return -d;
  };
  // legs settling at each step
  const settles: Leg[][] = Array.from({ length: n + 1 }, () => []);
  for (const l of position) settles[settlementStep(grid, l.expiry)].push(l);
  const payoff = (k: number, S: number) => {
    let a = 0;
    for (const l of settles[k])
      a += l.quantity * Math.max(0, l.type === 'call' ? S - l.strike : l.strike - S);
    return a;
  };
  const runPath = (rng: BlockRandom, trace: PathTrace | null) => {
    state[0] = 0;
    state[1] = v0;
    let shares = 0;
    let cash = -premium;
    let mark = premium;
    let total = 0;
    let jumpPart = 0;
    let eventPart = 0;
    for (let k = 0; k < n; k++) {
      const S = S0 * Math.exp(state[0]);
      const before = mark + shares * S + cash; // the portfolio's value at the start of the step
      // rebalance; the cost is part of this step's P&L
      const target = hedgeDelta(k, state[0], state[1]);
      const trade = target - shares;
      cash -= trade * S + cost * Math.abs(trade) * S;
      shares = target;
      if (trace) {
        trace.times.push(times[k]);
        trace.spot.push(S);
        trace.variance.push(state[1]);
        trace.shares.push(shares);
        trace.pnl.push(total);
      }
      // one step of the model: the scheduled moves dated t_k land first
      const moves = grid.movesAt[k];
      for (const e of moves) {
        const x = drawMove(e, rng);
        state[0] += x;
        if (trace) trace.events.push({ time: times[k], size: x });
      }
      const z1 = rng.normal();
      const z2 = rng.normal();
      const u = rng.uniform();
      advances[k](state, z1, z2, u);
      let jumped = false;
      if (jumps) {
        const j = jumps(rng, lam[k], p0[k]);
        if (varianceJumps) state[1] += jumps.varianceJump;
        if (j !== 0) {
          jumped = true;
          state[0] += j;
          if (trace) trace.jumps.push({ time: grid.times[k + 1], size: j });
        }
      }
      const S1 = S0 * Math.exp(state[0]);
      cash *= accrual[k];
      cash += shares * q * S * grid.dt[k]; // dividends on the shares held
      cash += payoff(k + 1, S1);
      mark = k + 1 < n ? lookup(table, k + 1, state[1], state[0], S0).value : 0;
      const step = mark + shares * S1 + cash - before;
      total += step;
      // a step with a scheduled move is booked to it, even when a jump came too
      if (moves.length > 0) eventPart += step;
      else if (jumped) jumpPart += step;
    }
    // liquidate the hedge at the end
    total -= cost * Math.abs(shares) * S0 * Math.exp(state[0]);
    if (trace) {
      trace.times.push(horizon);
      trace.spot.push(S0 * Math.exp(state[0]));
      trace.variance.push(state[1]);
      trace.shares.push(0);
      trace.pnl.push(total);
    }
    return { total, jumpPart, eventPart };
  };
  return { request: req, steps: n, dt, horizon, premium, runPath };
}

/** The discounted P&L of one block's paths, and the parts booked on jump and move steps. */
export function replayBlock(plan: ReplayPlan, block: number): BlockPnl {
  const { request } = plan;
  const rng = new BlockRandom(request.seed, block);
  const count = Math.min(BLOCK_PATHS, request.paths - block * BLOCK_PATHS);
  const pnl = new Float64Array(count);
  const onJumps = new Float64Array(count);
  const onEvents = new Float64Array(count);
  const discount = discountFactor(request.market, plan.horizon);
  for (let p = 0; p < count; p++) {
    const { total, jumpPart, eventPart } = plan.runPath(rng, null);
    pnl[p] = total * discount;
    onJumps[p] = jumpPart * discount;
    onEvents[p] = eventPart * discount;
  }
  return { pnl, onJumps, onEvents };
}

/** Reruns the block of one path up to it and follows that path step by step. */
export function tracePath(plan: ReplayPlan, path: number): PathTrace {
  const block = Math.floor(path / BLOCK_PATHS);
  const rng = new BlockRandom(plan.request.seed, block);
  for (let p = block * BLOCK_PATHS; p < path; p++) plan.runPath(rng, null);
  const trace: PathTrace = {
    path,
    times: [],
    spot: [],
    variance: [],
    shares: [],
    pnl: [],
    jumps: [],
    events: [],
  };
  plan.runPath(rng, trace);
  return trace;
}

/** One run's blocks end to end, in block order: every path's P&L and its jump and move parts. */
export function joinBlocks(paths: number, blocks: readonly BlockPnl[]): BlockPnl {
  const pnl = new Float64Array(paths);
  const onJumps = new Float64Array(paths);
  const onEvents = new Float64Array(paths);
  blocks.forEach((b, i) => {
    pnl.set(b.pnl, i * BLOCK_PATHS);
    onJumps.set(b.onJumps, i * BLOCK_PATHS);
    onEvents.set(b.onEvents, i * BLOCK_PATHS);
  });
  return { pnl, onJumps, onEvents };
}

type RunMeta = Pick<ReplayPlan, 'request' | 'steps' | 'premium'>;

export function replayResult(meta: RunMeta, joined: BlockPnl, elapsedMs: number): ReplayResult {
  return {
    ...summariseReplay(joined.pnl, joined.onJumps, joined.onEvents),
    premium: meta.premium,
    steps: meta.steps,
    paths: meta.request.paths,
    elapsedMs,
  };
}

/** Puts blocks (in block order) together and summarises them, as one thread would. */
export function combineReplay(
  meta: RunMeta,
  blocks: readonly BlockPnl[],
  elapsedMs: number,
): ReplayResult & { pnlByPath: Float64Array } {
  const joined = joinBlocks(meta.request.paths, blocks);
  return { ...replayResult(meta, joined, elapsedMs), pnlByPath: joined.pnl };
}

export function replay(req: ReplayRequest): ReplayResult {
  const started = performance.now();
  const plan = planReplay(req);
  const blocks = Array.from({ length: blockCountFor(req.paths) }, (_, b) => replayBlock(plan, b));
  return replayResult(plan, joinBlocks(req.paths, blocks), performance.now() - started);
}
