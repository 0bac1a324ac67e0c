import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from './client';

export interface Health {
  ok: boolean;
  database: 'up' | 'down';
}

export type ServiceState = 'online' | 'degraded' | 'offline';

export const healthQuery = queryOptions({
  queryKey: ['service', 'health'],
  queryFn: async (): Promise<ServiceState> => {
    try {
      const h = await apiFetch<Health>('/health');
      return h.ok ? 'online' : 'degraded';
    } catch (error) {
      const status = (error as { status?: number }).status;
      return status === 503 ? 'degraded' : 'offline';
    }
  },
  refetchInterval: 15_000,
  retry: false,
});
