import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { components } from '../../../../shared/api/openapi-types';
import { alloyKeys } from '../../../lib/alloy-keys';
import { ApiProblem, apiGet, apiPost } from '../../../lib/api-client';
import type { Problem } from '../../../lib/api-types';

export type Revision = components['schemas']['Revision'];
export const reviewKeys = {
  all: ['review'] as const,
  pending: () => [...reviewKeys.all, 'pending'] as const,
  releases: () => [...reviewKeys.all, 'releases'] as const,
};

export const usePending = () =>
  useQuery(
    queryOptions({
      queryKey: reviewKeys.pending(),
      queryFn: ({ signal }) =>
        apiGet<{ items: Revision[] }>('/api/v1/revisions?status=pending', signal),
    }),
  );
export const useReleases = () =>
  useQuery(
    queryOptions({
      queryKey: reviewKeys.releases(),
      queryFn: ({ signal }) =>
        apiGet<{
          items: Array<{ version: string; createdAt: string; checksum: string; changes: number }>;
        }>('/api/v1/releases', signal),
    }),
  );

export function useReviewMutations() {
  const client = useQueryClient();
  const refresh = () =>
    Promise.all([
      client.invalidateQueries({ queryKey: reviewKeys.all }),
      client.invalidateQueries({ queryKey: alloyKeys.all }),
    ]);
  return {
    review: useMutation({
      mutationFn: ({
        id,
        decision,
        comment,
      }: {
        id: number;
        decision: 'approve' | 'reject';
        comment: string;
      }) => apiPost<Revision>(`/api/v1/revisions/${id}/review`, { decision, comment }),
      onSuccess: refresh,
    }),
    publish: useMutation({
      mutationFn: () => apiPost<{ version: string; checksum: string }>('/api/v1/releases', {}),
      onSuccess: refresh,
    }),
  };
}

export interface ImportAnswer {
  dryRun: boolean;
  kind: string;
  rows: number;
  changes: Array<{ row: number; alloy: string; action: string; summary: string }>;
  revision?: Revision;
}

/**
 * Uploads with XMLHttpRequest, the one browser API that reports upload progress; the answer
 * is parsed like any other (a problem becomes an ApiProblem).
 */
export function uploadImport(
  form: FormData,
  onProgress: (fraction: number) => void,
): Promise<ImportAnswer> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/v1/imports');
    xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total);
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        // not JSON: handled below
      }
      if (xhr.status >= 200 && xhr.status < 300) resolve(body as ImportAnswer);
      else
        reject(
          new ApiProblem(
            (body as Problem | null) ?? {
              type: 'about:blank',
              title: xhr.statusText,
              status: xhr.status,
            },
          ),
        );
    };
    xhr.onerror = () =>
      reject(
        new ApiProblem({
          type: 'about:blank',
          title: 'Network error',
          status: 0,
          detail: 'The upload did not reach the service.',
        }),
      );
    xhr.send(form);
  });
}
