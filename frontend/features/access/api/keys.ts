import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { components } from '../../../../shared/api/openapi-types';
import { apiGet, apiPost, apiSend } from '../../../lib/api-client';

export type ApiKey = components['schemas']['ApiKey'];
export type NewKey = ApiKey & { key: string; previousKeyExpiresAt?: string };
export interface UsageRow {
  keyId: number;
  prefix: string;
  name: string;
  day: string;
  routeGroup: string;
  count: number;
}

export const keyKeys = {
  all: ['keys'] as const,
  mine: () => [...keyKeys.all, 'mine'] as const,
  usage: () => [...keyKeys.all, 'usage'] as const,
};

export const myKeysQueryOptions = () =>
  queryOptions({
    queryKey: keyKeys.mine(),
    queryFn: ({ signal }) => apiGet<{ items: ApiKey[] }>('/api/v1/keys', signal),
  });
export const usageQueryOptions = () =>
  queryOptions({
    queryKey: keyKeys.usage(),
    queryFn: ({ signal }) =>
      apiGet<{ from: string; items: UsageRow[] }>('/api/v1/usage?days=30', signal),
  });

export const useMyKeys = () => useQuery(myKeysQueryOptions());
export const useUsage = () => useQuery(usageQueryOptions());

export function useKeyMutations() {
  const client = useQueryClient();
  const refresh = () => client.invalidateQueries({ queryKey: keyKeys.all });
  return {
    create: useMutation({
      mutationFn: (body: { name: string; role: ApiKey['role']; expiresAt?: string }) =>
        apiPost<NewKey>('/api/v1/keys', body),
      onSuccess: refresh,
    }),
    revoke: useMutation({
      mutationFn: (id: number) => apiSend<void>('DELETE', `/api/v1/keys/${id}`),
      onSuccess: refresh,
    }),
    rotate: useMutation({
      mutationFn: (id: number) =>
        apiPost<NewKey>(`/api/v1/keys/${id}/rotate`, { overlapHours: 24 }),
      onSuccess: refresh,
    }),
  };
}
