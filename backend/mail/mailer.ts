import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import nodemailer from 'nodemailer';
import { SMTPServer } from 'smtp-server';
import { linksIn, maskMail } from './mask';
import type { OutboxRepository } from './outbox-repository';
import type { MailContent } from './templates';

export class MailHeaderError extends Error {}

export interface Mailer {
  send(to: string, content: MailContent): Promise<void>;
  close(): Promise<void>;
}

const FROM = 'Conductory <no-reply@conductory.invalid>';

/** Receives each message as sent, tokens and all, when the local fake server is the only mailbox. */
export type LocalDelivery = (to: string, content: MailContent) => void;

export interface MailerOptions {
  /**
   * Without SMTP_URL, who reads the mail unmasked. By default the developer who ran the server,
   * on its console (printLinks), outside production and tests; null for nobody. Never called when
   * SMTP_URL is set: then the mail reaches its owner for real.
   */
  localDelivery?: LocalDelivery | null;
}

/** Development's mailbox: each link of each message, on the console of the person running it. */
export const printLinks: LocalDelivery = (to, content) => {
  for (const link of linksIn(content.text)) console.log(`Mail to ${to}: ${link}`);
};

function defaultLocalDelivery(env: NodeJS.ProcessEnv): LocalDelivery | null {
  return env.NODE_ENV === 'production' || env.NODE_ENV === 'test' ? null : printLinks;
}

/**
 * Sends mail through nodemailer. Without SMTP_URL (development and tests) it first starts a local
 * fake SMTP server (smtp-server) on a free loopback port that accepts everything and files each
 * message in the outbox table, where admins read it; with SMTP_URL it sends for real and keeps a
 * copy in the outbox. The outbox copy has its link tokens masked (mask.ts): a sign-up or reset
 * link is for its owner, not for the admins or whoever holds a copy of the database. Header values
 * with CR or LF are refused: they would let a caller add headers.
 */
export async function createMailer(
  outbox: OutboxRepository,
  smtpUrl?: string,
  options: MailerOptions = {},
): Promise<Mailer> {
  const localDelivery = smtpUrl
    ? null
    : options.localDelivery === undefined
      ? defaultLocalDelivery(process.env)
      : options.localDelivery;
  let fake: SMTPServer | null = null;
  let transportUrl = smtpUrl;
  if (!smtpUrl) {
    fake = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS', 'AUTH'],
      logger: false,
      size: 1024 * 1024,
      onData(stream, _session, callback) {
        simpleParser(stream)
          .then(async (parsed) => {
            const to = Array.isArray(parsed.to) ? parsed.to[0]?.text : parsed.to?.text;
            await outbox.add(
              maskMail({
                at: new Date().toISOString(),
                to: (to ?? '').toLowerCase(),
                subject: parsed.subject ?? '',
                text: parsed.text ?? '',
                template: String(parsed.headers.get('x-conductory-template') ?? 'unknown'),
              }),
            );
            callback();
          })
          .catch((error: Error) => callback(error));
      },
    });
    await new Promise<void>((resolve) => fake!.listen(0, '127.0.0.1', () => resolve()));
    // The fake must never keep a test run or a CLI alive on its own.
    fake.server.unref();
    const { port } = fake.server.address() as AddressInfo;
    transportUrl = `smtp://127.0.0.1:${port}`;
  }
  const transport = nodemailer.createTransport(transportUrl!, { ignoreTLS: !smtpUrl } as never);
  return {
    async send(to, content) {
      if (/[\r\n]/.test(to) || /[\r\n]/.test(content.subject))
        throw new MailHeaderError('CR or LF in a mail header');
      await transport.sendMail({
        from: FROM,
        to,
        subject: content.subject,
        text: content.text,
        headers: { 'X-Conductory-Template': content.template },
      });
      if (smtpUrl)
        await outbox.add(
          maskMail({
            at: new Date().toISOString(),
            to: to.toLowerCase(),
            subject: content.subject,
            text: content.text,
            template: content.template,
          }),
        );
      else localDelivery?.(to.toLowerCase(), content);
    },
    async close() {
      transport.close();
      if (fake) await new Promise<void>((resolve) => fake!.close(() => resolve()));
    },
  };
}
