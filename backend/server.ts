import type { Server } from 'node:http';
import { createApp } from './app';
import { loadJwtSecret } from './auth/session-tokens';
import { describeDatabase, readConfig, type Config } from './config';
import { createAccountRepositories } from './db/account-repositories';
import { createKnex } from './db/knex';
import { prepareDatabase } from './db/prepare';
import { claimServerLock } from './db/server-lock';
import { createEstimatePool } from './estimates/pool';
import { createMailer } from './mail/mailer';
import { createOutboxRepository } from './mail/outbox-repository';
import { runExpiryNotices } from './services/expiry-notices';
import { createKeyService } from './services/keys';

const HOUR = 3600_000;
/** In-flight requests get this long to finish after SIGTERM/SIGINT (quality.md). */
const DRAIN_MS = 10_000;

function describeMode(config: Config): string {
  return config.production
    ? 'Mode: production (NODE_ENV=production): JWT_SECRET required, secure cookies, demo accounts ' +
        (config.demoAccounts ? 'ON (DEMO_ACCOUNTS=1)' : 'off')
    : 'Mode: development (set NODE_ENV=production for a deployment): demo accounts on, secret kept beside the database';
}

/** Starts the service: migrate and seed before listening, drain and close on SIGTERM/SIGINT. */
export async function startServer(): Promise<Server> {
  let config: Config;
  try {
    config = readConfig();
  } catch (error) {
    console.error((error as Error).message);
    process.exit(1);
  }
  const database = describeDatabase(config);
  let releaseLock = () => {};
  // A SQLite file belongs to one server; a PostgreSQL database is meant to be shared by several.
  if (!config.databaseUrl) {
    try {
      releaseLock = claimServerLock(config.databaseFile);
    } catch (error) {
      console.error((error as Error).message);
      process.exit(1);
    }
  }
  const knex = createKnex(config.databaseUrl ?? config.databaseFile);
  try {
    await prepareDatabase(knex, { demo: true, demoAccounts: config.demoAccounts });
  } catch (error) {
    console.error(`Database preparation failed for ${database}:`, error);
    await knex.destroy();
    releaseLock();
    process.exit(1);
  }
  let jwtSecret: Buffer;
  try {
    jwtSecret = loadJwtSecret(process.env, config.databaseFile, config.production);
  } catch (error) {
    console.error((error as Error).message);
    await knex.destroy();
    releaseLock();
    process.exit(1);
  }
  const mailer = await createMailer(createOutboxRepository(knex), config.smtpUrl);
  const estimatePool = createEstimatePool({
    threads: config.estimateThreads,
  });
  let publicUrl = config.publicUrl ?? '';
  const app = createApp({
    knex,
    mailer,
    jwtSecret,
    publicUrl: () => publicUrl,
    // Cookie writes must come from this origin when PUBLIC_URL says where people reach us
    // (behind a TLS proxy the request itself looks like plain http).
    publicOrigin: config.publicUrl,
    production: config.production,
    logLevel: config.logLevel,
    estimatePool,
    trustProxy: config.trustProxy,
  });
  const server = app.listen(config.port, config.host, () => {
    const address = server.address();
    const port = typeof address === 'object' && address ? address.port : config.port;
    publicUrl ||= `http://${config.host}:${port}`;
    console.log(`Conductory is serving on http://${config.host}:${port}/ (database ${database})`);
    console.log(describeMode(config));
    if (!config.smtpUrl)
      console.log('Mail goes to a local fake SMTP server and its outbox; SMTP_URL sends for real.');
  });

  // Keys about to expire: warn their owners, at start and hourly (one instance at a time).
  const access = {
    repos: createAccountRepositories(knex),
    secret: jwtSecret,
    mailer,
    publicUrl: () => publicUrl,
    production: config.production,
  };
  const notices = () =>
    void runExpiryNotices(knex, createKeyService(access)).catch((e) =>
      console.error('expiry notices failed', e),
    );
  notices();
  const hourly = setInterval(notices, HOUR);
  hourly.unref();

  let closing = false;
  const shutdown = (signal: string) => {
    if (closing) return;
    closing = true;
    console.log(`${signal}: no new connections; in-flight requests get up to ${DRAIN_MS / 1000} s`);
    clearInterval(hourly);
    const force = setTimeout(() => {
      console.error('Requests still open after the drain time: closing them.');
      server.closeAllConnections();
    }, DRAIN_MS);
    force.unref();
    server.close(() => {
      clearTimeout(force);
      void estimatePool
        .close()
        .then(() => mailer.close())
        .then(() => knex.destroy())
        .then(() => {
          releaseLock();
          console.log('Closed the database; bye.');
          process.exit(0);
        })
        .catch((error) => {
          console.error('Shutdown failed:', error);
          releaseLock();
          process.exit(1);
        });
    });
    server.closeIdleConnections();
  };
  process.on('SIGTERM', () => shutdown('SIGTERM'));
  process.on('SIGINT', () => shutdown('SIGINT'));
  // `npm start` execs this process, so npm forwards signals to it; should npm itself be killed
  // outright, this process is re-parented: close down rather than serve on as an orphan.
  const parent = process.ppid;
  const orphanWatch = setInterval(() => {
    if (process.ppid !== parent) shutdown('parent process gone');
  }, 1000);
  orphanWatch.unref();
  return server;
}

const entry = process.argv[1] ?? '';
if (entry.endsWith('server.ts') || entry.endsWith('server.js')) void startServer();
