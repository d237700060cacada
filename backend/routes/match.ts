import { Router } from 'express';
import type { Quantity } from '../../shared/units/quantity';
import { siFromRequest } from '../http/quantity';
import { sendComputedJson } from '../http/send-prepared-json';
import { matchPrepared } from '../services/match';
import type { CatalogueStore } from '../services/catalogue-store';

interface MatchBody {
  conductivity: Quantity;
  temperature?: Quantity;
  density?: Quantity;
  uncertaintyPercent?: number;
  limit?: number;
}

export function matchRouter(catalogue: CatalogueStore): Router {
  const router = Router({ caseSensitive: true, strict: true });
  router.post('/match', async (req, res) => {
    const body = req.body as MatchBody;
    const reading = {
      conductivitySPerM: siFromRequest('conductivity', body.conductivity, '/body/conductivity'),
      temperatureK: body.temperature
        ? siFromRequest('temperature', body.temperature, '/body/temperature')
        : undefined,
      densityKgPerM3: body.density
        ? siFromRequest('density', body.density, '/body/density')
        : undefined,
      uncertaintyPercent: body.uncertaintyPercent ?? 2,
    };
    const table = await catalogue.get();
    const candidates = matchPrepared(table.matchTable(), reading, body.limit ?? 10);
    sendComputedJson(req, res, {
      reading: {
        conductivitySPerM: reading.conductivitySPerM,
        temperatureK: reading.temperatureK ?? null,
        densityKgPerM3: reading.densityKgPerM3 ?? null,
        uncertaintyPercent: reading.uncertaintyPercent,
      },
      candidates,
    });
  });
  return router;
}
