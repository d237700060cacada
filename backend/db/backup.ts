import fs from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';
import { claimServerLock, runningServer } from './server-lock';

/**
 * Backup and restore of the SQLite file (quality.md, "SQLite in the server"). A backup goes through
 * SQLite's online backup API (better-sqlite3's `backup()`), which copies a consistent snapshot,
 * the committed pages still in the -wal file included, while the server keeps serving; copying the
 * .sqlite file alone would miss those (sqlite.org/wal.html: a commit is appended to the -wal file
 * and reaches the database file only at a later checkpoint). Both directions write a temporary file beside the target,
 * check it with `PRAGMA integrity_check` and only then rename it into place, so the target is
 * always either the old file or a whole, checked new one.
 */

/** The tables whose rows a backup or a restore reports. */
export const COUNTED_TABLES = [
  'alloys',
  'sources',
  'measurements',
  'stacks',
  'readings',
  'users',
  'api_keys',
  'revisions',
  'audit_log',
] as const;

export interface DatabaseSummary {
  file: string;
  bytes: number;
  /** Rows per table of COUNTED_TABLES (tables the file does not have are left out). */
  counts: Record<string, number>;
}

/** An expected refusal: the scripts print its message and exit 1. */
export class BackupError extends Error {}

const SIDE_FILES = ['-wal', '-shm', '-journal'];

function removeWithSideFiles(file: string): void {
  for (const suffix of ['', ...SIDE_FILES]) fs.rmSync(`${file}${suffix}`, { force: true });
}

/** 'ok', or what SQLite found wrong (a file that is no database at all included); never throws. */
export function integrityOf(file: string): string {
  try {
    const db = new Database(file, { fileMustExist: true });
    try {
      const rows = db.pragma('integrity_check') as Array<{ integrity_check: string }>;
      return rows.map((r) => r.integrity_check).join('; ') || 'no answer';
    } finally {
      db.close();
    }
  } catch (error) {
    return (error as Error).message;
  }
}

/** Size and row counts of a database file. */
export function summarize(file: string): DatabaseSummary {
  const db = new Database(file, { readonly: true, fileMustExist: true });
  try {
    const present = new Set(
      (
        db.prepare("SELECT name FROM sqlite_master WHERE type = 'table'").all() as Array<{
          name: string;
        }>
      ).map((r) => r.name),
    );
    const counts: Record<string, number> = {};
    for (const table of COUNTED_TABLES) {
      if (!present.has(table)) continue;
      counts[table] = (db.prepare(`SELECT count(*) AS n FROM "${table}"`).get() as { n: number }).n;
    }
    return { file, bytes: fs.statSync(file).size, counts };
  } finally {
    db.close();
  }
}

/** Makes the file stand alone (rollback journal instead of WAL), then checks it. */
function settleAndCheck(file: string): void {
  const db = new Database(file, { fileMustExist: true });
  try {
    // Folds any -wal into the file and marks it as a plain single-file database.
    db.pragma('journal_mode = DELETE');
  } finally {
    db.close();
  }
  const check = integrityOf(file);
  if (check !== 'ok') throw new BackupError(`integrity_check failed: ${check}`);
}

/**
 * Copies the live database `source` to `target` (replacing it) while a server may be using it.
 * Throws BackupError when the source is missing or the copy fails its integrity check; nothing is
 * left at `target` then (an earlier backup there is kept).
 */
export async function backupDatabase(source: string, target: string): Promise<DatabaseSummary> {
  if (source === ':memory:') throw new BackupError('An in-memory database cannot be backed up.');
  if (!fs.existsSync(source)) throw new BackupError(`There is no database at ${source}.`);
  if (path.resolve(source) === path.resolve(target))
    throw new BackupError('The backup must go to another file than the database.');
  fs.mkdirSync(path.dirname(path.resolve(target)), { recursive: true });
  const temporary = `${target}.${process.pid}.tmp`;
  removeWithSideFiles(temporary);
  try {
    const db = new Database(source, { fileMustExist: true });
    try {
      db.pragma('busy_timeout = 5000');
      await db.backup(temporary);
    } finally {
      db.close();
    }
    try {
      settleAndCheck(temporary);
    } catch (error) {
      throw new BackupError(
        `The copy of ${source} failed its check, so no backup was written: ${(error as Error).message}`,
      );
    }
    fs.renameSync(temporary, target);
  } finally {
    removeWithSideFiles(temporary);
  }
  return summarize(target);
}

/**
 * Puts the backup `backup` in place of the database `target`. Refused while a server runs on
 * `target` (server-lock.ts; the lock is held for the restore, so none starts meanwhile) and when
 * the backup fails its integrity check. The target's -wal and -shm are removed before the rename:
 * SQLite would otherwise replay the old database's log onto the new file.
 */
export async function restoreDatabase(backup: string, target: string): Promise<DatabaseSummary> {
  if (target === ':memory:') throw new BackupError('An in-memory database cannot be restored.');
  if (!fs.existsSync(backup)) throw new BackupError(`There is no backup at ${backup}.`);
  if (path.resolve(backup) === path.resolve(target))
    throw new BackupError('The backup and the database are the same file.');
  const server = runningServer(target);
  if (server)
    throw new BackupError(
      `A server (pid ${server.pid}) is running on ${target}: stop it, then restore.`,
    );
  let release: () => void;
  try {
    release = claimServerLock(target);
  } catch (error) {
    throw new BackupError((error as Error).message);
  }
  fs.mkdirSync(path.dirname(path.resolve(target)), { recursive: true });
  const temporary = `${target}.${process.pid}.restore.tmp`;
  removeWithSideFiles(temporary);
  try {
    fs.copyFileSync(backup, temporary);
    // A backup made by copying a live file may have its log beside it: take that along.
    if (fs.existsSync(`${backup}-wal`)) fs.copyFileSync(`${backup}-wal`, `${temporary}-wal`);
    try {
      settleAndCheck(temporary);
    } catch (error) {
      throw new BackupError(
        `The backup ${backup} is damaged or not a database; nothing was changed: ${(error as Error).message}`,
      );
    }
    const summary = summarize(temporary);
    for (const suffix of SIDE_FILES) fs.rmSync(`${target}${suffix}`, { force: true });
    fs.renameSync(temporary, target);
    return { ...summary, file: target };
  } finally {
    removeWithSideFiles(temporary);
    release();
  }
}

/** "2.1 MB; alloys 60, sources 14, …" for the scripts. */
export function describeSummary(summary: DatabaseSummary): string {
  const size =
    summary.bytes >= 1024 * 1024
      ? `${(summary.bytes / (1024 * 1024)).toFixed(1)} MB`
      : `${(summary.bytes / 1024).toFixed(1)} kB`;
  const rows = Object.entries(summary.counts)
    .map(([table, n]) => `${table} ${n}`)
    .join(', ');
  return `${summary.file}: ${size} (${summary.bytes} bytes); rows: ${rows}`;
}
