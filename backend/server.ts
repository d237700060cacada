import type { Server } from 'node:http';
import { createApp } from './app';
import { readConfig } from './config';
import { createKnex } from './db/knex';
import { prepareDatabase } from './db/prepare';

/** Starts the service: migrate and seed before listening, drain and close on SIGTERM. */
export async function startServer(): Promise<Server> {
  const config = readConfig();
  const knex = createKnex(config.databaseFile);
  try {
    await prepareDatabase(knex, { demo: true });
  } catch (error) {
    console.error(`Database preparation failed for ${config.databaseFile}:`, error);
    await knex.destroy();
    process.exit(1);
  }
  const app = createApp({ knex, logLevel: config.logLevel });
  const server = app.listen(config.port, config.host, () => {
    const address = server.address();
    const port = typeof address === 'object' && address ? address.port : config.port;
    console.log(
      `Conductory is serving on http://${config.host}:${port}/ (database ${config.databaseFile})`,
    );
  });

  const shutdown = (signal: string) => {
    console.log(`${signal}: closing; in-flight requests get up to 10 s`);
    const force = setTimeout(() => process.exit(1), 10_000);
    force.unref();
    server.close(() => {
      void knex.destroy().then(() => process.exit(0));
    });
    server.closeIdleConnections();
  };
  process.once('SIGTERM', () => shutdown('SIGTERM'));
  process.once('SIGINT', () => shutdown('SIGINT'));
  return server;
}

const entry = process.argv[1] ?? '';
if (entry.endsWith('server.ts') || entry.endsWith('server.js')) void startServer();
