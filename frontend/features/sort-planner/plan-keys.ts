/** Query keys of the Sort Planner: saved plans, one plan, and the releases to evaluate against. */
export const planKeys = {
  all: ['sort-plans'] as const,
  lists: () => [...planKeys.all, 'list'] as const,
  details: () => [...planKeys.all, 'detail'] as const,
  detail: (id: number) => [...planKeys.details(), id] as const,
  releases: () => ['releases', 'list'] as const,
};
