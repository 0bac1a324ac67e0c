/** TanStack Query over the local store, with explicit invalidation after writes. */
import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import type { ScenarioDocument } from '../engine/core';
import { nudgeSync } from '../sync/sync-loop';
import { appDb } from './db';
import { getScenario, listScenarios, saveScenario } from './scenarios';

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
      nudgeSync();
    },
  });
}

/** How much of this device's work is not on the service yet. */
export const unsyncedQuery = queryOptions({
  queryKey: ['local', 'unsynced'],
  queryFn: async () => {
    const db = appDb();
    // scenarios and the desk's books alike
    const [pending, conflicts, bookPending, bookConflicts, outbox] = await Promise.all([
      db.scenarios.where('syncState').equals('pending').count(),
      db.scenarios.where('syncState').equals('conflict').count(),
      db.deskBooks.where('syncState').equals('pending').count(),
      db.deskBooks.where('syncState').equals('conflict').count(),
      db.outbox.count(),
    ]);
    return { pending: pending + bookPending, conflicts: conflicts + bookConflicts, outbox };
  },
  staleTime: Infinity,
});

export const remoteSetsQuery = queryOptions({
  queryKey: ['local', 'remote-sets'],
  queryFn: () => appDb().remoteSets.orderBy('id').toArray(),
  staleTime: Infinity,
});
