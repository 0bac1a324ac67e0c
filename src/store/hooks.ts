/** TanStack Query over the local store, with explicit invalidation after writes. */
import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import type { ScenarioDocument } from '../engine/schema';
import { appDb } from './db';
import { deleteScenario, getScenario, listScenarios, saveScenario } from './scenarios';

export const localScenariosQuery = queryOptions({
  queryKey: ['local', 'scenarios'],
  queryFn: () => listScenarios(appDb()),
  staleTime: Infinity,
});

export const localScenarioQuery = (id: string) =>
  queryOptions({
    queryKey: ['local', 'scenario', id],
    queryFn: async () => (await getScenario(appDb(), id)) ?? null,
    staleTime: Infinity,
  });

export function useSaveScenario() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (doc: ScenarioDocument) => saveScenario(appDb(), doc),
    onSuccess: (stored) => {
      void qc.invalidateQueries({ queryKey: ['local', 'scenarios'] });
      qc.setQueryData(['local', 'scenario', stored.id], stored);
    },
  });
}

export function useDeleteScenario() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => deleteScenario(appDb(), id),
    onSuccess: () => void qc.invalidateQueries({ queryKey: ['local'] }),
  });
}
