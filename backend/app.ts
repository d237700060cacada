import fs from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express, { type Express, type RequestHandler, type Router } from 'express';
import * as OpenApiValidator from 'express-openapi-validator';
import type { Knex } from 'knex';
import type { DestinationStream } from 'pino';
import compression from 'compression';
import { loadApiDocument } from './api-document';
import { authenticate } from './auth/authenticate';
import { enforceRoles } from './auth/enforce-roles';
import { createAccountRepositories } from './db/account-repositories';
import { catalogueVersion } from './db/catalogue-version';
import { sharedByInstances } from './db/dialect';
import { countUsage } from './http/count-usage';
import { limiterStores } from './http/knex-rate-limit-store';
import {
  estimateRateLimit,
  DEFAULT_ESTIMATE_LIMITS,
  type EstimateLimits,
} from './http/estimate-rate-limit';
import { requestLog } from './http/request-log';
import { securityHeaders } from './http/security-headers';
import { dispatchByOperation } from './http/dispatch-operation';
import { chain } from './http/chain';
import { resolveOperation } from './http/resolve-operation';
import { createEstimatePool, type EstimatePool } from './estimates/pool';
import {
  apiRateLimit,
  credentialThrottles,
  DEFAULT_CREDENTIAL_LIMITS,
  DEFAULT_RATE_LIMITS,
  type CredentialLimits,
  type RateLimits,
} from './http/rate-limits';
import type { Mailer } from './mail/mailer';
import { createOutboxRepository } from './mail/outbox-repository';
import { adminRouter } from './routes/admin';
import { authRouter } from './routes/auth';
import { keysRouter } from './routes/keys';
import { meRouter } from './routes/me';
import { createAccountService } from './services/accounts';
import { createKeyService } from './services/keys';
import { createAlloyRepository } from './db/alloy-repository';
import { createReadingRepository } from './db/reading-repository';
import { createStackRepository } from './db/stack-repository';
import { apiNotFound, problemHandler } from './http/problem';
import { apiReference } from './http/api-reference';
import { staticClient } from './http/static-client';
import { refuseNonFinite } from './http/refuse-non-finite';
import { clientDist } from './paths';
import { alloysRouter } from './routes/alloys';
import { checksRouter } from './routes/checks';
import { curationRouter } from './routes/curation';
import { createCurationService } from './services/curation';
import { createReleaseService } from './services/releases';
import { estimatesRouter } from './routes/estimates';
import { healthRouter } from './routes/health';
import { matchRouter } from './routes/match';
import { matchBatchRouter } from './routes/match-batch';
import { readingsRouter } from './routes/readings';
import { sortPlansRouter } from './routes/sort-plans';
import { stacksRouter } from './routes/stacks';
import { createSortPlanRepository } from './db/sort-plan-repository';
import { CatalogueStore } from './services/catalogue-store';
import { createChecksService } from './services/checks';

export interface AppOptions {
  knex: Knex;
  mailer: Mailer;
  /** HS256 signing secret for session tokens (≥ 32 bytes). */
  jwtSecret: Buffer;
  /** Base URL of the links in mails. */
  publicUrl: () => string;
  production?: boolean;
  rateLimits?: Partial<RateLimits>;
  /** Sign-in and reset attempts per 15 minutes (see CredentialLimits). */
  credentialLimits?: CredentialLimits;
  /**
   * PUBLIC_URL as configured (not the address derived after listening): when set, the only origin
   * a cookie-authenticated write may come from; unset, the request's own scheme, host and port.
   */
  publicOrigin?: string;
  logLevel?: string;
  /** Where the request log goes (standard output unless a test captures it). */
  logStream?: DestinationStream;
  /** The calculators' worker pool; one is made (and started on first use) when not given. */
  estimatePool?: EstimatePool;
  /** Calculations per minute by caller, on top of rateLimits. */
  estimateLimits?: Partial<EstimateLimits>;
  /**
   * Check each answer against openapi.yaml before it leaves (a mismatch is a 500 naming the
   * field). On unless production: the tests always turn it on.
   */
  validateResponses?: boolean;
  /** Serve the built front end from dist/client when it exists (off for API-only tests). */
  serveClient?: boolean;
  /**
   * Express's `trust proxy` (TRUST_PROXY): which proxies' X-Forwarded-For to believe, so that
   * limits and the audit log see the client's address rather than the proxy's. Off by default.
   */
  trustProxy?: boolean | number | string;
}

/** Largest JSON body accepted: a reading or an estimate request is a few hundred bytes. */
export const JSON_BODY_LIMIT = '64kb';

