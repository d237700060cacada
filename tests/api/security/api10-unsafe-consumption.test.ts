// OWASP API10:2023 Unsafe Consumption of APIs: what comes in (mail headers, names) is untrusted.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MailHeaderError } from '../../../backend/mail/mailer';
import { templates } from '../../../backend/mail/templates';
import { signedIn } from '../../helpers/access';
import { createTestApp, type TestApp } from '../../helpers/test-app';

let t: TestApp;
beforeAll(async () => (t = await createTestApp({ accounts: true })));
afterAll(() => t.knex.destroy());

describe('API10 unsafe consumption', () => {
  it('refuses CR/LF in a mail header (header injection)', async () => {
    await expect(
      t.mailer.send(
        'victim@ridgeline.example\r\nBcc: all@elsewhere.example',
        templates.verification('x', 'http://x'),
      ),
    ).rejects.toThrow(MailHeaderError);
    await expect(
      t.mailer.send('victim@ridgeline.example', {
        ...templates.reset('x', 'http://x'),
        subject: 'Reset\r\nBcc: all@elsewhere.example',
      }),
    ).rejects.toThrow(MailHeaderError);
  });
  it('refuses an e-mail address with CR/LF at sign-up (400, nothing sent)', async () => {
    const res = await request(t.app)
      .post('/api/v1/auth/sign-up')
      .send({ email: 'a@b.example\r\nBcc: c@d.example', password: 'brass-fittings-77', name: 'x' });
    expect(res.status).toBe(400);
  });
  it('keeps a name with markup or control text as plain data in the mail', async () => {
    const res = await request(t.app).post('/api/v1/auth/sign-up').send({
      email: 'markup@ridgeline.example',
      password: 'brass-fittings-77',
      name: '<b>Bold</b> Name',
    });
    expect(res.status).toBe(202);
    const admin = await signedIn(t.app, 'admin');
    const mail = (await admin.get('/api/v1/admin/outbox?to=markup%40ridgeline.example')).body
      .items[0];
    expect(mail.subject).toBe('Confirm your e-mail address for Conductory');
    expect(mail.text).toContain('<b>Bold</b> Name');
  });
});
