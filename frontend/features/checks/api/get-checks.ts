import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '../../../lib/api-client';
import type { Checks } from '../../../lib/api-types';

export const checkKeys = { all: ['checks'] as const };

export function getChecks(signal?: AbortSignal): Promise<Checks> {
  return apiGet<Checks>('/api/v1/checks', signal);
}

export function checksQueryOptions() {
  return queryOptions({ queryKey: checkKeys.all, queryFn: ({ signal }) => getChecks(signal) });
}

/**
 * A plain query, not a suspense one: the server runs the engine checks on the first call (a
 * moment), and the screen says so while it waits instead of holding up the navigation.
 */
export function useChecks() {
  return useQuery(checksQueryOptions());
}
