/** The Library feature's query keys and options over the service. */
import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../api/client';
import type { Revision, ScenarioSet } from '../../../contracts';

export const libraryKeys = {
  sets: ['service', 'sets'] as const,
  revisions: (scenarioId: string) => ['service', 'revisions', scenarioId] as const,
};

export const setsQuery = queryOptions({
  queryKey: libraryKeys.sets,
  queryFn: () => apiFetch<{ sets: ScenarioSet[] }>('/sets'),
});

export const revisionsQuery = (scenarioId: string) =>
  queryOptions({
    queryKey: libraryKeys.revisions(scenarioId),
    queryFn: () => apiFetch<{ revisions: Revision[] }>(`/scenarios/${scenarioId}/revisions`),
    // fresh each time the history opens: a sync may have added a revision since
    staleTime: 0,
  });
