import { useMutation } from '@tanstack/react-query';
import type { components } from '../../../../shared/api/openapi-types';
import { apiPost } from '../../../lib/api-client';

export type PlanRequest = components['schemas']['SortPlanRequest'];
export type PlanResult = components['schemas']['SortPlanResult'];

export const evaluatePlan = (request: PlanRequest) =>
  apiPost<PlanResult>('/api/v1/sort-plans/evaluate', request);

/** Evaluates a plan on the server (a worker thread there); nothing is saved. */
export function useEvaluatePlan() {
  return useMutation({ mutationFn: evaluatePlan });
}
