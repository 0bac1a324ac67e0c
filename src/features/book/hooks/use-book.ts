/** The Book page's revaluation and jump exposure in the worker, over the book's scenarios. */
import { useQuery } from '@tanstack/react-query';
import type { LadderSpec, BookScenario } from '../../../engine/book';
import type { StoredScenario } from '../../../store/db';
import { jumpExposureQuery, revaluationQuery } from '../api/queries';
import type { OpenBook } from './use-book-source';

export const DEFAULT_LADDER: LadderSpec = { from: -0.3, to: 0.1, steps: 41 };

function asBookScenario(s: StoredScenario, withStress: boolean): BookScenario {
  return {
    id: s.id,
    name: s.name,
    market: s.document.market,
    model: s.document.model,
    stress: withStress ? s.document.stress : undefined,
  };
}

export function useRevaluation(
  book: OpenBook | undefined,
  scenarios: StoredScenario[],
  ladder: LadderSpec,
  volReaction: number,
) {
  const members = book ? scenarios.filter((s) => book.scenarioIds.includes(s.id)) : [];
  const base = members.find((s) => s.id === book?.baseScenarioId) ?? members[0];
  const request =
    book && base && book.positions.length > 0
      ? {
          base: asBookScenario(base, false),
          scenarios: members.map((s) => asBookScenario(s, true)),
          positions: book.positions,
          ladder,
          volReaction,
        }
      : null;
  const revaluation = useQuery(revaluationQuery(request));
  // the jump exposure needs only the base: a scenario's stress does not recompute it
  const exposure = useQuery(jumpExposureQuery(request && { ...request, scenarios: [] }));
  return { revaluation, exposure };
}
