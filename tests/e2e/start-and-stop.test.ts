// The README's run line as a person uses it: `npm start` with no NODE_ENV, then Ctrl-C or a
// service manager's SIGTERM. In-flight requests finish, the database closes, the exit code is 0,
// and nothing is left answering on the port.
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { projectRoot } from '../../backend/paths';
import { heaviestLaunch, typicalLaunch } from '../helpers/launches';
import { personEnv } from '../helpers/product';

interface Started {
  child: ChildProcess;
  url: string;
  output: () => string;
  exited: Promise<number | null>;
  dataDir: string;
}

const running: Started[] = [];

async function npmStart(): Promise<Started> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'conductory-start-'));
  const child = spawn('npm', ['start'], {
    cwd: projectRoot,
    env: { ...personEnv(), PORT: '0', DATABASE_FILE: path.join(dataDir, 'db.sqlite') },
    detached: true,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout!.on('data', (c: Buffer) => (out += c.toString()));
  child.stderr!.on('data', (c: Buffer) => (out += c.toString()));
  const exited = new Promise<number | null>((r) => child.once('exit', (code) => r(code)));
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setInterval(() => {
      const m = out.match(/serving on (http:\/\/[\d.]+:\d+)\//);
      if (m && /Mode: /.test(out)) {
        clearInterval(timer);
        resolve(m[1]!);
      }
    }, 50);
    void exited.then((code) => {
      clearInterval(timer);
      reject(new Error(`npm start exited with ${code}:\n${out}`));
    });
  });
  const started = { child, url, output: () => out, exited, dataDir };
  running.push(started);
  return started;
}

const post = (url: string, body: unknown) =>
  fetch(url, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify(body),
  });

afterEach(() => {
  for (const s of running.splice(0)) {
    if (s.child.exitCode === null && s.child.signalCode === null) {
      try {
        process.kill(-s.child.pid!, 'SIGKILL');
      } catch {
        // already gone
      }
    }
    fs.rmSync(s.dataDir, { recursive: true, force: true });
  }
});

describe('npm start with the environment a person has', () => {
  it('starts in development mode and says so', async () => {
    const s = await npmStart();
    expect(s.output()).toMatch(/Mode: development/);
    const health = await fetch(`${s.url}/api/v1/health`);
    expect(health.status).toBe(200);
    process.kill(-s.child.pid!, 'SIGTERM');
    expect(await s.exited).toBe(0);
  }, 180_000);

  it('SIGTERM to the process group during a slow estimate: the request gets its answer, exit 0', async () => {
    const s = await npmStart();
    // Warm a worker thread so the slow request is surely computing when the signal arrives.
    expect((await post(`${s.url}/api/v1/estimates/launch`, typicalLaunch)).status).toBe(200);
    const slow = post(`${s.url}/api/v1/estimates/launch`, heaviestLaunch);
    await new Promise((r) => setTimeout(r, 500));
    // /health is answered while the launch computes: the event loop is free.
    const health = await fetch(`${s.url}/api/v1/health`);
    expect(health.status).toBe(200);
    process.kill(-s.child.pid!, 'SIGTERM');
    const res = await slow;
    // The heaviest launch outruns the 5 s compute limit: a 422 answer, not a dropped connection.
    expect([200, 422]).toContain(res.status);
    expect(await s.exited).toBe(0);
    expect(s.output()).toMatch(/SIGTERM: no new connections/);
    expect(s.output()).toMatch(/Closed the database/);
    await expect(fetch(`${s.url}/api/v1/health`)).rejects.toThrow();
  }, 180_000);

  it('SIGTERM to npm alone leaves no server behind', async () => {
    const s = await npmStart();
    process.kill(s.child.pid!, 'SIGTERM');
    await s.exited;
    await new Promise((r) => setTimeout(r, 1500));
    await expect(fetch(`${s.url}/api/v1/health`)).rejects.toThrow();
    expect(fs.existsSync(path.join(s.dataDir, 'db.sqlite.server.json'))).toBe(false);
  }, 180_000);

  it('npm killed outright (SIGKILL): the server notices it is orphaned and closes', async () => {
    const s = await npmStart();
    process.kill(s.child.pid!, 'SIGKILL');
    await s.exited;
    const closed = new Promise((r) => s.child.stdout!.once('close', r));
    await closed;
    expect(s.output()).toMatch(/parent process gone: no new connections/);
    expect(s.output()).toMatch(/Closed the database/);
    await expect(fetch(`${s.url}/api/v1/health`)).rejects.toThrow();
  }, 180_000);
});
