import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { alloyKeys } from '../../../lib/alloy-keys';
import { apiGet } from '../../../lib/api-client';
import type { Alloy } from '../../../lib/api-types';

export function getAlloy(slug: string, signal?: AbortSignal): Promise<Alloy> {
  return apiGet<Alloy>(`/api/v1/alloys/${encodeURIComponent(slug)}`, signal);
}

export function alloyQueryOptions(slug: string) {
  return queryOptions({
    queryKey: alloyKeys.detail(slug),
    queryFn: ({ signal }) => getAlloy(slug, signal),
  });
}

export function useAlloy(slug: string) {
  return useSuspenseQuery(alloyQueryOptions(slug));
}
