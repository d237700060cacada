// Backups (issue 8; quality.md "SQLite in the server"): through SQLite's online backup API to a
// temporary name, renamed, integrity_check ok; restore refused under a running server or from a
// damaged file. The server lock says which process serves a database file.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  backupDatabase,
  BackupError,
  integrityOf,
  restoreDatabase,
  summarize,
} from '../../backend/db/backup';
import { createKnex } from '../../backend/db/knex';
import { projectRoot } from '../../backend/paths';
import { prepareDatabase } from '../../backend/db/prepare';
import { claimServerLock, runningServer, serverLockFile } from '../../backend/db/server-lock';

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'conductory-backup-'));
const live = path.join(dir, 'live.sqlite');
const backup = path.join(dir, 'backups', 'nightly.sqlite');
let knex: Knex;

/** A pid that certainly belongs to no process any more: a child that has exited. */
const deadPid = () => spawnSync(process.execPath, ['-e', '0']).pid!;

const TABLES = ['alloys', 'sources', 'measurements', 'stacks', 'readings', 'users'] as const;
function countsOf(file: string): Record<string, number> {
  const db = new Database(file, { readonly: true });
  try {
    return Object.fromEntries(
      TABLES.map((t) => [
        t,
        (db.prepare(`SELECT count(*) AS n FROM ${t}`).get() as { n: number }).n,
      ]),
    );
  } finally {
    db.close();
  }
}
const rowsOf = (file: string, sql: string) => {
  const db = new Database(file, { readonly: true });
  try {
    return db.prepare(sql).all();
  } finally {
    db.close();
  }
};

beforeAll(async () => {
  knex = createKnex(live);
  await prepareDatabase(knex, { demo: true, demoAccounts: true });
  // Everything so far into the main file; what follows stays in the -wal until a checkpoint
  // (SQLite checkpoints on its own only past 1000 pages: sqlite.org/wal.html, "Automatic Checkpoint").
  await knex.raw('PRAGMA wal_checkpoint(TRUNCATE)');
  for (let i = 0; i < 25; i++) {
    await knex('readings').insert({
      label: `written while serving ${i}`,
      site: 'Ridgeline line 2 (invented for the test)',
      product: 'test blank',
      conductivity_s_per_m: 15e6 + i * 1000,
      frequency_hz: 60_000,
      temperature_k: 293.15,
      invented: true,
    });
  }
  await knex('users').where({ email: 'reader@carrowbay.example' }).update({ name: 'Renamed live' });
}, 60_000);

