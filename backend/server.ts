import type { Server } from 'node:http';
import { createApp } from './app';
import { loadJwtSecret } from './auth/session-tokens';
import { readConfig } from './config';
import { createAccountRepositories } from './db/account-repositories';
import { createKnex } from './db/knex';
import { prepareDatabase } from './db/prepare';
import { createMailer } from './mail/mailer';
import { createOutboxRepository } from './mail/outbox-repository';
import { createKeyService } from './services/keys';

const HOUR = 3600_000;

/** Starts the service: migrate and seed before listening, drain and close on SIGTERM. */
export async function startServer(): Promise<Server> {
  const config = readConfig();
  const knex = createKnex(config.databaseFile);
  try {
    await prepareDatabase(knex, { demo: true, demoAccounts: config.demoAccounts });
  } catch (error) {
    console.error(`Database preparation failed for ${config.databaseFile}:`, error);
    await knex.destroy();
    process.exit(1);
  }
  const jwtSecret = loadJwtSecret(process.env, config.databaseFile, config.production);
  const mailer = await createMailer(createOutboxRepository(knex), config.smtpUrl);
  let publicUrl = config.publicUrl ?? '';
  const app = createApp({
    knex,
    mailer,
    jwtSecret,
    publicUrl: () => publicUrl,
    production: config.production,
    logLevel: config.logLevel,
  });
  const server = app.listen(config.port, config.host, () => {
    const address = server.address();
    const port = typeof address === 'object' && address ? address.port : config.port;
    publicUrl ||= `http://${config.host}:${port}`;
    console.log(
      `Conductory is serving on http://${config.host}:${port}/ (database ${config.databaseFile})`,
    );
    if (!config.smtpUrl)
      console.log('Mail goes to a local fake SMTP server; admins read it in the Outbox.');
  });

  // Keys about to expire: warn their owners, at start and hourly.
  const access = {
    repos: createAccountRepositories(knex),
    secret: jwtSecret,
    mailer,
    publicUrl: () => publicUrl,
    production: config.production,
  };
  const notices = () =>
    void createKeyService(access)
      .sendExpiryNotices()
      .catch((e) => console.error('expiry notices failed', e));
  notices();
  setInterval(notices, HOUR).unref();

  const shutdown = (signal: string) => {
    console.log(`${signal}: closing; in-flight requests get up to 10 s`);
    const force = setTimeout(() => process.exit(1), 10_000);
    force.unref();
    server.close(() => {
      void mailer
        .close()
        .then(() => knex.destroy())
        .then(() => process.exit(0));
    });
    server.closeIdleConnections();
  };
  process.once('SIGTERM', () => shutdown('SIGTERM'));
  process.once('SIGINT', () => shutdown('SIGINT'));
  return server;
}

const entry = process.argv[1] ?? '';
if (entry.endsWith('server.ts') || entry.endsWith('server.js')) void startServer();
