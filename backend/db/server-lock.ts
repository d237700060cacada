import fs from 'node:fs';
import path from 'node:path';

/**
 * Which process serves a database file: `<databaseFile>.server.json` holds its pid and start
 * time while it runs. Restoring a backup under a running server would swap the file beneath its
 * open connection (sqlite.org/howtocorrupt.html: restore while a transaction is active, deleting a
 * hot journal), so db-restore asks here first, and a second server on the same file is refused.
 */
export interface ServerLock {
  pid: number;
  startedAt: string;
}

export function serverLockFile(databaseFile: string): string {
  return `${path.resolve(databaseFile)}.server.json`;
}

/** Whether a process with this pid exists (EPERM: it exists but belongs to someone else). */
function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

function readLock(file: string): ServerLock | null {
  try {
    const parsed = JSON.parse(fs.readFileSync(file, 'utf8')) as Partial<ServerLock>;
    return Number.isInteger(parsed.pid) && parsed.pid! > 0
      ? { pid: parsed.pid!, startedAt: String(parsed.startedAt ?? '') }
      : null;
  } catch {
    return null;
  }
}

/**
 * The live process that holds the database's lock, or null. A lock naming a dead process is stale,
 * and one naming this very process is not another server (a container restarted after a crash
 * often gets the same pid again).
 */
export function runningServer(databaseFile: string): { pid: number } | null {
  if (databaseFile === ':memory:') return null;
  const lock = readLock(serverLockFile(databaseFile));
  if (!lock || lock.pid === process.pid || !alive(lock.pid)) return null;
  return { pid: lock.pid };
}

/**
 * Claims the database for this process and returns the function that gives it back. Throws when
 * another live process holds it; a stale lock is replaced. The lock file appears whole or not at
 * all (written aside, then hard-linked into place, which fails if the name exists).
 */
export function claimServerLock(databaseFile: string): () => void {
  if (databaseFile === ':memory:') return () => {};
  const file = serverLockFile(databaseFile);
  fs.mkdirSync(path.dirname(file), { recursive: true });
  const aside = `${file}.${process.pid}.tmp`;
  fs.writeFileSync(
    aside,
    JSON.stringify({ pid: process.pid, startedAt: new Date().toISOString() } satisfies ServerLock),
  );
  try {
    for (let attempt = 0; ; attempt++) {
      try {
        fs.linkSync(aside, file);
        break;
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code !== 'EEXIST' || attempt > 0) throw error;
        const holder = runningServer(databaseFile);
        if (holder) {
          throw new Error(
            `Another server (pid ${holder.pid}) uses the database ${databaseFile}: stop it first. ` +
              `If no server is running, delete ${file}.`,
            { cause: error },
          );
        }
        fs.rmSync(file, { force: true });
      }
    }
  } finally {
    fs.rmSync(aside, { force: true });
  }
  let released = false;
  return () => {
    if (released) return;
    released = true;
    // Only our own lock: never remove one that another process has since claimed.
    if (readLock(file)?.pid === process.pid) fs.rmSync(file, { force: true });
  };
}
