import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from './api-client';
import type { components } from '../../shared/api/openapi-types';
import type { StackDraft } from './stack-drafts';

export type BuiltInStack = components['schemas']['BuiltInStack'];

export function builtInStacksQueryOptions() {
  return queryOptions({
    queryKey: ['stacks', 'built-in'] as const,
    queryFn: ({ signal }) => apiGet<{ items: BuiltInStack[] }>('/api/v1/stacks', signal),
    staleTime: 10 * 60_000,
  });
}

export function useBuiltInStacks() {
  return useQuery(builtInStacksQueryOptions());
}

/** A built-in stack as an editable draft, sizes in mm and µm as a mint drawing gives them. */
export function draftFromBuiltIn(stack: BuiltInStack): StackDraft {
  return {
    id: stack.slug,
    name: stack.name,
    diameter: { value: Number((stack.diameterM * 1e3).toPrecision(6)), unit: 'mm' },
    layers: stack.layers.map((l) =>
      l.thicknessM < 1e-4
        ? {
            alloy: l.alloy,
            thickness: { value: Number((l.thicknessM * 1e6).toPrecision(6)), unit: 'um' },
          }
        : {
            alloy: l.alloy,
            thickness: { value: Number((l.thicknessM * 1e3).toPrecision(6)), unit: 'mm' },
          },
    ),
  };
}
