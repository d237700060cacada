/**
 * `npm start`: builds the front end when it has not been built (or sources are newer than the
 * build), then starts the server in this same process, which migrates and seeds an empty
 * database before listening.
 *
 * The build runs in a child process because Vite's `build()` sets `process.env.NODE_ENV` to
 * 'production' in whatever process calls it; run here, it made every first start believe it was
 * a production deployment (and refuse to start without a JWT secret). Production is only what the
 * operator says with NODE_ENV=production.
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { clientDist, projectRoot } from '../backend/paths';
import { startServer } from '../backend/server';

function newestMtime(target: string): number {
  const stat = fs.statSync(target);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of fs.readdirSync(target))
    newest = Math.max(newest, newestMtime(path.join(target, entry)));
  return newest;
}

const builtIndex = path.join(clientDist, 'index.html');
const sources = ['frontend', 'shared', 'index.html', 'vite.config.ts', 'tailwind.config.ts'].map(
  (p) => path.join(projectRoot, p),
);
const stale =
  !fs.existsSync(builtIndex) ||
  Math.max(...sources.map(newestMtime)) > fs.statSync(builtIndex).mtimeMs;
if (stale) {
  console.log('Building the front end (first start or sources changed)…');
  const vite = path.join(projectRoot, 'node_modules', 'vite', 'bin', 'vite.js');
  const built = spawnSync(process.execPath, [vite, 'build', '--logLevel', 'warn'], {
    cwd: projectRoot,
    stdio: 'inherit',
  });
  if (built.status !== 0) {
    console.error(`The front-end build failed (exit ${built.status ?? built.signal}).`);
    process.exit(1);
  }
}
await startServer();
