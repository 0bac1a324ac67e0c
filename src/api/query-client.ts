import { QueryClient } from '@tanstack/react-query';

// networkMode 'always': most queries and mutations read and write IndexedDB and must run
// offline; service calls fail fast offline and their callers fall back to local state
export const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      retry: 1,
      refetchOnWindowFocus: false,
      staleTime: 10_000,
      networkMode: 'always',
    },
    mutations: { networkMode: 'always' },
  },
});
