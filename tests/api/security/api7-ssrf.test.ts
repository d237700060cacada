// OWASP API7:2023 Server Side Request Forgery: the server never fetches a URL a caller gave it.
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadApiDocument } from '../../../backend/api-document';
import { projectRoot } from '../../../backend/paths';

/** Every property name anywhere in request bodies and parameters of the document. */
function requestPropertyNames(): string[] {
  const doc = loadApiDocument() as unknown as {
    paths: Record<
      string,
      Record<string, { parameters?: Array<{ name: string }>; requestBody?: unknown }>
    >;
    components: { schemas: Record<string, unknown> };
  };
  const names: string[] = [];
  const seen = new Set<unknown>();
  const walk = (node: unknown) => {
    if (!node || typeof node !== 'object' || seen.has(node)) return;
    seen.add(node);
    const n = node as Record<string, unknown>;
    if (typeof n.$ref === 'string') walk(doc.components.schemas[n.$ref.split('/').pop()!]);
    if (n.properties && typeof n.properties === 'object') names.push(...Object.keys(n.properties));
    Object.values(n).forEach(walk);
  };
  for (const ops of Object.values(doc.paths)) {
    for (const op of Object.values(ops)) {
      names.push(...(op.parameters ?? []).map((p) => p.name));
      walk(op.requestBody);
    }
  }
  return names;
}

describe('API7 SSRF', () => {
  it('accepts no URL-like input anywhere (no url, uri, href, callback or webhook field)', () => {
    const bad = requestPropertyNames().filter((n) => /url|uri|href|callback|webhook|link/i.test(n));
    expect(bad).toEqual([]);
  });

  it('has no outgoing HTTP client in the back end (the only network client is the mailer to SMTP_URL, set by the operator)', () => {
    const files: string[] = [];
    const walk = (dir: string) => {
      for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
        const p = path.join(dir, e.name);
        if (e.isDirectory()) walk(p);
        else if (p.endsWith('.ts')) files.push(p);
      }
    };
    walk(path.join(projectRoot, 'backend'));
    for (const f of files) {
      const text = fs.readFileSync(f, 'utf8');
      expect(text, f).not.toMatch(
        /\bfetch\(|^import (?!type\b).*from 'node:https?'|require\('https?'\)|axios|got\(/m,
      );
    }
  });
});
