import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** The checkout's top folder, wherever the process was started from. */
export const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
export const clientDist = path.join(projectRoot, 'dist', 'client');
