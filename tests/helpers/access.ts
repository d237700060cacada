import request from 'supertest';
import type { Express } from 'express';
import { demoAccounts } from '../../seeds/demo/accounts';
import { TEST_PUBLIC_URL } from './test-app';

export type DemoRole = 'reader' | 'integrator' | 'curator' | 'admin';

export const demo = (role: DemoRole) => demoAccounts.find((a) => a.role === role)!;

/**
 * A supertest agent signed in as one of the demo accounts (the cookie kept between calls). Like a
 * browser on the test app's page, it sends that page's Origin with every request: a cookie write
 * without it is refused (backend/auth/same-origin.ts).
 */
export async function signedIn(app: Express, role: DemoRole | { email: string; password: string }) {
  const who = typeof role === 'string' ? demo(role) : role;
  const agent = request.agent(app).set('Origin', TEST_PUBLIC_URL);
  const res = await agent
    .post('/api/v1/auth/sign-in')
    .send({ email: who.email, password: who.password });
  if (res.status !== 200)
    throw new Error(`sign-in as ${who.email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

/** Creates a key as the signed-in agent and returns the key itself and its id. */
export async function newKey(
  agent: ReturnType<typeof request.agent>,
  role: DemoRole,
  name = 'test key',
  expiresAt?: string,
) {
  const res = await agent
    .post('/api/v1/keys')
    .send({ name, role, ...(expiresAt ? { expiresAt } : {}) });
  if (res.status !== 201)
    throw new Error(`key creation failed: ${res.status} ${JSON.stringify(res.body)}`);
  return {
    key: res.body.key as string,
    id: res.body.id as number,
    prefix: res.body.prefix as string,
  };
}

export const bearer = (key: string) => ({ Authorization: `Bearer ${key}` });

/** The session cookie value an agent holds after signing in. */
export function sessionCookieOf(setCookie: string[] | string | undefined): string | undefined {
  const all = Array.isArray(setCookie) ? setCookie : setCookie ? [setCookie] : [];
  return all
    .find((c) => c.startsWith('conductory_session='))
    ?.split(';')[0]
    ?.split('=')[1];
}