afterAll(async () => {
  await knex?.destroy();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe('why not cp: the newest rows sit in the -wal file', () => {
  it('a plain copy of the .sqlite file alone misses rows the server has committed', () => {
    const plain = path.join(dir, 'plain-copy.sqlite');
    fs.copyFileSync(live, plain);
    const copied = countsOf(plain).readings!;
    const liveNow = countsOf(live).readings!;
    expect(fs.statSync(`${live}-wal`).size).toBeGreaterThan(0);
    expect(liveNow - copied).toBe(25);
  });
});

describe('backupDatabase while the knex connection is open', () => {
  it('copies everything committed, checks it and reports the rows', async () => {
    const summary = await backupDatabase(live, backup);
    expect(summary.file).toBe(backup);
    expect(summary.bytes).toBe(fs.statSync(backup).size);
    expect(summary.counts).toMatchObject(countsOf(live));
    expect(summary.counts.readings).toBeGreaterThanOrEqual(25);
    expect(integrityOf(backup)).toBe('ok');
    // One self-contained file: no -wal needed beside it, no temporary left.
    expect(fs.readdirSync(path.dirname(backup))).toEqual(['nightly.sqlite']);
    const [header] = rowsOf(backup, 'PRAGMA journal_mode') as Array<{ journal_mode: string }>;
    expect(header!.journal_mode).toBe('delete');
    // The server goes on writing after the backup.
    await knex('readings').where({ label: 'written while serving 0' }).update({ label: 'later' });
  });

  it('refuses a missing source and a target that is the source', async () => {
    await expect(backupDatabase(path.join(dir, 'none.sqlite'), backup)).rejects.toThrow(
      BackupError,
    );
    await expect(backupDatabase(live, live)).rejects.toThrow(BackupError);
    expect(fs.existsSync(path.join(dir, 'none.sqlite'))).toBe(false);
  });
});

describe('restoreDatabase', () => {
  const fresh = path.join(dir, 'restored', 'conductory.sqlite');

  it('puts the backup in place: the same rows in several tables', async () => {
    const summary = await restoreDatabase(backup, fresh);
    expect(summary.file).toBe(fresh);
    expect(countsOf(fresh)).toEqual(countsOf(backup));
    for (const sql of [
      'SELECT * FROM readings ORDER BY id',
      'SELECT * FROM alloys ORDER BY id LIMIT 5',
      'SELECT * FROM measurements ORDER BY id LIMIT 5',
      'SELECT id, email, name, role, password_hash FROM users ORDER BY id',
      'SELECT * FROM stacks ORDER BY id',
    ])
      expect(rowsOf(fresh, sql), sql).toEqual(rowsOf(backup, sql));
    const labels = (rowsOf(fresh, 'SELECT label FROM readings') as Array<{ label: string }>).map(
      (r) => r.label,
    );
    expect(labels).toContain('written while serving 24');
    expect(labels).toContain('written while serving 0'); // as it was at backup time
    const [reader] = rowsOf(
      fresh,
      "SELECT name FROM users WHERE email = 'reader@carrowbay.example'",
    );
    expect(reader).toEqual({ name: 'Renamed live' });
    expect(fs.existsSync(serverLockFile(fresh))).toBe(false);
  });

  it('the restored file opens as the product opens it', async () => {
    const k = createKnex(fresh);
    await prepareDatabase(k, { demo: true, demoAccounts: true });
    const [{ n }] = (await k('readings').count({ n: '*' })) as [{ n: number }];
    await k.destroy();
    expect(Number(n)).toBe(countsOf(backup).readings);
  });

  it('replaces a database and drops its stale -wal and -shm', async () => {
    const target = path.join(dir, 'busy', 'conductory.sqlite');
    const old = createKnex(target);
    await prepareDatabase(old, { demo: false });
    await old('sources').insert({ citation: 'only in the old log', kind: 'from_memory' });
    // A crashed server leaves its -wal and -shm behind; keep them by never closing cleanly.
    fs.copyFileSync(target, `${target}.main`);
    fs.copyFileSync(`${target}-wal`, `${target}.wal`);
    await old.destroy();
    fs.renameSync(`${target}.main`, target);
    fs.renameSync(`${target}.wal`, `${target}-wal`);
    fs.writeFileSync(`${target}-shm`, Buffer.alloc(32_768));
    await restoreDatabase(backup, target);
    expect(fs.existsSync(`${target}-wal`)).toBe(false);
    expect(fs.existsSync(`${target}-shm`)).toBe(false);
    expect(countsOf(target)).toEqual(countsOf(backup));
    expect(rowsOf(target, "SELECT * FROM sources WHERE citation = 'only in the old log'")).toEqual(
      [],
    );
  });

  it('is refused while a server with a live pid holds the database, and changes nothing', async () => {
    const before = fs.readFileSync(fresh);
    // The vitest parent process stands in for a running server: it is certainly alive.
    fs.writeFileSync(
      serverLockFile(fresh),
      JSON.stringify({ pid: process.ppid, startedAt: new Date().toISOString() }),
    );
    try {
      expect(runningServer(fresh)).toEqual({ pid: process.ppid });
      await expect(restoreDatabase(backup, fresh)).rejects.toThrow(
        new RegExp(`server \\(pid ${process.ppid}\\) is running`),
      );
      expect(fs.readFileSync(fresh).equals(before)).toBe(true);
    } finally {
      fs.rmSync(serverLockFile(fresh), { force: true });
    }
  });

  it('a stale lock from a dead server does not stand in the way', async () => {
    fs.writeFileSync(serverLockFile(fresh), JSON.stringify({ pid: deadPid(), startedAt: 'x' }));
    expect(runningServer(fresh)).toBeNull();
    await restoreDatabase(backup, fresh);
    expect(fs.existsSync(serverLockFile(fresh))).toBe(false);
  });

  it('refuses a truncated backup and leaves the database as it was', async () => {
    const truncated = path.join(dir, 'truncated.sqlite');
    const bytes = fs.readFileSync(backup);
    fs.writeFileSync(truncated, bytes.subarray(0, Math.floor(bytes.length / 2)));
    const before = fs.readFileSync(fresh);
    await expect(restoreDatabase(truncated, fresh)).rejects.toThrow(/damaged or not a database/);
    expect(fs.readFileSync(fresh).equals(before)).toBe(true);
    expect(fs.readdirSync(path.dirname(fresh)).sort()).toEqual(['conductory.sqlite']);
  });

  it('refuses a file that is not a database at all', async () => {
    const text = path.join(dir, 'notes.txt');
    fs.writeFileSync(text, 'not a database '.repeat(500));
    await expect(restoreDatabase(text, fresh)).rejects.toThrow(BackupError);
    expect(summarize(fresh).counts).toEqual(summarize(backup).counts);
  });
});

describe('the server lock', () => {
  const db = path.join(dir, 'locked', 'conductory.sqlite');

  it('is written with pid and start time, and removed on release', () => {
    const release = claimServerLock(db);
    const lock = JSON.parse(fs.readFileSync(serverLockFile(db), 'utf8'));
    expect(lock.pid).toBe(process.pid);
    expect(Date.parse(lock.startedAt)).not.toBeNaN();
    // This very process is not "another server".
    expect(runningServer(db)).toBeNull();
    release();
    expect(fs.existsSync(serverLockFile(db))).toBe(false);
    release(); // twice is harmless
  });

  it('refuses a second server while the first one lives', () => {
    fs.mkdirSync(path.dirname(db), { recursive: true });
    fs.writeFileSync(serverLockFile(db), JSON.stringify({ pid: process.ppid, startedAt: 'x' }));
    try {
      expect(() => claimServerLock(db)).toThrow(/Another server \(pid \d+\) uses the database/);
      expect(JSON.parse(fs.readFileSync(serverLockFile(db), 'utf8')).pid).toBe(process.ppid);
    } finally {
      fs.rmSync(serverLockFile(db), { force: true });
    }
  });

  it('replaces a stale lock (dead pid, or unreadable) and never removes another’s', () => {
    for (const stale of [JSON.stringify({ pid: deadPid(), startedAt: 'x' }), '{"pid":', '']) {
      fs.writeFileSync(serverLockFile(db), stale);
      const release = claimServerLock(db);
      expect(JSON.parse(fs.readFileSync(serverLockFile(db), 'utf8')).pid).toBe(process.pid);
      release();
    }
    const release = claimServerLock(db);
    fs.writeFileSync(serverLockFile(db), JSON.stringify({ pid: process.ppid, startedAt: 'x' }));
    release();
    expect(fs.existsSync(serverLockFile(db))).toBe(true);
    fs.rmSync(serverLockFile(db));
  });

  it('is skipped for an in-memory database', () => {
    const release = claimServerLock(':memory:');
    expect(runningServer(':memory:')).toBeNull();
    release();
  });
});

describe('npm run db:backup and db:restore', () => {
  const run = (script: string, args: string[], databaseFile: string) =>
    spawnSync(process.execPath, ['--import', 'tsx', path.join(projectRoot, script), ...args], {
      cwd: projectRoot,
      env: { ...process.env, DATABASE_FILE: databaseFile, NODE_ENV: 'test' },
      encoding: 'utf8',
    });

  it('back up and restore from the command line, and say what they did', () => {
    const target = path.join(dir, 'cli', 'backup.sqlite');
    const made = run('scripts/db-backup.ts', ['--to', target], live);
    expect(made.stderr).toBe('');
    expect(made.status).toBe(0);
    expect(made.stdout).toMatch(/integrity_check ok/);
    expect(made.stdout).toMatch(/rows: alloys \d+, sources \d+/);
    expect(made.stdout).toMatch(/\d+(\.\d)? (kB|MB)/);
    const restored = path.join(dir, 'cli', 'restored.sqlite');
    const back = run('scripts/db-restore.ts', ['--from', target], restored);
    expect(back.status).toBe(0);
    expect(countsOf(restored)).toEqual(countsOf(target));
  }, 60_000);

  it('exit 1 with a clear message when a server runs on the database; 2 without --from', () => {
    const restored = path.join(dir, 'cli', 'restored.sqlite');
    fs.writeFileSync(
      serverLockFile(restored),
      JSON.stringify({ pid: process.ppid, startedAt: new Date().toISOString() }),
    );
    try {
      const refused = run('scripts/db-restore.ts', ['--from', backup], restored);
      expect(refused.status).toBe(1);
      expect(refused.stderr).toMatch(/is running on .*restored\.sqlite: stop it, then restore/);
    } finally {
      fs.rmSync(serverLockFile(restored), { force: true });
    }
    expect(run('scripts/db-restore.ts', [], restored).status).toBe(2);
  }, 60_000);
});
