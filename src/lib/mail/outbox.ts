/**
 * Queueing mail: one outbox row per recipient, written with the transaction of the change
 * the message announces, so both commit or neither does. Delivery happens later, in the
 * worker (see the module that drains `mail_outbox`); a down SMTP server never fails a change.
 */
import type { Queryable } from '../../db/client';
import { mailOutbox } from '../../db/schema';

/** Every kind of message Sequent sends. */
export type MailKind =
  | 'review.requested'
  | 'review.returned'
  | 'review.published'
  | 'review.approved'
  | 'review.approvals_cancelled'
  | 'case.withdrawn'
  | 'comment.mention'
  | 'firm.invitation'
  | 'account.password_reset';

/** A rendered message: plain text and HTML bodies of the same content. */
export interface MailMessage {
  readonly subject: string;
  readonly text: string;
  readonly html: string;
}

/** What to queue: the message, its kind, the firm it concerns and its recipients. */
export interface QueuedMail extends MailMessage {
  readonly kind: MailKind;
  /** Null for account mail that belongs to no firm. */
  readonly firmId: string | null;
  /** Addresses; duplicates and blanks are dropped. */
  readonly to: readonly string[];
}

/** Queues `mail` for every recipient inside `tx`; returns how many rows were written. */
export async function queueMail(tx: Queryable, mail: QueuedMail): Promise<number> {
  const recipients = [...new Set(mail.to.map((a) => a.trim().toLowerCase()).filter(Boolean))];
  if (recipients.length === 0) return 0;
  await tx.insert(mailOutbox).values(
    recipients.map((toAddress) => ({
      firmId: mail.firmId,
      kind: mail.kind,
      toAddress,
      subject: mail.subject,
      textBody: mail.text,
      htmlBody: mail.html,
    })),
  );
  return recipients.length;
}
