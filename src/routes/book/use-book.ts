/** The Book page's data: local sets, their scenarios, and the set's revaluation in the worker. */
import {
  keepPreviousData,
  queryOptions,
  useMutation,
  useQuery,
  useQueryClient,
} from '@tanstack/react-query';
import type { LadderSpec } from '../../engine/book';
import type { BookScenario } from '../../engine/book';
import type { Position } from '../../engine/book';
import { appDb, type LocalScenarioSet, type StoredScenario } from '../../store/db';
import { createSet, listSets, updateSet } from '../../store/sets';
import { engineWorker } from '../../workers/engine-client';

export const setsQuery = queryOptions({
  queryKey: ['local', 'sets'],
  queryFn: () => listSets(appDb()),
  staleTime: Infinity,
});

export function useCreateSet() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ name, scenarioIds }: { name: string; scenarioIds: string[] }) =>
      createSet(appDb(), name, scenarioIds),
    onSuccess: () => void qc.invalidateQueries({ queryKey: ['local', 'sets'] }),
  });
}

export function useUpdateSet() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, change }: { id: string; change: Parameters<typeof updateSet>[2] }) =>
      updateSet(appDb(), id, change),
    onSuccess: () => void qc.invalidateQueries({ queryKey: ['local', 'sets'] }),
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
  set: LocalScenarioSet | undefined,
  scenarios: StoredScenario[],
  ladder: LadderSpec,
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
        }
      : null;
  return useQuery({
    queryKey: ['engine', 'book', request],
    queryFn: () => engineWorker().book(request!),
    enabled: request !== null,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
    gcTime: 60_000,
  });
}
