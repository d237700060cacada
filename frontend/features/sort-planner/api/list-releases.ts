import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '../../../lib/api-client';
import { planKeys } from '../plan-keys';

export interface ReleaseSummary {
  version: string;
  createdAt: string;
  checksum: string;
  changes: number;
}

export const listReleases = (signal?: AbortSignal) =>
  apiGet<{ items: ReleaseSummary[] }>('/api/v1/releases', signal);

export function releasesQueryOptions() {
  return queryOptions({
    queryKey: planKeys.releases(),
    queryFn: ({ signal }) => listReleases(signal),
  });
}

/** Published releases, newest first: what a saved plan can be re-evaluated against. */
export function useReleases() {
  return useQuery(releasesQueryOptions());
}
