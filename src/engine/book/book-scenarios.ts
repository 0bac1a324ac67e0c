/** A scenario set's revaluation: base, each scenario's P&L by leg, ladders and the jump law. */
import {
  bookTotal,
  ladderMoves,
  legRisks,
  legValuesAtMoves,
  legValuesAtMovesSticky,
  stickyStrikeValuesAtMoves,
  volReactionValuesAtMoves,
  sumRow,
  type BookTotal,
  type LadderSpec,
  type LegRisk,
} from './book';
import { jumpMoveProbabilities } from './jump-law';
import { jumpExposure, type JumpExposure } from './jump-exposure';
import { pnlSinceTrade, vegaByExpiry, type SinceTrade } from './trade-pnl';
import {
  inUnderlyingUnits,
  otherUnderlying,
  totalsByCurrency,
  type CurrencyTotal,
} from './underlyings';
import type { Position } from './positions';
import { applyStress, type Stress } from '../core/stress';
import type { Market, Model } from '../core/types';
import type { FieldIssue } from '../core/validate';

export interface BookScenario {
  id: string;
  name: string;
  market: Market;
  model: Model;
  stress?: Partial<Stress>;
}

export interface ScenarioPnl {
  id: string;
  name: string;
  /** leg value under the scenario minus under base, by leg (null when the stress is invalid) */
  legPnl: number[] | null;
  total: number | null;
  issues: FieldIssue[];
  /** book P&L for each ladder move, revalued through the scenario's model */
  ladder: number[] | null;
}

export interface SetRevaluation {
  /** legs and total in units of the underlying (quantity × multiplier), all currencies */
  base: { legs: LegRisk[]; total: BookTotal };
  /** the base's totals per currency of the legs, on the base's one underlying */
  totals: CurrencyTotal[];
  /** P&L since trade of the legs with a trade price, under the base */
  sinceTrade: SinceTrade;
  /** the base's vega per vol point by expiry bucket */
  vegaByExpiry: { label: string; vega: number }[];
  scenarios: ScenarioPnl[];
  moves: number[];
  /**
   * ladder P&L of the base scenario's model; with the model held as it is (sticky moneyness:
   * the same as the model line except under SVCJ, whose variance reacts to a jump); of
   * sticky-strike Black-Scholes; and of sticky strike with the user's spot-vol reaction
   */
  baseLadder: number[];
  stickyMoneynessLadder: number[];
  stickyStrikeLadder: number[];
  volReactionLadder: number[];
  /** the spot-vol reaction used: ATM vol points added per 1 % fall */
  volReaction: number;
  /** probability of a jump into each ladder bin within a day and within a week (base model) */
  jumpPerDay: number[];
  jumpPerWeek: number[];
  elapsedMs: number;
}

/** The spot-vol reaction a new ladder starts from: vol points per 1 % fall (a user setting). */
export const DEFAULT_VOL_REACTION = 0.5;

function ladderPnl(values: Float64Array[], now: number): number[] {
  return values.map((row) => sumRow(row) - now);
}

export function revalueSet(
  base: BookScenario,
  scenarios: readonly BookScenario[],
  booked: readonly Position[],
  ladder: LadderSpec,
  volReaction = DEFAULT_VOL_REACTION,
): SetRevaluation {
  const started = performance.now();
  const positions = inUnderlyingUnits(booked);
  const moves = ladderMoves(ladder);
  const legs = legRisks(base.market, base.model, positions);
  const total = bookTotal(legs);
  const baseLadder = ladderPnl(
    legValuesAtMoves(base.market, base.model, positions, moves),
    total.value,
  );
  const stickyStrikeLadder = ladderPnl(
    stickyStrikeValuesAtMoves(base.market, positions, legs, moves),
    total.value,
  );
  const stickyMoneynessLadder = ladderPnl(
    legValuesAtMovesSticky(base.market, base.model, positions, moves),
    total.value,
  );
  const volReactionLadder = ladderPnl(
    volReactionValuesAtMoves(base.market, positions, legs, moves, volReaction),
    total.value,
  );
  const results: ScenarioPnl[] = scenarios.map((s) => {
    const elsewhere = otherUnderlying(base.market, s.market);
    const stressed = applyStress(s.market, s.model, s.stress ?? {});
    const issues = elsewhere
      ? [{ path: 'market.underlying', message: elsewhere }]
      : stressed.issues;
    if (issues.length > 0)
      return { id: s.id, name: s.name, legPnl: null, total: null, issues, ladder: null };
    // one pass over the ladder (with the zero move added if it is not on it) serves both
    const zero = moves.indexOf(0);
    const all = legValuesAtMoves(
      stressed.market,
      stressed.model,
      positions,
      zero >= 0 ? moves : [...moves, 0],
    );
    const now = all[zero >= 0 ? zero : moves.length];
    const legPnl = Array.from(now, (v, i) => v - legs[i].value);
    const value = sumRow(now);
    const scenarioLadder = ladderPnl(all.slice(0, moves.length), value);
    return {
      id: s.id,
      name: s.name,
      legPnl,
      total: value - total.value,
      issues: [],
      ladder: scenarioLadder,
    };
  });
  const sinceTrade = pnlSinceTrade(positions, legs);
  return {
    base: { legs, total },
    totals: totalsByCurrency(base.market, booked, legs, sinceTrade.legs),
    sinceTrade,
    vegaByExpiry: vegaByExpiry(positions, legs),
    scenarios: results,
    moves,
    baseLadder,
    stickyMoneynessLadder,
    stickyStrikeLadder,
    volReactionLadder,
    volReaction,
    jumpPerDay: jumpMoveProbabilities(base.model, moves, 1 / 365),
    jumpPerWeek: jumpMoveProbabilities(base.model, moves, 7 / 365),
    elapsedMs: performance.now() - started,
  };
}

/**
 * The base book's exposure to jumps: ladders less the delta part, the expected jump P&L and the
 * 1-day tail. Its own call, as it revalues every leg at some two thousand moves: the Book page
 * shows the revaluation first and this when it is ready.
 */
export function bookJumpExposure(
  base: BookScenario,
  booked: readonly Position[],
  ladder: LadderSpec,
  volReaction = DEFAULT_VOL_REACTION,
): JumpExposure {
  const positions = inUnderlyingUnits(booked);
  const moves = ladderMoves(ladder);
  const legs = legRisks(base.market, base.model, positions);
  const total = bookTotal(legs);
  return jumpExposure(base.market, base.model, positions, moves, total.delta, {
    model: ladderPnl(legValuesAtMoves(base.market, base.model, positions, moves), total.value),
    volReaction: ladderPnl(
      volReactionValuesAtMoves(base.market, positions, legs, moves, volReaction),
      total.value,
    ),
  });
}
