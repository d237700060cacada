import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { alloyKeys } from '../../../lib/alloy-keys';
import { apiGet } from '../../../lib/api-client';
import type { AlloyPage } from '../../../lib/api-types';

export function listAlloys(query: URLSearchParams, signal?: AbortSignal): Promise<AlloyPage> {
  return apiGet<AlloyPage>(`/api/v1/alloys?${query.toString()}`, signal);
}

export function alloyListQueryOptions(query: URLSearchParams) {
  const key = query.toString();
  return queryOptions({
    queryKey: alloyKeys.list({ query: key }),
    queryFn: ({ signal }) => listAlloys(new URLSearchParams(key), signal),
    // While a new search runs, keep showing the last answer rather than an empty table.
    placeholderData: keepPreviousData,
  });
}

export function useAlloyList(query: URLSearchParams) {
  return useQuery(alloyListQueryOptions(query));
}
