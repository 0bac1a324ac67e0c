/**
 * A wing-hedge suggestion: how many of each chosen option to buy so that the book's worst
 * ladder loss over a range of down moves (−30 % to −5 % by default) is as small as it can be,
 * for at most a premium budget. The ladder is the model's (instant moves revalued through the
 * model, as on the Book page), so the problem is linear in the quantities: minimise t subject to
 * −(L_book(m) + Σ q_j L_j(m)) ≤ t at every move m, t ≥ 0, Σ q_j·price_j ≤ budget, 0 ≤ q_j ≤ cap,
 * a linear programme solved by javascript-lp-solver's simplex. The floor t ≥ 0 and a small
 * premium term in the objective make it buy no more than it takes to stop the worst loss, and
 * the cheapest mix that does: turning a crash into a gain is not what a wing hedge is for.
 */
import solver, { type SolveResult } from 'javascript-lp-solver';
import { priceOptions } from '../analytic/pricing';
import { ladderMoves, legValuesAtMoves, sumRow } from './book';
import type { Position } from './positions';
import { inUnderlyingUnits } from './underlyings';
import type { Market, Model, OptionSpec } from '../core/types';

export interface WingHedgeRequest {
  /** the options to choose from (puts, usually), one unit each on one unit of underlying */
  instruments: OptionSpec[];
  /** the premium the hedge may cost at most */
  budget: number;
  /** the down moves whose worst loss is minimised */
  from?: number;
  to?: number;
  steps?: number;
  /** the most of any one option, as a multiple of the book's total option quantity */
  maxRatio?: number;
}

export interface WingHedge {
  /** the quantity to buy of each instrument (0 for those not used) */
  quantities: number[];
  /** each instrument's model price per unit */
  prices: number[];
  /** Σ quantity × price */
  premium: number;
  moves: number[];
  /** the book's ladder P&L over the moves, before and after the hedge (hedge premium included) */
  before: number[];
  after: number[];
  worstBefore: number;
  worstAfter: number;
}

export const DEFAULT_WING_RANGE = { from: -0.3, to: -0.05, steps: 26 } as const;

interface LadderParts {
  moves: number[];
  before: number[];
  /** per instrument and move: its ladder P&L per unit */
  unit: number[][];
  prices: number[];
}

function ladderParts(
  market: Market,
  model: Model,
  positions: readonly Position[],
  req: Pick<WingHedgeRequest, 'instruments' | 'from' | 'to' | 'steps'>,
): LadderParts {
  const units = inUnderlyingUnits(positions);
  const moves = ladderMoves({
    from: req.from ?? DEFAULT_WING_RANGE.from,
    to: req.to ?? DEFAULT_WING_RANGE.to,
    steps: req.steps ?? DEFAULT_WING_RANGE.steps,
  });
  const all = [0, ...moves];
  const bookRows = legValuesAtMoves(market, model, units, all).map(sumRow);
  const before = moves.map((_, i) => bookRows[i + 1] - bookRows[0]);
  const legs: Position[] = req.instruments.map((o, j) => ({
    id: `hedge-${j}`,
    type: o.type,
    strike: o.strike,
    expiry: o.expiry,
    quantity: 1,
  }));
  const values = legValuesAtMoves(market, model, legs, all);
  const prices = priceOptions(market, model, req.instruments).map((p) => p.price);
  const unit = req.instruments.map((_, j) => moves.map((_, i) => values[i + 1][j] - values[0][j]));
  return { moves, before, unit, prices };
}

function withQuantities(parts: LadderParts, quantities: number[]): WingHedge {
  const { moves, before, unit, prices } = parts;
  const after = before.map((b, i) => b + quantities.reduce((a, q, j) => a + q * unit[j][i], 0));
  return {
    quantities,
    prices,
    premium: quantities.reduce((a, q, j) => a + q * prices[j], 0),
    moves,
    before,
    after,
    worstBefore: Math.min(...before),
    worstAfter: Math.min(...after),
  };
}

/** The ladder before and after a given overlay of the instruments (from any objective). */
export function wingLadder(
  market: Market,
  model: Model,
  positions: readonly Position[],
  instruments: WingHedgeRequest['instruments'],
  quantities: number[],
): WingHedge {
  return withQuantities(ladderParts(market, model, positions, { instruments }), quantities);
}

export function suggestWingHedge(
  market: Market,
  model: Model,
  positions: readonly Position[],
  req: WingHedgeRequest,
): WingHedge {
  const parts = ladderParts(market, model, positions, req);
  const { moves, before, unit, prices } = parts;
  const size = inUnderlyingUnits(positions).reduce(
    (a, p) => a + (p.type === 'underlying' ? 0 : Math.abs(p.quantity)),
    0,
  );
  const cap = (req.maxRatio ?? 10) * Math.max(1, size);
  const constraints: Record<string, { min?: number; max?: number }> = {
    budget: { max: Math.max(0, req.budget) },
  };
  moves.forEach((_, i) => (constraints[`m${i}`] = { min: -before[i] }));
  const variables: Record<string, Record<string, number>> = {
    worst: Object.fromEntries([['worst', 1], ...moves.map((_, i) => [`m${i}`, 1])]),
  };
  req.instruments.forEach((_, j) => {
    variables[`q${j}`] = Object.fromEntries([
      ['budget', prices[j]],
      [`cap${j}`, 1],
      ...moves.map((_, i) => [`m${i}`, unit[j][i]]),
    ]);
    constraints[`cap${j}`] = { max: cap };
  });
  // the premium's weight: small beside a unit of loss, so it only breaks ties among optimal mixes
  const tie = 1e-6;
  req.instruments.forEach((_, j) => (variables[`q${j}`].worst = tie * prices[j]));
  const solution = solver.Solve({
    optimize: 'worst',
    opType: 'min',
    constraints,
    variables,
  }) as SolveResult;
  return withQuantities(parts, solvedQuantities(solution, prices, req.budget));
}

/**
 * The quantities q0, q1, … of a solved programme (0 where it found none), scaled back onto the
 * budget when the solver's rounding tipped the premium over it.
 */
export function solvedQuantities(
  solution: SolveResult,
  prices: number[],
  budget: number,
): number[] {
  const quantities = prices.map((_, j) => {
    const q = solution.feasible ? Number(solution[`q${j}`] ?? 0) : 0;
    return q > 1e-9 ? q : 0;
  });
  const raw = quantities.reduce((a, q, j) => a + q * prices[j], 0);
  return raw > budget && raw > 0 ? quantities.map((q) => (q * budget) / raw) : quantities;
}
