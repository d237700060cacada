import { useMutation } from '@tanstack/react-query';
import type { components } from '../../../../shared/api/openapi-types';
import { apiPost } from '../../../lib/api-client';

export type LaunchRequest = components['schemas']['LaunchRequest'];
export type LaunchResult = components['schemas']['LaunchResult'];

export function runLaunch(request: LaunchRequest): Promise<LaunchResult> {
  return apiPost<LaunchResult>('/api/v1/estimates/launch', request);
}

/** One launch per chosen blank, run together. */
export function useRunLaunches() {
  return useMutation({
    mutationFn: (requests: LaunchRequest[]) => Promise.all(requests.map(runLaunch)),
  });
}
