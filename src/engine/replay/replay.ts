/**
 * Hedge replay: a position of European legs, bought at the model's price, with an optional
 * overlay of options bought or sold at inception and held to their expiry, hedged at each
 * rebalance (no hedge, Black-Scholes delta at a hedge vol, the model's own delta from a
 * precomputed table, or a hedge option held to zero the model gamma or vega with the rest of
 * the delta in the underlying), with proportional costs and financing at the scenario's rate,
 * over simulated paths of the scenario's model. Each step's P&L (mark-to-model of the
 * position plus the hedge and cash) is booked to "jumps" when the step had a jump and to
 * "diffusion" otherwise. Paths are seeded per block as in the Monte Carlo, so a replay is
 * bit-identical across machines and worker counts.
 */
import { modelSpec } from '../analytic/characteristic';
import { buildHedgeTable, lookup, type Leg } from './hedge-table';
import { isOptionHedge, planOptionHedge, type HedgeInstrument } from './option-hedge';
import { discountFactor, dividendRate, forwardPrice, riskFreeRate } from '../core/market';
import { normCdf } from '../analytic/normal';
import { drawMove, jumpSampler, meanRelativeJump } from '../paths/path-step';
import { settlementStep, stepGrid } from '../paths/step-grid';
import { stepAdvances, BLOCK_PATHS } from '../paths/simulate';
import { priceOptions } from '../analytic/pricing';
import { BlockRandom } from '../paths/random';
import { summariseReplay, type ReplaySummary } from './replay-summary';
import type { Market, Model } from '../core/types';

export type HedgeMethod =
  'none' | 'bs-delta' | 'model-delta' | 'model-delta-gamma' | 'model-delta-vega';

export interface HedgeSettings {
  method: HedgeMethod;
  rebalancesPerDay: number;
  /**
   * proportional cost of each trade, in basis points of its value: the underlying's value for
   * trades in it, the option's premium for trades in the hedge option
   */
  costBps: number;
  /** Black-Scholes hedge vol; each leg's implied vol at inception when absent */
  hedgeVol?: number;
  /** the option held against the model gamma or vega (model-delta-gamma, model-delta-vega) */
  instrument?: HedgeInstrument;
}

export interface ReplayRequest {
  market: Market;
  model: Model;
  position: Leg[];
  /** options bought (quantity > 0) or sold at inception at the model's price, held to expiry */
  overlay?: Leg[];
  hedge: HedgeSettings;
  paths: number;
  seed: number;
}

export interface ReplayResult extends ReplaySummary {
  /** what the position cost at inception (negative: premium received) */
  premium: number;
  /** what the overlay cost at inception (0 without one) */
  overlayPremium: number;
  steps: number;
  paths: number;
  elapsedMs: number;
}

/**
 * One block's per-path P&L, the parts of it booked on jump steps and on scheduled-move steps,
 * and the overlay's own P&L (its payoffs less its premium, unhedged).
 */
export interface BlockPnl {
  pnl: Float64Array;
  onJumps: Float64Array;
  onEvents: Float64Array;
  overlay: Float64Array;
}

/** One path followed step by step, for drill-down: values at each rebalance and at the end. */
export interface PathTrace {
  path: number;
  times: number[];
  spot: number[];
  variance: number[];
  /** shares of the underlying held after the rebalance at that time */
  shares: number[];
  /** the hedge option held after the rebalance at that time (option hedges only) */
  options?: number[];
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
  overlayPremium: number;
  runPath: (rng: BlockRandom, trace: PathTrace | null) => PathPnl;
}

/** One path's P&L (undiscounted), the parts on jump and move steps, and the overlay's own. */
export interface PathPnl {
  total: number;
  jumpPart: number;
  eventPart: number;
  overlayPart: number;
}

/** The last expiry among the position and the overlay: the replay's horizon. */
export const replayHorizon = (req: Pick<ReplayRequest, 'position' | 'overlay'>): number =>
  Math.max(...req.position.map((l) => l.expiry), ...(req.overlay ?? []).map((l) => l.expiry));

export function blockCountFor(paths: number): number {
  return Math.ceil(paths / BLOCK_PATHS);
}

