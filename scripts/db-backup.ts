/**
 * `npm run db:backup -- --to FILE`: an online backup of the database (DATABASE_FILE, default
 * data/conductory.sqlite) while the server may be running. Exit 0 with the rows counted, 1 when the
 * copy could not be made or failed its integrity check (nothing is left at FILE then), 2 on usage.
 * Keep the JWT secret with it: see README, "Backups".
 */
import { parseArgs } from 'node:util';
import { readConfig } from '../backend/config';
import { backupDatabase, BackupError, describeSummary } from '../backend/db/backup';

let to: string | undefined;
try {
  ({
    values: { to },
  } = parseArgs({ options: { to: { type: 'string' } } }));
} catch (error) {
  console.error(`db:backup: ${(error as Error).message}`);
  process.exit(2);
}
if (!to) {
  console.error('usage: npm run db:backup -- --to FILE');
  process.exit(2);
}

const { databaseFile, databaseUrl } = readConfig();
if (databaseUrl) {
  // PostgreSQL has its own tools, which a person runs against DATABASE_URL (README, "Backups").
  console.error(
    'db:backup: DATABASE_URL is set: this command copies the SQLite file. For PostgreSQL use pg_dump and pg_restore (README, "Backups").',
  );
  process.exit(2);
}
try {
  const summary = await backupDatabase(databaseFile, to);
  console.log(`Backed up ${databaseFile} to ${to}: integrity_check ok.`);
  console.log(describeSummary(summary));
} catch (error) {
  console.error(`db:backup: ${(error as Error).message}`);
  if (!(error instanceof BackupError)) console.error(error);
  process.exit(1);
}
