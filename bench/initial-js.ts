/**
 * The JavaScript a first visit downloads before anything shows: the entry script of the built
 * index.html and every module it preloads, gzipped as the server sends them (compression's
 * default level). The budget is 170 kB (quality.md, after web.dev's performance budget).
 */
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import { clientDist } from '../backend/paths';

export const INITIAL_JS_BUDGET_KB = 170;

export function initialJavaScript(): { files: string[]; rawKb: number; gzipKb: number } | null {
  const index = path.join(clientDist, 'index.html');
  if (!fs.existsSync(index)) return null;
  const html = fs.readFileSync(index, 'utf8');
  const files = [
    ...html.matchAll(/<script[^>]+src="\/([^"]+\.js)"/g),
    ...html.matchAll(/<link[^>]+rel="modulepreload"[^>]+href="\/([^"]+\.js)"/g),
  ].map((m) => m[1]!);
  let raw = 0;
  let gzip = 0;
  for (const file of new Set(files)) {
    const body = fs.readFileSync(path.join(clientDist, file));
    raw += body.length;
    gzip += zlib.gzipSync(body, { level: 6 }).length;
  }
  return { files: [...new Set(files)], rawKb: raw / 1024, gzipKb: gzip / 1024 };
}