export function planReplay(req: ReplayRequest): ReplayPlan {
  const { market, model, hedge } = req;
  const overlay = req.overlay ?? [];
  // the hedge sees the position and the overlay as one book
  const position = overlay.length > 0 ? [...req.position, ...overlay] : req.position;
  const horizon = replayHorizon(req);
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
  const table = buildHedgeTable(market, model, position, times, {
    vega: hedge.method === 'model-delta-vega',
  });
  const inception = priceOptions(market, model, position);
  const nOwn = req.position.length;
  let premium = 0;
  let overlayPremium = 0;
  position.forEach((l, i) => {
    if (i < nOwn) premium += l.quantity * inception[i].price;
    else overlayPremium += l.quantity * inception[i].price;
  });
  const optionHedge = planOptionHedge(req, times, horizon, table);
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
  const overlaySettles = settles.map((legs) => legs.filter((l) => overlay.includes(l)));
  const overlayPayoff = (k: number, S: number) => {
    let a = 0;
    for (const l of overlaySettles[k])
      a += l.quantity * Math.max(0, l.type === 'call' ? S - l.strike : l.strike - S);
    return a;
  };
  const runPath = (rng: BlockRandom, trace: PathTrace | null) => {
    state[0] = 0;
    state[1] = v0;
    let shares = 0;
    let cash = -(premium + overlayPremium);
    let mark = premium + overlayPremium;
    let overlayCash = -overlayPremium;
    let total = 0;
    let jumpPart = 0;
    let eventPart = 0;
    // the hedge option: quantity held and its value per unit at the start of the step
    let held = 0;
    let unit = 0;
    for (let k = 0; k < n; k++) {
      const S = S0 * Math.exp(state[0]);
      // (after the first step the option's value here is the one marked at the end of the last)
      if (optionHedge && k === 0) unit = optionHedge.unitValue(0, state[1], state[0]);
      // the portfolio's value at the start of the step
      const before = mark + held * unit + shares * S + cash;
      // rebalance; the cost is part of this step's P&L
      let target: number;
      if (optionHedge) {
        const h = optionHedge.holdings(k, state[1], state[0], held);
        const optionTrade = h.options - held;
        cash -= optionTrade * unit + cost * Math.abs(optionTrade) * Math.abs(unit);
        held = h.options;
        target = h.shares;
      } else target = hedgeDelta(k, state[0], state[1]);
      const trade = target - shares;
      cash -= trade * S + cost * Math.abs(trade) * S;
      shares = target;
      if (trace) {
        trace.times.push(times[k]);
        trace.spot.push(S);
        trace.variance.push(state[1]);
        trace.shares.push(shares);
        trace.options?.push(held);
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
      if (overlay.length > 0) overlayCash = overlayCash * accrual[k] + overlayPayoff(k + 1, S1);
      mark =
        k + 1 >= n
          ? 0
          : optionHedge
            ? optionHedge.bookValue(k + 1, state[1], state[0])
            : lookup(table, k + 1, state[1], state[0], S0).value;
      if (optionHedge) unit = optionHedge.unitValue(k + 1, state[1], state[0]);
      const step = mark + held * unit + shares * S1 + cash - before;
      total += step;
      // a step with a scheduled move is booked to it, even when a jump came too
      if (moves.length > 0) eventPart += step;
      else if (jumped) jumpPart += step;
    }
    // liquidate the hedge at the end
    total -= cost * Math.abs(shares) * S0 * Math.exp(state[0]);
    total -= cost * Math.abs(held) * Math.abs(unit);
    if (trace) {
      trace.times.push(horizon);
      trace.spot.push(S0 * Math.exp(state[0]));
      trace.variance.push(state[1]);
      trace.shares.push(0);
      trace.options?.push(0);
      trace.pnl.push(total);
    }
    return { total, jumpPart, eventPart, overlayPart: overlayCash };
  };
  return { request: req, steps: n, dt, horizon, premium, overlayPremium, runPath };
}

/** The discounted P&L of one block's paths, and the parts booked on jump and move steps. */
export function replayBlock(plan: ReplayPlan, block: number): BlockPnl {
  const { request } = plan;
  const rng = new BlockRandom(request.seed, block);
  const count = Math.min(BLOCK_PATHS, request.paths - block * BLOCK_PATHS);
  const pnl = new Float64Array(count);
  const onJumps = new Float64Array(count);
  const onEvents = new Float64Array(count);
  const overlay = new Float64Array(count);
  const discount = discountFactor(request.market, plan.horizon);
  for (let p = 0; p < count; p++) {
    const { total, jumpPart, eventPart, overlayPart } = plan.runPath(rng, null);
    pnl[p] = total * discount;
    onJumps[p] = jumpPart * discount;
    onEvents[p] = eventPart * discount;
    overlay[p] = overlayPart * discount;
  }
  return { pnl, onJumps, onEvents, overlay };
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
    ...(plan.request.hedge.instrument && isOptionHedge(plan.request.hedge.method)
      ? { options: [] }
      : {}),
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
  const overlay = new Float64Array(paths);
  blocks.forEach((b, i) => {
    pnl.set(b.pnl, i * BLOCK_PATHS);
    onJumps.set(b.onJumps, i * BLOCK_PATHS);
    onEvents.set(b.onEvents, i * BLOCK_PATHS);
    overlay.set(b.overlay, i * BLOCK_PATHS);
  });
  return { pnl, onJumps, onEvents, overlay };
}

type RunMeta = Pick<ReplayPlan, 'request' | 'steps' | 'premium' | 'overlayPremium'>;

export function replayResult(meta: RunMeta, joined: BlockPnl, elapsedMs: number): ReplayResult {
  return {
    ...summariseReplay(
      joined.pnl,
      joined.onJumps,
      joined.onEvents,
      (meta.request.overlay?.length ?? 0) > 0 ? joined.overlay : null,
    ),
    premium: meta.premium,
    overlayPremium: meta.overlayPremium,
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
