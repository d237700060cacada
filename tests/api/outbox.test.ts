// Sign-up and reset tokens are for their owner (issue 8): the admin Outbox and the database copy of
// each mail have them masked; tests read the real one from the mailer's local delivery, and a
// developer from the server's console (development only, never with SMTP_URL).
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { SMTPServer } from 'smtp-server';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { createKnex } from '../../backend/db/knex';
import { prepareDatabase } from '../../backend/db/prepare';
import { createMailer } from '../../backend/mail/mailer';
import { maskMail, TOKEN_MASK } from '../../backend/mail/mask';
import { createOutboxRepository } from '../../backend/mail/outbox-repository';
import { templates } from '../../backend/mail/templates';
import { demo, signedIn } from '../helpers/access';
import { createTestApp, TEST_PUBLIC_URL, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => (t = await createTestApp({ accounts: true })));
afterAll(async () => {
  await t.mailer.close();
  await t.knex.destroy();
});

const newcomer = {
  email: 'outbox-newcomer@ridgeline.example',
  password: 'copper-brass-zinc-42',
  name: 'O. Newcomer',
};

describe('the admin Outbox never shows a live token', () => {
  let verifyToken = '';
  let resetToken = '';

  it('sign-up and a reset request mail their owners', async () => {
    expect((await request(t.app).post('/api/v1/auth/sign-up').send(newcomer)).status).toBe(202);
    expect(
      (
        await request(t.app)
          .post('/api/v1/auth/reset-request')
          .send({ email: demo('reader').email })
      ).status,
    ).toBe(202);
    verifyToken = t.mail.tokenFor(newcomer.email, 'verification');
    resetToken = t.mail.tokenFor(demo('reader').email, 'reset');
    expect(verifyToken).toMatch(/^[A-Za-z0-9_-]{43}$/); // 32 random bytes, base64url
    expect(resetToken).toMatch(/^[A-Za-z0-9_-]{43}$/);
  });

  it('GET /admin/outbox has the mails, readable, with the tokens masked', async () => {
    const admin = await signedIn(t.app, 'admin');
    const res = await admin.get('/api/v1/admin/outbox');
    expect(res.status).toBe(200);
    const body = JSON.stringify(res.body);
    expect(body).not.toContain(verifyToken);
    expect(body).not.toContain(resetToken);
    const items = res.body.items as Array<{ to: string; template: string; text: string }>;
    const verification = items.find((m) => m.to === newcomer.email)!;
    expect(verification.template).toBe('verification');
    expect(verification.text).toContain(`Hello ${newcomer.name}`);
    expect(verification.text).toContain(`${TEST_PUBLIC_URL}/verify?token=${TOKEN_MASK}`);
    const reset = items.find((m) => m.to === demo('reader').email && m.template === 'reset')!;
    expect(reset.text).toContain(`${TEST_PUBLIC_URL}/reset?token=${TOKEN_MASK}`);
  });

  it('the database copy holds no live token either', async () => {
    const rows = (await t.knex('mail_outbox').select('subject', 'text')) as object[];
    expect(JSON.stringify(rows)).not.toContain(verifyToken);
    expect(JSON.stringify(rows)).not.toContain(resetToken);
  });

  it('the real tokens, read by their owners, still work', async () => {
    expect(
      (await request(t.app).post('/api/v1/auth/verify').send({ token: verifyToken })).status,
    ).toBe(200);
    expect(
      (
        await request(t.app)
          .post('/api/v1/auth/reset')
          .send({ token: resetToken, password: 'new-reader-password-9' })
      ).status,
    ).toBe(200);
    expect(
      (
        await request(t.app)
          .post('/api/v1/auth/sign-in')
          .send({ email: demo('reader').email, password: 'new-reader-password-9' })
      ).status,
    ).toBe(200);
  });

  it('a mail filed unmasked by an older version is masked on the way out', async () => {
    const old = `Reset: ${TEST_PUBLIC_URL}/reset?token=${'A'.repeat(43)}`;
    await t.knex('mail_outbox').insert({
      at: new Date().toISOString(),
      to: 'old@ridgeline.example',
      subject: 'Reset your Conductory password',
      text: old,
      template: 'reset',
    });
    const admin = await signedIn(t.app, 'admin');
    const res = await admin.get('/api/v1/admin/outbox?to=old%40ridgeline.example');
    expect(res.body.items[0].text).toBe(`Reset: ${TEST_PUBLIC_URL}/reset?token=${TOKEN_MASK}`);
  });
});

