import path from 'node:path';

/** Settings read once from the environment; every one has a default that works on a laptop. */
export interface Config {
  port: number;
  host: string;
  databaseFile: string;
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
  return {
    port,
    host: env.HOST ?? '127.0.0.1',
    databaseFile: env.DATABASE_FILE ?? path.join('data', 'conductory.sqlite'),
    logLevel: env.LOG_LEVEL ?? (env.NODE_ENV === 'test' ? 'silent' : 'info'),
    production: env.NODE_ENV === 'production',
    smtpUrl: env.SMTP_URL || undefined,
    publicUrl: env.PUBLIC_URL || undefined,
    demoAccounts: env.NODE_ENV !== 'production' || env.DEMO_ACCOUNTS === '1',
    estimateThreads: threads,
  };
}
