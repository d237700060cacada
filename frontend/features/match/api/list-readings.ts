import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '../../../lib/api-client';
import type { Reading } from '../../../lib/api-types';

export const readingKeys = { all: ['readings'] as const };

export function listReadings(signal?: AbortSignal): Promise<{ items: Reading[] }> {
  return apiGet('/api/v1/readings', signal);
}

export function readingsQueryOptions() {
  return queryOptions({ queryKey: readingKeys.all, queryFn: ({ signal }) => listReadings(signal) });
}

export function useReadings() {
  return useQuery(readingsQueryOptions());
}
