import crypto from 'node:crypto';
import type { Express } from 'express';
import type { Knex } from 'knex';
import { createApp, type AppOptions } from '../../backend/app';
import { createKnex } from '../../backend/db/knex';
import { createEstimatePool, type EstimatePool } from '../../backend/estimates/pool';
import { prepareDatabase } from '../../backend/db/prepare';
import { createMailer, type LocalDelivery, type Mailer } from '../../backend/mail/mailer';
import { createOutboxRepository } from '../../backend/mail/outbox-repository';
import { createTestPostgresDatabase, testPostgresUrl } from './test-database';

export const TEST_PUBLIC_URL = 'http://conductory.test';

/** A message as the mailer sent it, tokens and all (the outbox keeps them masked). */
export interface SentMail {
  to: string;
  template: string;
  subject: string;
  text: string;
}

/**
 * The tests' own mailbox: the mailer's local delivery, not an HTTP route, so the API never shows a
 * live token to anyone but the mail's owner. `tokenFor` reads the newest link of a template.
 */
export function mailCapture() {
  const sent: SentMail[] = [];
  const localDelivery: LocalDelivery = (to, content) => sent.push({ to, ...content });
  const tokenFor = (email: string, template: 'verification' | 'reset'): string => {
    const mail = sent.filter((m) => m.to === email.toLowerCase() && m.template === template).at(-1);
    const token = mail && /[?&]token=([^\s&#]+)/.exec(mail.text)?.[1];
    if (!token) throw new Error(`no ${template} mail with a token was sent to ${email}`);
    return token;
  };
  return { sent, localDelivery, tokenFor };
}

/**
 * A migrated, seeded database of its own (reference table, demo scenario, demo accounts): in
 * memory on SQLite, or a new PostgreSQL database when DATABASE_URL is one (npm run test:pg).
 */
export async function createTestDatabase(options: { accounts?: boolean } = {}): Promise<Knex> {
  if (testPostgresUrl) {
    const url = await createTestPostgresDatabase(options.accounts ?? false);
    // No idle connections kept: a test file makes many small databases and rarely closes them.
    return createKnex(url, { min: 0, max: 4 });
  }
  const knex = createKnex(':memory:');
  await prepareDatabase(knex, { demo: true, demoAccounts: options.accounts ?? false });
  return knex;
}

export interface TestApp {
  app: Express;
  knex: Knex;
  mailer: Mailer;
  jwtSecret: Buffer;
  /** Every message sent, unmasked, and the newest token of a kind for an address. */
  mail: ReturnType<typeof mailCapture>;
}

/** One calculators' pool for every app of a test file: threads are started once, not per app. */
let sharedPool: EstimatePool | undefined;
const testPool = () => (sharedPool ??= createEstimatePool());

/**
 * The API on an in-memory database, without the front end, with its own fake SMTP server.
 * Rate limits are generous unless a test sets them: most tests are about something else.
 */
export async function createTestApp(
  overrides: Partial<AppOptions> & { accounts?: boolean } = {},
): Promise<TestApp> {
  // A database of its own unless the test gives one (two instances on one database: tests/pg).
  const knex = overrides.knex ?? (await createTestDatabase({ accounts: overrides.accounts }));
  const mail = mailCapture();
  const mailer = await createMailer(createOutboxRepository(knex), undefined, {
    localDelivery: mail.localDelivery,
  });
  const jwtSecret = overrides.jwtSecret ?? crypto.randomBytes(32);
  const app = createApp({
    knex,
    mailer,
    jwtSecret,
    publicUrl: () => TEST_PUBLIC_URL,
    // Cookie writes must come from here: tests/helpers/access.ts sends it as Origin.
    publicOrigin: TEST_PUBLIC_URL,
    serveClient: false,
    // Every answer of every API test is checked against openapi.yaml, whatever the mode.
    validateResponses: true,
    estimatePool: overrides.estimatePool ?? testPool(),
    rateLimits: {
      visitor: 100_000,
      reader: 100_000,
      integrator: 100_000,
      curator: 100_000,
      admin: 100_000,
    },
    credentialLimits: { perAddress: 10_000, perAccount: 10_000, perAccountCeiling: 10_000 },
    estimateLimits: {
      visitor: 100_000,
      reader: 100_000,
      integrator: 100_000,
      curator: 100_000,
      admin: 100_000,
    },
    ...overrides,
  });
  return { app, knex, mailer, jwtSecret, mail };
}
