import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { components } from '../../../../shared/api/openapi-types';
import { apiGet, apiSend } from '../../../lib/api-client';

type Schemas = components['schemas'];
export type AdminUser = Schemas['UserAdmin'];
export type AdminKey = Schemas['ApiKey'];
export interface AuditEntry {
  id: number;
  at: string;
  actor: string | null;
  action: string;
  target: string | null;
  detail: unknown;
  address: string | null;
}
export interface OutboxMessage {
  id: number;
  at: string;
  to: string;
  subject: string;
  text: string;
  template: string;
}

export const adminKeys = {
  all: ['admin'] as const,
  users: () => [...adminKeys.all, 'users'] as const,
  keys: () => [...adminKeys.all, 'keys'] as const,
  audit: () => [...adminKeys.all, 'audit'] as const,
  outbox: () => [...adminKeys.all, 'outbox'] as const,
};

export const useUsers = () =>
  useQuery(
    queryOptions({
      queryKey: adminKeys.users(),
      queryFn: ({ signal }) => apiGet<{ items: AdminUser[] }>('/api/v1/users', signal),
    }),
  );
export const useAllKeys = () =>
  useQuery(
    queryOptions({
      queryKey: adminKeys.keys(),
      queryFn: ({ signal }) => apiGet<{ items: AdminKey[] }>('/api/v1/admin/keys', signal),
    }),
  );
export const useAudit = () =>
  useQuery(
    queryOptions({
      queryKey: adminKeys.audit(),
      queryFn: ({ signal }) => apiGet<{ items: AuditEntry[] }>('/api/v1/audit?limit=300', signal),
    }),
  );
export const useOutbox = () =>
  useQuery(
    queryOptions({
      queryKey: adminKeys.outbox(),
      queryFn: ({ signal }) =>
        apiGet<{ items: OutboxMessage[] }>('/api/v1/admin/outbox?limit=200', signal),
      refetchInterval: 5000,
    }),
  );

export function useAdminMutations() {
  const client = useQueryClient();
  const refresh = () => client.invalidateQueries({ queryKey: adminKeys.all });
  return {
    updateUser: useMutation({
      mutationFn: ({
        id,
        ...body
      }: {
        id: number;
        role?: AdminUser['role'];
        status?: AdminUser['status'];
      }) => apiSend<AdminUser>('PATCH', `/api/v1/users/${id}`, body),
      onSuccess: refresh,
    }),
    revokeKey: useMutation({
      mutationFn: (id: number) => apiSend<void>('DELETE', `/api/v1/keys/${id}`),
      onSuccess: refresh,
    }),
  };
}
