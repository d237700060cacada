import path from 'node:path';

/** Settings read once from the environment; every one has a default that works on a laptop. */
export interface Config {
  port: number;
  host: string;
  databaseFile: string;
  /** DATABASE_URL: a PostgreSQL address; when set, it is the database and DATABASE_FILE is unused. */
  databaseUrl: string | undefined;
  /** TRUST_PROXY: Express's `trust proxy` (false, a hop count, or addresses and subnets). */
  trustProxy: boolean | number | string;
  logLevel: string;
  production: boolean;
  smtpUrl: string | undefined;
  publicUrl: string | undefined;
  demoAccounts: boolean;
  /** Worker threads for the calculators; unset leaves one core to the event loop. */
  estimateThreads: number | undefined;
}

export function readConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const port = Number(env.PORT ?? 3000);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    throw new Error(`PORT must be an integer from 0 to 65535, not '${env.PORT}'`);
  }
  const threads = env.ESTIMATE_THREADS === undefined ? undefined : Number(env.ESTIMATE_THREADS);
  if (threads !== undefined && (!Number.isInteger(threads) || threads < 1 || threads > 64)) {
    throw new Error(
      `ESTIMATE_THREADS must be an integer from 1 to 64, not '${env.ESTIMATE_THREADS}'`,
    );
  }
  const databaseUrl = env.DATABASE_URL || undefined;
  if (databaseUrl && !/^postgres(ql)?:\/\//i.test(databaseUrl)) {
    throw new Error(
      'DATABASE_URL must be a postgres:// or postgresql:// address (unset it to use the SQLite file DATABASE_FILE)',
    );
  }
  return {
    port,
    host: env.HOST ?? '127.0.0.1',
    databaseFile: env.DATABASE_FILE ?? path.join('data', 'conductory.sqlite'),
    databaseUrl,
    trustProxy: parseTrustProxy(env.TRUST_PROXY),
    logLevel: env.LOG_LEVEL ?? (env.NODE_ENV === 'test' ? 'silent' : 'info'),
    production: env.NODE_ENV === 'production',
    smtpUrl: env.SMTP_URL || undefined,
    publicUrl: env.PUBLIC_URL || undefined,
    demoAccounts: env.NODE_ENV !== 'production' || env.DEMO_ACCOUNTS === '1',
    estimateThreads: threads,
  };
}

/**
 * TRUST_PROXY as Express's `trust proxy` setting: unset, empty, `0` or `false` trusts no proxy (the
 * default: X-Forwarded-For is ignored, so a client cannot pick its own address); a whole number
 * trusts that many proxies in front of us; `true` trusts every hop (only when nothing but the proxy
 * can reach the instances); anything else is a comma-separated list of addresses, subnets or
 * Express's names (`loopback`, `uniquelocal`).
 */
export function parseTrustProxy(value: string | undefined): boolean | number | string {
  const v = value?.trim() ?? '';
  if (v === '' || v === '0' || v.toLowerCase() === 'false') return false;
  if (v.toLowerCase() === 'true') return true;
  if (/^\d+$/.test(v)) return Number(v);
  return v;
}

/** The database as a person may read it in a log line: a PostgreSQL address without its password. */
export function describeDatabase(config: Pick<Config, 'databaseFile' | 'databaseUrl'>): string {
  if (!config.databaseUrl) return config.databaseFile;
  try {
    const url = new URL(config.databaseUrl);
    if (url.password) url.password = '***';
    return url.toString();
  } catch {
    return 'PostgreSQL (DATABASE_URL)';
  }
}
