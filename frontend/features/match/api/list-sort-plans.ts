import { queryOptions, useQuery } from '@tanstack/react-query';
import type { components } from '../../../../shared/api/openapi-types';
import { apiGet } from '../../../lib/api-client';

export type SortPlanSummary = components['schemas']['SortPlanSummary'];

/**
 * The same key as the Sort Planner's list of saved plans (features do not import each other):
 * a plan saved or deleted there refreshes this list too.
 */
export const sortPlanKeys = {
  all: ['sort-plans'] as const,
  lists: () => [...sortPlanKeys.all, 'list'] as const,
};

export const listSortPlans = (signal?: AbortSignal) =>
  apiGet<{ items: SortPlanSummary[] }>('/api/v1/sort-plans', signal);

export function sortPlansQueryOptions(enabled: boolean) {
  return queryOptions({
    queryKey: sortPlanKeys.lists(),
    queryFn: ({ signal }) => listSortPlans(signal),
    enabled,
  });
}

/** The caller's saved sort plans, to classify a batch by (integrators, curators and admins). */
export function useSortPlans(enabled: boolean) {
  return useQuery(sortPlansQueryOptions(enabled));
}
