// OWASP API2:2023 Broken Authentication: forged, expired and revoked credentials fail at once (RFC 8725).
import jwt from 'jsonwebtoken';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JWT_AUDIENCE, JWT_ISSUER } from '../../../backend/auth/session-tokens';
import { bearer, newKey, sessionCookieOf, signedIn, demo } from '../../helpers/access';
import { createTestApp, TEST_PUBLIC_URL, type TestApp } from '../../helpers/test-app';

let t: TestApp;
let sessionId = '';
let userId = '';
beforeAll(async () => {
  t = await createTestApp({ accounts: true });
  const res = await request(t.app)
    .post('/api/v1/auth/sign-in')
    .send({ email: demo('reader').email, password: demo('reader').password });
  const claims = jwt.decode(sessionCookieOf(res.headers['set-cookie'])!) as jwt.JwtPayload;
  sessionId = claims.jti!;
  userId = claims.sub!;
});
afterAll(() => t.knex.destroy());

const me = (token: string) =>
  request(t.app).get('/api/v1/me').set('Cookie', `conductory_session=${token}`);
const base = () => ({ sub: userId, jti: sessionId, role: 'admin' });
const opts = { algorithm: 'HS256' as const, issuer: JWT_ISSUER, audience: JWT_AUDIENCE };

describe('API2 authentication: forged session tokens → 401', () => {
  it('a well-formed token of the live session is accepted (the control)', async () => {
    expect(
      (
        await me(
          jwt.sign({ role: 'reader' }, t.jwtSecret, {
            ...opts,
            subject: userId,
            jwtid: sessionId,
            expiresIn: 60,
          }),
        )
      ).status,
    ).toBe(200);
  });
  it('alg "none"', async () => {
    const header = Buffer.from(JSON.stringify({ alg: 'none', typ: 'JWT' })).toString('base64url');
    const payload = Buffer.from(
      JSON.stringify({
        ...base(),
        iss: JWT_ISSUER,
        aud: JWT_AUDIENCE,
        exp: Math.floor(Date.now() / 1000) + 60,
      }),
    ).toString('base64url');
    expect((await me(`${header}.${payload}.`)).status).toBe(401);
  });
  it('a different algorithm (HS512) with the right secret', async () => {
    expect(
      (await me(jwt.sign(base(), t.jwtSecret, { ...opts, algorithm: 'HS512', expiresIn: 60 })))
        .status,
    ).toBe(401);
  });
  it('the wrong secret', async () => {
    expect(
      (
        await me(
          jwt.sign(base(), 'not the secret at all, not even close to it', {
            ...opts,
            expiresIn: 60,
          }),
        )
      ).status,
    ).toBe(401);
  });
  it('expired', async () => {
    expect(
      (
        await me(
          jwt.sign({ ...base(), exp: Math.floor(Date.now() / 1000) - 10 }, t.jwtSecret, opts),
        )
      ).status,
    ).toBe(401);
  });
  it('not yet valid', async () => {
    expect(
      (await me(jwt.sign(base(), t.jwtSecret, { ...opts, expiresIn: 600, notBefore: 300 }))).status,
    ).toBe(401);
  });
  it('the wrong audience', async () => {
    expect(
      (
        await me(
          jwt.sign(base(), t.jwtSecret, { ...opts, audience: 'someone-else', expiresIn: 60 }),
        )
      ).status,
    ).toBe(401);
  });
  it('the wrong issuer', async () => {
    expect(
      (await me(jwt.sign(base(), t.jwtSecret, { ...opts, issuer: 'someone-else', expiresIn: 60 })))
        .status,
    ).toBe(401);
  });
  it('a valid signature over a session that does not exist', async () => {
    expect(
      (
        await me(
          jwt.sign({ ...base(), jti: 'no-such-session' }, t.jwtSecret, { ...opts, expiresIn: 60 }),
        )
      ).status,
    ).toBe(401);
  });
  it('a token’s role claim is ignored: the role comes from the database', async () => {
    const forgedRole = jwt.sign({ role: 'admin' }, t.jwtSecret, {
      ...opts,
      subject: userId,
      jwtid: sessionId,
      expiresIn: 60,
    });
    expect(
      (await request(t.app).get('/api/v1/users').set('Cookie', `conductory_session=${forgedRole}`))
        .status,
    ).toBe(403);
  });
});

describe('API2 authentication: sessions and keys end at once', () => {
  it('after sign-out the old cookie is refused', async () => {
    const agent = await signedIn(t.app, 'curator');
    expect((await agent.get('/api/v1/me')).status).toBe(200);
    expect((await agent.post('/api/v1/auth/sign-out')).status).toBe(204);
    const res = await request(t.app)
      .post('/api/v1/auth/sign-in')
      .send({ email: demo('curator').email, password: demo('curator').password });
    const token = sessionCookieOf(res.headers['set-cookie'])!;
    expect((await me(token)).status).toBe(200);
    await request(t.app)
      .post('/api/v1/auth/sign-out')
      .set('Origin', TEST_PUBLIC_URL)
      .set('Cookie', `conductory_session=${token}`);
    expect((await me(token)).status).toBe(401);
  });
  it('a malformed Authorization header or a non-key bearer → 401', async () => {
    expect(
      (await request(t.app).get('/api/v1/health').set('Authorization', 'Basic abc')).status,
    ).toBe(401);
    expect(
      (
        await request(t.app)
          .get('/api/v1/health')
          .set(bearer('cdy_nothere_' + 'x'.repeat(43)))
      ).status,
    ).toBe(401);
    expect(
      (await request(t.app).get('/api/v1/health').set(bearer('eyJhbGciOi.fake.token'))).status,
    ).toBe(401);
  });
  it('a revoked key fails on the very next request', async () => {
    const agent = await signedIn(t.app, 'integrator');
    const { key, id } = await newKey(agent, 'integrator');
    await agent.delete(`/api/v1/keys/${id}`);
    expect((await request(t.app).get('/api/v1/health').set(bearer(key))).status).toBe(401);
  });
});
