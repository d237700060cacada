import fs from 'node:fs';
import path from 'node:path';
import { parse } from 'yaml';
import { projectRoot } from './paths';

export type ApiDocument = Record<string, unknown> & {
  info: { version: string };
  paths: Record<string, Record<string, unknown>>;
};

let cached: ApiDocument | null = null;

/** openapi.yaml, parsed once. Callers that may mutate it (the validator does) get a copy. */
export function loadApiDocument(): ApiDocument {
  cached ??= parse(fs.readFileSync(path.join(projectRoot, 'openapi.yaml'), 'utf8')) as ApiDocument;
  return structuredClone(cached);
}
