/**
 * `npm start`: builds the front end when it has not been built (or sources are newer than the
 * build), then starts the server, which migrates and seeds an empty database before listening.
 */
import fs from 'node:fs';
import path from 'node:path';
import { build } from 'vite';
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
  await build({ root: projectRoot, logLevel: 'warn' });
}
await startServer();
