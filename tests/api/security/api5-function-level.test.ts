// OWASP API5:2023 Broken Function Level Authorization: a role × operation matrix from openapi.yaml.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadApiDocument } from '../../../backend/api-document';
import { signedIn, type DemoRole } from '../../helpers/access';
import { createTestApp, type TestApp } from '../../helpers/test-app';

let t: TestApp;
const agents = new Map<string, Awaited<ReturnType<typeof signedIn>> | null>();
beforeAll(async () => {
  t = await createTestApp({ accounts: true });
  agents.set('visitor', null);
  for (const role of ['reader', 'integrator', 'curator', 'admin'] as DemoRole[])
    agents.set(role, await signedIn(t.app, role));
});
afterAll(() => t.knex.destroy());

type Op = { method: string; path: string; roles: string[] };
const operations: Op[] = Object.entries(loadApiDocument().paths).flatMap(([path, ops]) =>
  Object.entries(ops).map(([method, op]) => ({
    method,
    path,
    roles: (op as { 'x-roles': string[] })['x-roles'],
  })),
);
// Path parameters filled with values that exist or at least parse; bodies left empty: access is
// decided before the body is read, so an allowed caller gets anything but 401/403 and a refused
// one gets exactly 401 (no credentials) or 403 (the wrong role).
const fill = (path: string) => path.replace('{slug}', 'copper-c11000').replace('{id}', '999999');
const callers = ['visitor', 'reader', 'integrator', 'curator', 'admin'];
const cases = operations.flatMap((op) =>
  callers.map((caller) => ({ ...op, caller, allowed: op.roles.includes(caller) })),
);
// Sign-out would end the agent's session for the rest of the matrix: it runs for visitors only here.
const matrix = cases.filter((c) => !(c.path === '/auth/sign-out' && c.caller !== 'visitor'));

describe('API5 function level: every operation × every role, as openapi.yaml’s x-roles say', () => {
  it('covers every operation in the document', () => {
    expect(new Set(matrix.map((c) => `${c.method} ${c.path}`)).size).toBe(operations.length);
  });

  it.each(matrix)(
    '$caller → $method $path (allowed: $allowed)',
    async ({ method, path, caller, allowed }) => {
      const agent = agents.get(caller);
      const url = `/api/v1${fill(path)}`;
      const client = agent ?? request(t.app);
      const res = await (client as unknown as Record<string, (u: string) => request.Test>)[method]!(
        url,
      ).send({});
      if (allowed) {
        expect(
          [401, 403],
          `${caller} ${method} ${url} → ${res.status} ${JSON.stringify(res.body)}`,
        ).not.toContain(res.status);
      } else {
        expect(res.status, `${caller} ${method} ${url}`).toBe(caller === 'visitor' ? 401 : 403);
        expect(res.type).toBe('application/problem+json');
      }
    },
  );
});
