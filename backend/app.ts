import fs from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import * as OpenApiValidator from 'express-openapi-validator';
import helmet from 'helmet';
import type { Knex } from 'knex';
import { pinoHttp } from 'pino-http';
import swaggerUi from 'swagger-ui-express';
import { loadApiDocument } from './api-document';
import { createAlloyRepository } from './db/alloy-repository';
import { createReadingRepository } from './db/reading-repository';
import { createStackRepository } from './db/stack-repository';
import { apiNotFound, problemHandler } from './http/problem';
import { clientDist } from './paths';
import { alloysRouter } from './routes/alloys';
import { estimatesRouter } from './routes/estimates';
import { healthRouter } from './routes/health';
import { matchRouter } from './routes/match';
import { readingsRouter } from './routes/readings';
import { stacksRouter } from './routes/stacks';
import { CatalogueStore } from './services/catalogue-store';

export interface AppOptions {
  knex: Knex;
  logLevel?: string;
  /** Serve the built front end from dist/client when it exists (off for API-only tests). */
  serveClient?: boolean;
}

/** Largest JSON body accepted: a reading or an estimate request is a few hundred bytes. */
export const JSON_BODY_LIMIT = '64kb';

/** Builds the application; server.ts listens, tests hand it to supertest. */
export function createApp(options: AppOptions): Express {
  const { knex } = options;
  const apiDocument = loadApiDocument();
  const catalogue = new CatalogueStore(createAlloyRepository(knex));
  const app = express();

  app.disable('x-powered-by');
  // Array query parameters (?family=a&family=b) need the extended parser (validator docs).
  app.set('query parser', 'extended');
  app.use(
    helmet({
      // Plain-HTTP loopback deployments must not be told to upgrade every request to HTTPS.
      contentSecurityPolicy: { directives: { upgradeInsecureRequests: null } },
    }),
  );
  app.use(pinoHttp({ level: options.logLevel ?? 'silent' }));
  app.use('/api', express.json({ limit: JSON_BODY_LIMIT }));

  // Swagger UI goes before the validator, which would otherwise refuse its undocumented paths.
  app.use(
    '/api/docs',
    swaggerUi.serve,
    swaggerUi.setup(loadApiDocument(), { customSiteTitle: 'Conductory API reference' }),
  );
  app.get('/api/openapi.json', (_req, res) => {
    res.json(loadApiDocument());
  });

  app.use(
    OpenApiValidator.middleware({
      apiSpec: apiDocument as never,
      validateRequests: { allowUnknownQueryParameters: false },
      validateResponses: true,
      ignorePaths: /^\/(?!api\/v1\/)/,
    }),
  );

  const v1 = express.Router();
  v1.use(healthRouter(catalogue, apiDocument.info.version));
  v1.use(alloysRouter(catalogue));
  v1.use(matchRouter(catalogue));
  v1.use(readingsRouter(createReadingRepository(knex)));
  v1.use(stacksRouter(createStackRepository(knex), catalogue));
  v1.use(estimatesRouter(catalogue));
  app.use('/api/v1', v1);
  app.use('/api', apiNotFound);

  if (options.serveClient !== false && fs.existsSync(path.join(clientDist, 'index.html'))) {
    app.use(express.static(clientDist, { index: false, maxAge: '1h' }));
    // Every other GET is a front-end route: the React router takes it from index.html.
    app.get('/{*splat}', (_req, res) => {
      res.sendFile(path.join(clientDist, 'index.html'));
    });
  }

  app.use(problemHandler);
  return app;
}
