import { queryOptions, useQuery } from '@tanstack/react-query';
import { alloyKeys } from '../../../lib/alloy-keys';
import { apiGet } from '../../../lib/api-client';

export interface HistoryEntry {
  revisionId: number;
  at: string;
  field: string;
  oldValue: unknown;
  newValue: unknown;
  proposedBy: string;
  approvedBy: string;
  reason: string;
  source: { citation: string; kind: string; locator?: string | null };
}

export const historyQueryOptions = (slug: string) =>
  queryOptions({
    queryKey: [...alloyKeys.detail(slug), 'history'],
    queryFn: ({ signal }) =>
      apiGet<{ items: HistoryEntry[] }>(
        `/api/v1/alloys/${encodeURIComponent(slug)}/history`,
        signal,
      ),
  });

export const useHistory = (slug: string) => useQuery(historyQueryOptions(slug));
