import { QueryClient } from '@tanstack/react-query';
import { ApiProblem, unauthorized } from './api-client';

/** One client for the app; a 4xx is an answer, not a hiccup, so it is never retried. */
export const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      staleTime: 60_000,
      retry: (count, error) =>
        !(error instanceof ApiProblem && error.status >= 400 && error.status < 500) && count < 2,
    },
  },
});

// A 401 anywhere means the session has ended: show the person as signed out.
unauthorized.addEventListener('401', () => queryClient.setQueryData(['me'], null));
