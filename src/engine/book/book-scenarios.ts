/** A scenario set's revaluation: base, each scenario's P&L by leg, ladders and the jump law. */
import {
  bookTotal,
  ladderMoves,
  legRisks,
  legValuesAtMoves,
  stickyStrikeValuesAtMoves,
  sumRow,
  type BookTotal,
  type LadderSpec,
  type LegRisk,
} from './book';
import { jumpMoveProbabilities } from './jump-law';
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
  base: { legs: LegRisk[]; total: BookTotal };
  scenarios: ScenarioPnl[];
  moves: number[];
  /** ladder P&L of the base scenario's model, and of sticky-strike Black-Scholes */
  baseLadder: number[];
  stickyStrikeLadder: number[];
  /** probability of a jump into each ladder bin within a day and within a week (base model) */
  jumpPerDay: number[];
  jumpPerWeek: number[];
  elapsedMs: number;
}

function ladderPnl(values: Float64Array[], now: number): number[] {
  return values.map((row) => sumRow(row) - now);
}

export function revalueSet(
  base: BookScenario,
  scenarios: readonly BookScenario[],
  positions: readonly Position[],
  ladder: LadderSpec,
): SetRevaluation {
  const started = performance.now();
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
  const results: ScenarioPnl[] = scenarios.map((s) => {
    const stressed = applyStress(s.market, s.model, s.stress ?? {});
    if (stressed.issues.length > 0)
      return {
        id: s.id,
        name: s.name,
        legPnl: null,
        total: null,
        issues: stressed.issues,
        ladder: null,
      };
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
  return {
    base: { legs, total },
    scenarios: results,
    moves,
    baseLadder,
    stickyStrikeLadder,
    jumpPerDay: jumpMoveProbabilities(base.model, moves, 1 / 365),
    jumpPerWeek: jumpMoveProbabilities(base.model, moves, 7 / 365),
    elapsedMs: performance.now() - started,
  };
}