describe('maskMail', () => {
  it('masks the token in the link and wherever else it appears, and nothing more', () => {
    const token = 'Zq9_-x'.repeat(7);
    const mail = maskMail({
      subject: `Code ${token}`,
      text: `Open http://x.test/reset?token=${token}&next=%2F or type ${token}.\nThe link works once.`,
      html: `<a href="http://x.test/verify?a=1&amp;token=${token}">confirm</a>`,
    });
    expect(JSON.stringify(mail)).not.toContain(token);
    expect(mail.subject).toBe(`Code ${TOKEN_MASK}`);
    expect(mail.text).toBe(
      `Open http://x.test/reset?token=${TOKEN_MASK}&next=%2F or type ${TOKEN_MASK}.\nThe link works once.`,
    );
    expect(mail.html).toBe(
      `<a href="http://x.test/verify?a=1&amp;token=${TOKEN_MASK}">confirm</a>`,
    );
    const plain = templates.keyCreated('Ann', 'line 3', 'abcd1234', 'reader');
    expect(maskMail(plain)).toEqual(plain);
  });
});

describe('who reads the mail unmasked', () => {
  const env = process.env.NODE_ENV;
  afterEach(() => {
    process.env.NODE_ENV = env;
    vi.restoreAllMocks();
  });
  const link = `${TEST_PUBLIC_URL}/verify?token=${'T'.repeat(43)}`;

  async function sendWith(nodeEnv: string, smtpUrl?: string) {
    process.env.NODE_ENV = nodeEnv;
    const log = vi.spyOn(console, 'log').mockImplementation(() => {});
    const knex = createKnex(':memory:');
    await prepareDatabase(knex, { demo: false });
    const mailer = await createMailer(createOutboxRepository(knex), smtpUrl);
    await mailer.send('dev@ridgeline.example', templates.verification('Dev', link));
    await mailer.close();
    const filed = (await knex('mail_outbox').select('text')) as Array<{ text: string }>;
    await knex.destroy();
    return { printed: log.mock.calls.map((c) => c.join(' ')), filed };
  }

  it('development: the developer’s console shows the link (the outbox still masks it)', async () => {
    const { printed, filed } = await sendWith('development');
    expect(printed).toContain(`Mail to dev@ridgeline.example: ${link}`);
    expect(filed[0]!.text).not.toContain(link);
  });

  it('production and tests: nobody sees it', async () => {
    for (const nodeEnv of ['production', 'test']) {
      const { printed, filed } = await sendWith(nodeEnv);
      expect(printed.join('\n')).not.toContain('token=');
      expect(filed[0]!.text).not.toContain(link);
    }
  });

  it('with SMTP_URL the mail goes out for real and is never printed', async () => {
    // A second smtp-server stands in for the real relay and keeps what it receives.
    const received: string[] = [];
    const relay = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS', 'AUTH'],
      logger: false,
      onData(stream, _session, callback) {
        let raw = '';
        stream.on('data', (c: Buffer) => (raw += c.toString()));
        stream.on('end', () => {
          received.push(raw);
          callback();
        });
      },
    });
    await new Promise<void>((resolve) => relay.listen(0, '127.0.0.1', () => resolve()));
    const { port } = relay.server.address() as AddressInfo;
    try {
      const { printed, filed } = await sendWith('development', `smtp://127.0.0.1:${port}`);
      expect(printed.join('\n')).not.toContain('Mail to');
      expect(received.join('').replace(/=\r?\n/g, '')).toContain('T'.repeat(43));
      expect(filed[0]!.text).toContain(`token=${TOKEN_MASK}`);
    } finally {
      await new Promise<void>((resolve) => relay.close(() => resolve()));
    }
  });
});
