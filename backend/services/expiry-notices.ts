import type { Knex } from 'knex';
import { withAdvisoryLock } from '../db/dialect';
import type { KeyService } from './keys';

/**
 * One round of the hourly job that warns owners of keys about to expire. With several instances
 * on one PostgreSQL database each runs the job on its own clock; the advisory lock lets exactly one
 * of them work at a time and the others skip the round (the next round of any instance finds the
 * notices marked sent, so nobody is mailed twice). Returns the mails sent, or null when another
 * instance held the job.
 */
export async function runExpiryNotices(knex: Knex, keys: KeyService): Promise<number | null> {
  const round = await withAdvisoryLock(knex, 'key-expiry-notices', () => keys.sendExpiryNotices(), {
    wait: false,
  });
  return round.ran ? round.value : null;
}
