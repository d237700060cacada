/** Query keys for alloys: lists by their filters, details by slug. */
export const alloyKeys = {
  all: ['alloys'] as const,
  lists: () => [...alloyKeys.all, 'list'] as const,
  list: (filters: Record<string, unknown>) => [...alloyKeys.lists(), filters] as const,
  details: () => [...alloyKeys.all, 'detail'] as const,
  detail: (slug: string) => [...alloyKeys.details(), slug] as const,
};
