import { useMutation } from '@tanstack/react-query';
import type { MatchRequest } from '../../../../shared/schemas/match-request';
import { apiPost } from '../../../lib/api-client';
import type { MatchResult } from '../../../lib/api-types';

export function runMatch(request: MatchRequest): Promise<MatchResult> {
  return apiPost<MatchResult>('/api/v1/match', request);
}

/** A match is a computation, not a stored thing: a mutation, so each press runs it afresh. */
export function useRunMatch() {
  return useMutation({ mutationFn: runMatch });
}
