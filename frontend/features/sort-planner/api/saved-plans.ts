import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { components } from '../../../../shared/api/openapi-types';
import { apiGet, apiPost, apiSend } from '../../../lib/api-client';
import { planKeys } from '../plan-keys';
import type { PlanRequest, PlanResult } from './evaluate-plan';

export type SavedPlan = components['schemas']['SortPlan'];
export type SavedPlanSummary = components['schemas']['SortPlanSummary'];
export interface Comparison {
  from: components['schemas']['SortPlanEvaluated'];
  to: components['schemas']['SortPlanEvaluated'];
  result: PlanResult;
  moved: Array<{
    frequencyHz: number;
    product: string;
    from: components['schemas']['WindowEnds'];
    to: components['schemas']['WindowEnds'];
  }>;
  recommendedFrequencyHz: { from: number | null; to: number | null };
}

export const listPlans = (signal?: AbortSignal) =>
  apiGet<{ items: SavedPlanSummary[] }>('/api/v1/sort-plans', signal);

export function plansQueryOptions(enabled: boolean) {
  return queryOptions({
    queryKey: planKeys.lists(),
    queryFn: ({ signal }) => listPlans(signal),
    enabled,
  });
}

/** The person's saved plans (integrators, curators and admins). */
export function usePlans(enabled: boolean) {
  return useQuery(plansQueryOptions(enabled));
}

export const getPlan = (id: number) => apiGet<SavedPlan>(`/api/v1/sort-plans/${id}`);

export function useSavePlan() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: { name: string; plan: PlanRequest }) =>
      apiPost<SavedPlan>('/api/v1/sort-plans', body),
    onSuccess: () => client.invalidateQueries({ queryKey: planKeys.lists() }),
  });
}

export function useDeletePlan() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => apiSend<void>('DELETE', `/api/v1/sort-plans/${id}`),
    onSuccess: () => client.invalidateQueries({ queryKey: planKeys.lists() }),
  });
}

export function useReEvaluate() {
  return useMutation({
    mutationFn: ({ id, release }: { id: number; release?: string }) =>
      apiPost<Comparison>(`/api/v1/sort-plans/${id}/re-evaluate`, release ? { release } : {}),
  });
}

/** Where a saved plan's export downloads from. */
export const exportUrl = (id: number, format: 'json' | 'csv' | 'c') =>
  `/api/v1/sort-plans/${id}/export?format=${format}`;
