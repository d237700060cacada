import type { Knex } from 'knex';
import { hashPassword } from '../backend/auth/passwords';
import { demoAccounts } from './demo/accounts';

/**
 * Demo accounts, one per role (two curators, for the two-person review). Refused when
 * NODE_ENV=production unless DEMO_ACCOUNTS=1 says so explicitly: known passwords on a server
 * are an open door.
 */
export async function seed(knex: Knex): Promise<void> {
  if (process.env.NODE_ENV === 'production' && process.env.DEMO_ACCOUNTS !== '1') {
    throw new Error(
      'demo accounts are refused in production (set DEMO_ACCOUNTS=1 to load them anyway)',
    );
  }
  const now = new Date().toISOString();
  for (const a of demoAccounts) {
    if (await knex('users').where({ email: a.email }).first()) continue;
    await knex('users').insert({
      email: a.email,
      name: a.name,
      password_hash: await hashPassword(a.password),
      role: a.role,
      status: 'active',
      email_verified_at: now,
      created_at: now,
    });
  }
}
