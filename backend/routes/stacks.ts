import { Router } from 'express';
import { valueOf } from '../../shared/catalogue/alloy-record';
import { stackDensity, stackMass } from '../../shared/physics/stack';
import type { StackRepository } from '../db/stack-repository';
import type { CatalogueStore } from '../services/catalogue-store';

export function stacksRouter(stacks: StackRepository, catalogue: CatalogueStore): Router {
  const router = Router({ caseSensitive: true, strict: true });
  router.get('/stacks', async (_req, res) => {
    const table = await catalogue.get();
    const items = (await stacks.listBuiltIn()).map((s) => {
      const physical = {
        diameterM: s.diameterM,
        layers: s.layers.map((l) => {
          const found = table.find(l.alloy);
          return {
            conductivitySPerM: found?.item.conductivitySPerM ?? NaN,
            relativePermeability: found?.record.relativePermeability ?? 1,
            densityKgPerM3: (found && valueOf(found.record, 'density')?.nominal) ?? NaN,
            thicknessM: l.thicknessM,
          };
        }),
      };
      return { ...s, massKg: stackMass(physical), densityKgPerM3: stackDensity(physical) };
    });
    res.json({ items });
  });
  return router;
}
