/**
 * `npm run db:restore -- --from FILE`: puts a backup in place of the database (DATABASE_FILE,
 * default data/conductory.sqlite). Refused (exit 1) while a server runs on that database or when
 * the backup fails its integrity check; nothing is changed then. 2 on usage.
 */
import { parseArgs } from 'node:util';
import { readConfig } from '../backend/config';
import { BackupError, describeSummary, restoreDatabase } from '../backend/db/backup';

let from: string | undefined;
try {
  ({
    values: { from },
  } = parseArgs({ options: { from: { type: 'string' } } }));
} catch (error) {
  console.error(`db:restore: ${(error as Error).message}`);
  process.exit(2);
}
if (!from) {
  console.error('usage: npm run db:restore -- --from FILE');
  process.exit(2);
}

const { databaseFile, databaseUrl } = readConfig();
if (databaseUrl) {
  // PostgreSQL has its own tools, which a person runs against DATABASE_URL (README, "Backups").
  console.error(
    'db:restore: DATABASE_URL is set: this command copies the SQLite file. For PostgreSQL use pg_dump and pg_restore (README, "Backups").',
  );
  process.exit(2);
}
try {
  const summary = await restoreDatabase(from, databaseFile);
  console.log(`Restored ${from} to ${databaseFile}: integrity_check ok.`);
  console.log(describeSummary(summary));
} catch (error) {
  console.error(`db:restore: ${(error as Error).message}`);
  if (!(error instanceof BackupError)) console.error(error);
  process.exit(1);
}