/** Builds the application; server.ts listens, tests hand it to supertest. */
export function createApp(options: AppOptions): Express {
  const { knex } = options;
  const apiDocument = loadApiDocument();
  const alloyRepository = createAlloyRepository(knex);
  const catalogue = new CatalogueStore(
    alloyRepository,
    sharedByInstances(knex) ? () => catalogueVersion(knex) : undefined,
  );
  const repos = createAccountRepositories(knex);
  const outbox = createOutboxRepository(knex);
  const production = options.production ?? false;
  const access = {
    repos,
    secret: options.jwtSecret,
    mailer: options.mailer,
    publicUrl: options.publicUrl,
    production,
  };
  const accounts = createAccountService(access);
  const keys = createKeyService(access);
  const credentials = options.credentialLimits ?? DEFAULT_CREDENTIAL_LIMITS;
  // Counted in the database when several instances may share it (PostgreSQL), in memory on SQLite.
  const stores = limiterStores(knex);
  const app = express();

  app.disable('x-powered-by');
  const validateResponses = options.validateResponses ?? !production;
  // Read by sendPreparedJson: a cached answer goes through res.json where answers are checked.
  app.locals.validateResponses = validateResponses;
  app.set('trust proxy', options.trustProxy ?? false);
  // /api/v1/Users and /api/v1/users/ are not /api/v1/users (and routers say the same below).
  app.set('case sensitive routing', true);
  app.set('strict routing', true);
  // Array query parameters (?family=a&family=b) need the extended parser (validator docs).
  app.set('query parser', 'extended');
  // Every request, as one layer: security headers, its log line, compression, and (under /api/v1)
  // the operation of openapi.yaml it resolves to, or a 404/405 before anything else runs.
  app.use(
    chain([
      securityHeaders({
        // Plain-HTTP loopback deployments must not be told to upgrade every request to HTTPS.
        contentSecurityPolicy: { directives: { upgradeInsecureRequests: null } },
      }),
      requestLog(app, options.logLevel ?? 'silent', options.logStream),
      // gzip or brotli, as the client accepts, for the API and the front end's files alike.
      compression(),
      resolveOperation(apiDocument),
    ]),
  );
  app.use(
    '/api',
    chain([
      express.json({ limit: JSON_BODY_LIMIT }),
      // Infinity, NaN and 1e999 never reach the validator's coercion or a handler (400, field named).
      refuseNonFinite,
    ]),
  );

  // Swagger UI goes before the validator, which would otherwise refuse its undocumented paths.
  // Mounted at its own prefix, so an API request passes it by one path check.
  app.use('/api/docs', apiReference(loadApiDocument()));
  // The document as JSON, made once (loadApiDocument hands out a deep copy on every call).
  const documentJson = JSON.stringify(loadApiDocument());
  app.get('/api/openapi.json', (_req, res) => {
    res.type('application/json').send(documentJson);
  });

  // Who is calling, how often, and whether openapi.yaml's x-roles let them: before validation,
  // so a caller without access learns nothing of the request rules.
  app.use(
    '/api/v1',
    chain([
      cookieParser(),
      authenticate(repos, options.jwtSecret, production, options.publicOrigin),
      apiRateLimit({ ...DEFAULT_RATE_LIMITS, ...options.rateLimits }, stores),
      countUsage(repos),
      enforceRoles(),
      estimateRateLimit({ ...DEFAULT_ESTIMATE_LIMITS, ...options.estimateLimits }, stores),
    ]),
  );

  // The validator's own steps as one layer too.
  const validator = OpenApiValidator.middleware({
    apiSpec: apiDocument as never,
    validateRequests: { allowUnknownQueryParameters: false },
    // Every answer checked against openapi.yaml in development and in the tests (the API suites
    // and the fuzz test); a production server skips it, about a tenth of a request's cost.
    validateResponses,
    // Access is decided by enforceRoles from x-roles; the document's security block is for readers.
    validateSecurity: false,
    // The uploads are checked by multer (with limits) and their services instead: the
    // validator's multipart path has no limits, and it would read a batch's body before its
    // route could parse it as it streams (routes/match-batch.ts checks the query itself).
    ignorePaths: /^\/(?!api\/v1\/)|^\/api\/v1\/imports\/?$|^\/api\/v1\/match\/batch$/,
    // Those two are the only multipart operations, so the validator's own upload step has
    // nothing to do.
    fileUploader: false,
  });
  app.use(chain(validator as unknown as RequestHandler[]));

  const releases = createReleaseService(knex, alloyRepository);
  const curation = createCurationService(knex, repos, options.mailer, catalogue);
  const stacks = createStackRepository(knex);
  const sortPlans = createSortPlanRepository(knex);
  const estimatePool = options.estimatePool ?? createEstimatePool();
  const measurementsOf = async (slug: string) => {
    const rows = await knex('measurements as m')
      .join('alloys as a', 'a.id', 'm.alloy_id')
      .join('sources as s', 's.id', 'm.source_id')
      .where('a.slug', slug)
      .select('m.*', 's.citation', 's.kind');
    return rows.map((m) => ({
      conductivitySPerM: m.conductivity_s_per_m,
      frequencyHz: m.frequency_hz,
      temperatureK: m.temperature_k,
      uncertaintyPercent: m.uncertainty_percent,
      sample: m.sample,
      instrument: m.instrument,
      source: { id: m.source_id, citation: m.citation, kind: m.kind },
    }));
  };
  // Each request goes straight to the router of the operation resolveOperation named.
  // /alloys/export and /alloys/{slug}/history are operations of their own, not /alloys/{slug}.
  const routers: Router[] = [
    healthRouter(catalogue, knex, apiDocument.info.version),
    curationRouter(curation, catalogue, releases, (entry) => repos.audit.record(entry)),
    alloysRouter(catalogue, releases, measurementsOf),
    matchRouter(catalogue),
    matchBatchRouter(catalogue, sortPlans),
    readingsRouter(createReadingRepository(knex)),
    stacksRouter(stacks, catalogue),
    estimatesRouter(catalogue, estimatePool),
    checksRouter(createChecksService(estimatePool, catalogue)),
    sortPlansRouter({ catalogue, releases, stacks, plans: sortPlans, pool: estimatePool }),
    authRouter(accounts, credentialThrottles(credentials, undefined, stores), production),
    meRouter(repos),
    keysRouter(keys, repos),
    adminRouter(repos, keys, outbox),
  ];
  app.use('/api/v1', dispatchByOperation(routers, apiDocument));
  app.use('/api', apiNotFound);

  if (options.serveClient !== false && fs.existsSync(path.join(clientDist, 'index.html')))
    app.use(staticClient(clientDist));

  app.use(problemHandler);
  return app;
}
