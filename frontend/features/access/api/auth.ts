import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiGet, apiPost, apiSend } from '../../../lib/api-client';
import { sessionKeys, type Me } from '../../../lib/session';
import type { StackDraft } from '../../../lib/stack-drafts';

export const signUp = (body: { email: string; password: string; name: string }) =>
  apiPost<{ status: string; detail: string }>('/api/v1/auth/sign-up', body);
export const verifyEmail = (token: string) =>
  apiPost<{ status: string }>('/api/v1/auth/verify', { token });
export const requestReset = (email: string) =>
  apiPost<{ status: string; detail: string }>('/api/v1/auth/reset-request', { email });
export const resetPassword = (token: string, password: string) =>
  apiPost<{ status: string }>('/api/v1/auth/reset', { token, password });

/**
 * Signs in, then moves stacks kept only in this browser to the account the first time (when
 * the account has none yet).
 */
export function useSignIn(localStacks: () => StackDraft[]) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: { email: string; password: string }) => {
      const { user } = await apiPost<{ user: Me }>('/api/v1/auth/sign-in', body);
      const local = localStacks();
      if (local.length) {
        const remote = await apiGet<{ drafts: StackDraft[] }>('/api/v1/me/stacks');
        if (!remote.drafts.length)
          await apiSend('PUT', '/api/v1/me/stacks', { drafts: local.slice(0, 50) });
      }
      return user;
    },
    onSuccess: (user) => client.setQueryData(sessionKeys.me, user),
  });
}
