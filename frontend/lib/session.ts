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

/**
 * A `next` location to return to after signing in, if it is a path on this site; anything else
 * (another origin, `//host`, `/\host`, a scheme, the sign-in page itself) gives null, so a link
 * can never send a person off the site after they sign in.
 */
export function safeReturnPath(next: string | null | undefined): string | null {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\'))
    return null;
  // Backslashes and control characters: browsers read some of them as another host.
  if (next.includes('\\') || [...next].some((c) => c.charCodeAt(0) < 0x20)) return null;
  let url: URL;
  try {
    url = new URL(next, window.location.origin);
  } catch {
    return null;
  }
  if (url.origin !== window.location.origin) return null;
  if (['/sign-in', '/sign-up', '/reset', '/verify'].includes(url.pathname)) return null;
  return `${url.pathname}${url.search}${url.hash}`;
}

/** The sign-in page's address that comes back to `here` (a path with its query) afterwards. */
export function signInPath(here: string): string {
  const next = safeReturnPath(here);
  return next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in';
}
