import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import type { Knex } from 'knex';
import { sharedByInstances } from '../db/dialect';

interface Row {
  hits: number | string;
  reset_at: number | string;
}

const info = (row: Row): ClientRateLimitInfo => ({
  totalHits: Number(row.hits),
  resetTime: new Date(Number(row.reset_at)),
});

/**
 * An express-rate-limit store in the `rate_limits` table, on the app's own Knex connection: a
 * fixed window per key, like the MemoryStore it replaces, but shared by every instance on the
 * database. One upsert counts a hit and returns the count (Knex's `onConflict().merge()` with
 * `RETURNING`, the same statement on PostgreSQL and SQLite); the window restarts in the same
 * statement when it has ended, so two instances can never both open a fresh window for one key.
 *
 * Why our own and not @acpr/rate-limit-postgresql: that package opens a pool of its own per
 * limiter and keeps its tables in a schema it migrates itself; this one needs neither, and a test
 * database (one per test file) carries its counters with it.
 */
export class KnexRateLimitStore implements Store {
  /** Counts are kept in the database: a hit on another instance counts here too. */
  readonly localKeys = false;
  private windowMs = 60_000;
  private sweeper: NodeJS.Timeout | undefined;

  constructor(
    private readonly knex: Knex,
    /** Keeps each limiter's keys apart (the address limiter and the API limiter both key on ip). */
    readonly prefix: string,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
    // Ended windows are rewritten on the next hit; rows of callers who never come back go here.
    this.sweeper = setInterval(() => {
      void this.knex('rate_limits')
        .where('reset_at', '<', Date.now())
        .del()
        .catch(() => undefined);
    }, this.windowMs);
    this.sweeper.unref();
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const row = (await this.knex('rate_limits')
      .where({ key: this.prefix + key })
      .where('reset_at', '>', Date.now())
      .first('hits', 'reset_at')) as Row | undefined;
    return row && info(row);
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const now = Date.now();
    const [row] = (await this.knex('rate_limits')
      .insert({ key: this.prefix + key, hits: 1, reset_at: now + this.windowMs })
      .onConflict('key')
      .merge({
        hits: this.knex.raw('CASE WHEN ?? <= ? THEN 1 ELSE ?? + 1 END', [
          'rate_limits.reset_at',
          now,
          'rate_limits.hits',
        ]),
        reset_at: this.knex.raw('CASE WHEN ?? <= ? THEN ? ELSE ?? END', [
          'rate_limits.reset_at',
          now,
          now + this.windowMs,
          'rate_limits.reset_at',
        ]),
      })
      .returning(['hits', 'reset_at'])) as Row[];
    return info(row!);
  }

  async decrement(key: string): Promise<void> {
    await this.knex('rate_limits')
      .where({ key: this.prefix + key })
      .where('reset_at', '>', Date.now())
      .where('hits', '>', 0)
      .decrement('hits', 1);
  }

  async resetKey(key: string): Promise<void> {
    await this.knex('rate_limits')
      .where({ key: this.prefix + key })
      .del();
  }

  shutdown(): void {
    clearInterval(this.sweeper);
  }
}

/**
 * Where a limiter counts: in the database when other instances may share it (PostgreSQL), in
 * this process's memory otherwise (undefined: express-rate-limit's MemoryStore).
 */
export type LimiterStores = (name: string) => Store | undefined;

export function limiterStores(knex: Knex): LimiterStores {
  return sharedByInstances(knex)
    ? (name) => new KnexRateLimitStore(knex, `${name}:`)
    : () => undefined;
}
