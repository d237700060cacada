/**
 * Sign-up and reset links carry a token that works once: it belongs to the person the mail went
 * to. The outbox (which admins read) keeps every message with those tokens masked, so neither an
 * admin nor a copy of the database can use one.
 */
export const TOKEN_MASK = '••••••••';

/** `token=…` in a link's query or fragment, up to the next separator. */
const TOKEN_PARAMETER = /([?&#;]token=)([^\s&#;"'<>]+)/gi;
/** Shorter values are not searched for elsewhere in the message: they could be ordinary words. */
const MIN_SECRET_LENGTH = 16;

/** The token values found in links in these texts (as written and percent-decoded). */
export function tokensIn(...texts: string[]): string[] {
  const found = new Set<string>();
  for (const text of texts) {
    for (const m of text.matchAll(TOKEN_PARAMETER)) {
      const value = m[2]!;
      if (value === TOKEN_MASK) continue;
      found.add(value);
      try {
        found.add(decodeURIComponent(value));
      } catch {
        // Not percent-encoded text: the value as written is enough.
      }
    }
  }
  return [...found].filter((v) => v.length >= MIN_SECRET_LENGTH);
}

/** The text with every `token=` value masked, and the given secrets masked wherever they occur. */
export function maskText(text: string, secrets: readonly string[] = tokensIn(text)): string {
  let masked = text.replace(TOKEN_PARAMETER, `$1${TOKEN_MASK}`);
  for (const secret of secrets) masked = masked.split(secret).join(TOKEN_MASK);
  return masked;
}

/**
 * The message with its link tokens masked in the link and anywhere else in the subject, text and
 * HTML; everything else reads as sent.
 */
export function maskMail<T extends { subject: string; text: string; html?: string }>(mail: T): T {
  const secrets = tokensIn(mail.subject, mail.text, mail.html ?? '');
  return {
    ...mail,
    subject: maskText(mail.subject, secrets),
    text: maskText(mail.text, secrets),
    ...(mail.html === undefined ? {} : { html: maskText(mail.html, secrets) }),
  };
}

/** The http(s) links in a text, in order. */
export function linksIn(text: string): string[] {
  return [...text.matchAll(/https?:\/\/[^\s<>"']+/g)].map((m) => m[0]);
}
