import crypto from 'node:crypto';
import type { Express } from 'express';
import type { Knex } from 'knex';
import { createApp, type AppOptions } from '../../backend/app';
import { createKnex } from '../../backend/db/knex';
import { prepareDatabase } from '../../backend/db/prepare';
import { createMailer, type Mailer } from '../../backend/mail/mailer';
import { createOutboxRepository } from '../../backend/mail/outbox-repository';

export const TEST_PUBLIC_URL = 'http://conductory.test';

/** A migrated, seeded in-memory database (reference table, demo scenario, demo accounts). */
export async function createTestDatabase(options: { accounts?: boolean } = {}): Promise<Knex> {
  const knex = createKnex(':memory:');
  await prepareDatabase(knex, { demo: true, demoAccounts: options.accounts ?? false });
  return knex;
}

export interface TestApp {
  app: Express;
  knex: Knex;
  mailer: Mailer;
  jwtSecret: Buffer;
}

/**
 * The API on an in-memory database, without the front end, with its own fake SMTP server.
 * Rate limits are generous unless a test sets them: most tests are about something else.
 */
export async function createTestApp(
  overrides: Partial<AppOptions> & { accounts?: boolean } = {},
): Promise<TestApp> {
  const knex = await createTestDatabase({ accounts: overrides.accounts });
  const mailer = await createMailer(createOutboxRepository(knex));
  const jwtSecret = crypto.randomBytes(32);
  const app = createApp({
    knex,
    mailer,
    jwtSecret,
    publicUrl: () => TEST_PUBLIC_URL,
    serveClient: false,
    rateLimits: {
      visitor: 100_000,
      reader: 100_000,
      integrator: 100_000,
      curator: 100_000,
      admin: 100_000,
    },
    credentialLimits: { perAddress: 10_000, perAccount: 10_000 },
    ...overrides,
  });
  return { app, knex, mailer, jwtSecret };
}
