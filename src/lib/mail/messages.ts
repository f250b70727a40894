/**
 * The messages Sequent sends, rendered as plain text and HTML. (Placeholder holding only
 * the invitation message; the full set of templates replaces this file.)
 */
import type { MailMessage } from './outbox';

const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
const escape = (value: string): string => value.replace(/[&<>"']/g, (c) => ESCAPES[c]!);
const DAY = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

/** The invitation to join a firm's casebook, with the one-use link to set a password. */
export function invitationMessage(f: {
  firmName: string;
  inviterName: string;
  roleLabel: string;
  acceptUrl: string;
  expiresAt: Date;
}): MailMessage {
  const until = DAY.format(f.expiresAt);
  const subject = `${f.inviterName} invites you to ${f.firmName} on Sequent`;
  const text = [
    `${f.inviterName} invites you to join ${f.firmName}'s casebook on Sequent as ${f.roleLabel.toLowerCase()}.`,
    '',
    'Open this link to choose your password and join:',
    f.acceptUrl,
    '',
    `The link works once and until ${until}. If it has expired, ask your firm admin for a new invitation.`,
    'If you did not expect this message, you can ignore it.',
  ].join('\n');
  const html = [
    `<p>${escape(f.inviterName)} invites you to join ${escape(f.firmName)}'s casebook on Sequent as ${escape(f.roleLabel.toLowerCase())}.</p>`,
    `<p><a href="${escape(f.acceptUrl)}">Choose your password and join ${escape(f.firmName)}</a></p>`,
    `<p>Or paste this address into your browser: ${escape(f.acceptUrl)}</p>`,
    `<p>The link works once and until ${escape(until)}. If it has expired, ask your firm admin for a new invitation.</p>`,
    '<p>If you did not expect this message, you can ignore it.</p>',
  ].join('\n');
  return { subject, text, html };
}
