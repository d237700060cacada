import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { components } from '../../shared/api/openapi-types';
import { ApiProblem, apiGet, apiPost } from './api-client';

export type Me = components['schemas']['Me'];
export const sessionKeys = { me: ['me'] as const };

/** The signed-in person, or null for a visitor (a 401 here is an answer, not an error). */
export function meQueryOptions() {
  return queryOptions({
    queryKey: sessionKeys.me,
    queryFn: async ({ signal }) => {
      try {
        return await apiGet<Me>('/api/v1/me', signal);
      } catch (error) {
        if (error instanceof ApiProblem && error.status === 401) return null;
        throw error;
      }
    },
    staleTime: 60_000,
  });
}

export function useMe() {
  return useQuery(meQueryOptions());
}

export function useSignOut() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: () => apiPost<void>('/api/v1/auth/sign-out', {}),
    onSettled: () => client.setQueryData(sessionKeys.me, null),
  });
}
