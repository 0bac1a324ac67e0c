/**
 * A wing-hedge suggestion by the replay's own measure: on a small pilot run (the same seed and
 * paths as the full replay), the P&L of the delta-hedged position and of each candidate option
 * added to it, one unit at a time, on a common step grid. Without costs the hedged P&L is linear
 * in the quantities (the model's tables are linear in the legs), so the overlay that minimises
 * the expected shortfall at 99 % is a linear programme (Rockafellar & Uryasev 2000, "Optimization
 * of conditional value-at-risk"): minimise α + Σ u_i / ((1 − β)N) subject to
 * u_i ≥ −(b_i + Σ q_j c_ij) − α, u_i ≥ 0, Σ q_j·price_j ≤ budget, 0 ≤ q_j ≤ cap, solved by
 * javascript-lp-solver. Costs make the per-option parts approximate; the full replay is exact.
 */
import solver, { type SolveResult } from 'javascript-lp-solver';
import { blockCountFor, planReplay, replayBlock, type ReplayRequest } from './replay';
import { BLOCK_PATHS } from '../paths/simulate';
import { solvedQuantities } from '../book/wing-hedge';
import type { OptionSpec } from '../core/types';

export interface PilotWingRequest {
  /** position, hedge, market, model and seed; paths is the pilot's path count */
  replay: ReplayRequest;
  instruments: OptionSpec[];
  budget: number;
  /** the most of any one option, as a multiple of the position's total quantity */
  maxRatio?: number;
}

export interface PilotWingHedge {
  quantities: number[];
  prices: number[];
  premium: number;
  /** the pilot's ES99 (mean P&L of the worst 1 %, negative a loss) before and after */
  esBefore: number;
  esAfter: number;
  paths: number;
}

/** Pilot P&L per path, discounted, for a request whose overlay is given explicitly. */
function pilotPnl(request: ReplayRequest): { pnl: Float64Array; overlayPremium: number } {
  const plan = planReplay(request);
  const pnl = new Float64Array(request.paths);
  for (let b = 0; b < blockCountFor(request.paths); b++)
    pnl.set(replayBlock(plan, b).pnl, b * BLOCK_PATHS);
  return { pnl, overlayPremium: plan.overlayPremium };
}

/** The mean of the worst 1 % of values (at least one). */
export function meanOfWorstPercent(values: Float64Array): number {
  const sorted = Float64Array.from(values).sort();
  const tail = Math.max(1, Math.floor(0.01 * values.length));
  let sum = 0;
  for (let i = 0; i < tail; i++) sum += sorted[i];
  return sum / tail;
}

export function suggestWingHedgeByReplay(req: PilotWingRequest): PilotWingHedge {
  const { instruments } = req;
  // every run carries every candidate (at quantity 0 but one), so all share one step grid and
  // one stream of random numbers
  const withUnits = (j: number) => ({
    ...req.replay,
    overlay: instruments.map((o, i) => ({ ...o, quantity: i === j ? 1 : 0 })),
  });
  const base = pilotPnl(withUnits(-1)).pnl;
  const parts = instruments.map((_, j) => {
    const run = pilotPnl(withUnits(j));
    return { pnl: run.pnl.map((v, i) => v - base[i]), price: run.overlayPremium };
  });
  const prices = parts.map((p) => p.price);
  const N = base.length;
  const beta = 0.99;
  const size = req.replay.position.reduce((a, l) => a + Math.abs(l.quantity), 0);
  const cap = (req.maxRatio ?? 10) * Math.max(1, size);
  const constraints: Record<string, { min?: number; max?: number }> = {
    budget: { max: Math.max(0, req.budget) },
  };
  const variables: Record<string, Record<string, number>> = { alpha: { es: 1 } };
  for (let i = 0; i < N; i++) {
    constraints[`p${i}`] = { min: -base[i] };
    variables.alpha[`p${i}`] = 1;
    variables[`u${i}`] = { es: 1 / ((1 - beta) * N), [`p${i}`]: 1 };
  }
  parts.forEach((part, j) => {
    const column: Record<string, number> = { budget: prices[j], [`cap${j}`]: 1 };
    for (let i = 0; i < N; i++) column[`p${i}`] = part.pnl[i];
    variables[`q${j}`] = column;
    constraints[`cap${j}`] = { max: cap };
  });
  const solution = solver.Solve({
    optimize: 'es',
    opType: 'min',
    constraints,
    variables,
    unrestricted: { alpha: 1 },
  }) as SolveResult;
  const quantities = solvedQuantities(solution, prices, req.budget);
  const after = base.map((b, i) => b + quantities.reduce((a, q, j) => a + q * parts[j].pnl[i], 0));
  return {
    quantities,
    prices,
    premium: quantities.reduce((a, q, j) => a + q * prices[j], 0),
    esBefore: meanOfWorstPercent(base),
    esAfter: meanOfWorstPercent(after),
    paths: N,
  };
}
