/** The Book page's data: device-only books, their scenarios, and the revaluation in the worker. */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { LadderSpec, BookScenario, Position } from '../../../engine/book';
import { appDb, type LocalBook, type StoredScenario } from '../../../store/db';
import { createBook, updateBook } from '../../../store/books';
import { bookKeys, localBooksQuery, revaluationQuery } from '../api/queries';

export { localBooksQuery };

export function useCreateBook() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ name, scenarioIds }: { name: string; scenarioIds: string[] }) =>
      createBook(appDb(), name, scenarioIds),
    onSuccess: () => void qc.invalidateQueries({ queryKey: bookKeys.books }),
  });
}

export function useUpdateBook() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, change }: { id: string; change: Parameters<typeof updateBook>[2] }) =>
      updateBook(appDb(), id, change),
    onSuccess: () => void qc.invalidateQueries({ queryKey: bookKeys.books }),
  });
}

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
  set: LocalBook | undefined,
  scenarios: StoredScenario[],
  ladder: LadderSpec,
  volReaction: number,
) {
  const members = set ? scenarios.filter((s) => set.scenarioIds.includes(s.id)) : [];
  const base = members.find((s) => s.id === set?.baseScenarioId) ?? members[0];
  const request =
    set && base && set.positions.length > 0
      ? {
          base: asBookScenario(base, false),
          scenarios: members.map((s) => asBookScenario(s, true)),
          positions: set.positions as Position[],
          ladder,
          volReaction,
        }
      : null;
  return useQuery(revaluationQuery(request));
}
