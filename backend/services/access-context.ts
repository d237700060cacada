import type { AccountRepositories } from '../db/account-repositories';
import type { Mailer } from '../mail/mailer';

/** What the account, key and admin services share. */
export interface AccessContext {
  repos: AccountRepositories;
  secret: Buffer;
  mailer: Mailer;
  /** Base of the links in mails (never taken from a request's Host header). */
  publicUrl: () => string;
  production: boolean;
}
