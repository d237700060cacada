/** The messages Conductory sends, as plain text. Links point at the front end's own routes. */
export interface MailContent {
  template: string;
  subject: string;
  text: string;
}

const sign =
  '\n\n-- \nConductory\nThis message was sent because of an action on your account. If it was not you, tell your administrator.';

export const templates = {
  verification: (name: string, link: string): MailContent => ({
    template: 'verification',
    subject: 'Confirm your e-mail address for Conductory',
    text: `Hello ${name},\n\nConfirm this address to finish signing up:\n\n${link}\n\nThe link works once, for 24 hours.${sign}`,
  }),
  reset: (name: string, link: string): MailContent => ({
    template: 'reset',
    subject: 'Reset your Conductory password',
    text: `Hello ${name},\n\nSomeone asked to reset the password of this account. To choose a new one:\n\n${link}\n\nThe link works once, for 1 hour. If you did not ask, ignore this message: nothing changes.${sign}`,
  }),
  keyCreated: (name: string, keyName: string, prefix: string, role: string): MailContent => ({
    template: 'key-created',
    subject: `A new API key was created: ${keyName}`,
    text: `Hello ${name},\n\nAn API key named "${keyName}" (prefix ${prefix}, role ${role}) was created on your account. If you did not create it, revoke it on the Access screen at once.${sign}`,
  }),
  keyExpiring: (name: string, keyName: string, prefix: string, expiresAt: string): MailContent => ({
    template: 'key-expiring',
    subject: `Your API key ${keyName} expires soon`,
    text: `Hello ${name},\n\nThe API key "${keyName}" (prefix ${prefix}) expires at ${expiresAt}. Rotate it on the Access screen to keep your tooling running.${sign}`,
  }),
  reviewRequested: (name: string, alloy: string, author: string): MailContent => ({
    template: 'review-requested',
    subject: `A change to ${alloy} awaits review`,
    text: `Hello ${name},\n\n${author} proposed a change to ${alloy}. It needs a second curator: see the Review Desk.${sign}`,
  }),
  reviewDecided: (
    name: string,
    alloy: string,
    decision: string,
    reviewer: string,
  ): MailContent => ({
    template: 'review-decided',
    subject: `Your change to ${alloy} was ${decision}`,
    text: `Hello ${name},\n\n${reviewer} ${decision} your proposed change to ${alloy}.${sign}`,
  }),
};
