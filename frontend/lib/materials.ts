import { queryOptions, useQuery } from '@tanstack/react-query';
import { alloyKeys } from './alloy-keys';
import { apiGet } from './api-client';
import type { AlloyPage } from './api-types';
import type { MaterialProperties } from './stack-drafts';

/** Every alloy of the table with the figures the calculators need, keyed by slug. */
export function materialsQueryOptions() {
  return queryOptions({
    queryKey: alloyKeys.list({ purpose: 'materials' }),
    queryFn: async ({ signal }) => {
      const materials = new Map<string, MaterialProperties>();
      for (let offset = 0; ; offset += 100) {
        const page = await apiGet<AlloyPage>(`/api/v1/alloys?limit=100&offset=${offset}`, signal);
        for (const a of page.items) {
          materials.set(a.slug, {
            name: a.name,
            conductivitySPerM: a.conductivitySPerM,
            relativePermeability: a.relativePermeability,
            densityKgPerM3: a.densityKgPerM3,
          });
        }
        if (offset + page.items.length >= page.total) break;
      }
      return materials;
    },
    staleTime: 10 * 60_000,
  });
}

export function useMaterials() {
  return useQuery(materialsQueryOptions());
}
