import { QueryClient } from '@tanstack/react-query';
import { ApiRequestError } from './api-client';

// networkMode 'always': a tablet whose Wi-Fi dropped says so, and a signed check goes to its send queue, at once.
// TanStack's default ('online') would instead pause every read and every signing while the browser says offline,
// leaving "Sending…" on screen with nothing queued.
export const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      networkMode: 'always',
      staleTime: 10_000,
      // A 4xx will not get better by asking again; a dropped hangar Wi-Fi might.
      retry: (failureCount, error) =>
        !(error instanceof ApiRequestError && error.status < 500) && failureCount < 2,
      refetchOnWindowFocus: false,
    },
    mutations: { retry: false, networkMode: 'always' },
  },
});
