/**
 * Every message Sequent sends, one function each, rendered through the shared layout
 * (`renderMail`): plain text and HTML, the firm's name, a link to act on. Callers queue
 * the result with `queueMail` inside the transaction of the change it announces.
 */
import { renderMail } from './layout';
import type { MailMessage } from './outbox';

/** What every message about a case needs. */
export interface CaseMailFacts {
  firmName: string;
  caseTitle: string;
  /** The absolute URL of the case's reading page. */
  caseUrl: string;
  /** The revision the message is about. */
  revision: number;
}

function caseSubject(f: CaseMailFacts, what: string): string {
  return `${what}: ${f.caseTitle} (rev. ${f.revision})`;
}

function caseFooter(f: CaseMailFacts, why: string): string {
  return `${why} Sent by Sequent for ${f.firmName}.`;
}

/** Names as prose: "A", "A and B", "A, B and C". */
export function listNames(names: readonly string[]): string {
  const clean = names.map((n) => n.trim()).filter(Boolean);
  if (clean.length <= 1) return clean[0] ?? '';
  return `${clean.slice(0, -1).join(', ')} and ${clean[clean.length - 1]}`;
}

/** To the reviewers: an author asks for a review of a revision. */
export function reviewRequestedMessage(f: CaseMailFacts & { authorName: string; reviewerNames?: string[] }): MailMessage {
  const asked = f.reviewerNames && f.reviewerNames.length > 0 ? `Reviewers asked: ${listNames(f.reviewerNames)}.` : "It is open to the firm's reviewers.";
  return renderMail({
    masthead: f.firmName,
    subject: caseSubject(f, 'Review requested'),
    blocks: [
      { kind: 'paragraph', text: `${f.authorName} asks for a review of "${f.caseTitle}", revision ${f.revision}.` },
      { kind: 'paragraph', text: asked },
      { kind: 'paragraph', text: 'Check the inputs, the methods chosen and the results against the case; then approve it or return it with comments.' },
    ],
    action: { label: 'Open the case', url: f.caseUrl },
    caution: true,
    footer: caseFooter(f, 'You get this because you review cases in this firm.'),
  });
}

/** To the author: a reviewer returned the case with comments. */
export function reviewReturnedMessage(f: CaseMailFacts & { reviewerName: string; comments: string }): MailMessage {
  return renderMail({
    masthead: f.firmName,
    subject: caseSubject(f, 'Returned with comments'),
    blocks: [
      { kind: 'paragraph', text: `${f.reviewerName} returned "${f.caseTitle}" (revision ${f.revision}) for changes.` },
      ...(f.comments.trim() ? [{ kind: 'quote' as const, text: f.comments, attribution: f.reviewerName }] : []),
      { kind: 'paragraph', text: 'Edit the case and ask for review again when it is ready.' },
    ],
    action: { label: 'Open the case', url: f.caseUrl },
    footer: caseFooter(f, 'You get this because you wrote this case.'),
  });
}

/** To the author: one approval recorded, more needed before the case is published. */
export function reviewApprovedMessage(f: CaseMailFacts & { reviewerName: string; approvals: number; requiredApprovals: number }): MailMessage {
  const left = Math.max(0, f.requiredApprovals - f.approvals);
  return renderMail({
    masthead: f.firmName,
    subject: caseSubject(f, `Approved by ${f.reviewerName}`),
    blocks: [
      { kind: 'paragraph', text: `${f.reviewerName} approved revision ${f.revision} of "${f.caseTitle}".` },
      {
        kind: 'paragraph',
        text: `${f.approvals} of ${f.requiredApprovals} approvals are recorded; ${left === 1 ? 'one more is' : `${left} more are`} needed before the case is published to the firm.`,
      },
    ],
    action: { label: 'Open the case', url: f.caseUrl },
    caution: true,
    footer: caseFooter(f, 'You get this because you wrote this case.'),
  });
}

/** To the author and reviewers: the case has its approvals and is published. */
export function casePublishedMessage(f: CaseMailFacts & { reviewerNames: string[] }): MailMessage {
  const by = f.reviewerNames.length > 0 ? ` Approved by ${listNames(f.reviewerNames)}.` : '';
  return renderMail({
    masthead: f.firmName,
    subject: caseSubject(f, 'Published'),
    blocks: [
      { kind: 'paragraph', text: `"${f.caseTitle}", revision ${f.revision}, is approved and published to the firm's casebook.${by}` },
      { kind: 'paragraph', text: 'Colleagues can now find it as a precedent.' },
    ],
    action: { label: 'Read the published case', url: f.caseUrl },
    caution: true,
    footer: caseFooter(f, 'You get this because you wrote or reviewed this case.'),
  });
}

/** To the reviewers who had approved: an edit to the case under review cancelled their approvals. */
export function approvalsCancelledMessage(f: CaseMailFacts & { editorName: string }): MailMessage {
  return renderMail({
    masthead: f.firmName,
    subject: caseSubject(f, 'Approvals cancelled by an edit'),
    blocks: [
      { kind: 'paragraph', text: `${f.editorName} edited "${f.caseTitle}" while it was under review; the case is now at revision ${f.revision}.` },
      { kind: 'paragraph', text: 'Approvals given to the earlier revision no longer count. Check the changes and approve again if they are sound.' },
    ],
    action: { label: 'Open the case', url: f.caseUrl },
    caution: true,
    footer: caseFooter(f, 'You get this because you had approved this case.'),
  });
}

/** To the author and reviewers: an admin withdrew the case. */
export function caseWithdrawnMessage(f: CaseMailFacts & { actorName: string; reason: string }): MailMessage {
  return renderMail({
    masthead: f.firmName,
    subject: caseSubject(f, 'Withdrawn'),
    blocks: [
      { kind: 'paragraph', text: `${f.actorName} withdrew "${f.caseTitle}" (revision ${f.revision}). It no longer counts as a precedent.` },
      ...(f.reason.trim() ? [{ kind: 'quote' as const, text: f.reason, attribution: 'Reason given' }] : []),
    ],
    action: { label: 'Open the case', url: f.caseUrl },
    footer: caseFooter(f, 'You get this because you wrote or reviewed this case.'),
  });
}

/** To a member named in a review comment. */
export function commentMentionMessage(f: CaseMailFacts & { commenterName: string; excerpt: string; blockTitle?: string | null }): MailMessage {
  const where = f.blockTitle ? ` on the block "${f.blockTitle}"` : '';
  return renderMail({
    masthead: f.firmName,
    subject: caseSubject(f, `${f.commenterName} mentioned you`),
    blocks: [
      { kind: 'paragraph', text: `${f.commenterName} mentioned you in a comment${where} in "${f.caseTitle}" (revision ${f.revision}).` },
      { kind: 'quote', text: f.excerpt, attribution: f.commenterName },
    ],
    action: { label: 'Open the comment', url: f.caseUrl },
    footer: caseFooter(f, 'You get this because a colleague named you in a comment.'),
  });
}

function formatDate(date: Date): string {
  return new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZone: 'UTC', timeZoneName: 'short' }).format(date);
}

/** To someone invited to join a firm. */
export function invitationMessage(f: { firmName: string; inviterName: string; roleLabel: string; acceptUrl: string; expiresAt: Date }): MailMessage {
  return renderMail({
    masthead: f.firmName,
    subject: `${f.inviterName} invites you to ${f.firmName} on Sequent`,
    blocks: [
      { kind: 'paragraph', text: `${f.inviterName} invites you to join ${f.firmName}'s casebook on Sequent as ${f.roleLabel}.` },
      { kind: 'paragraph', text: `The invitation works once, until ${formatDate(f.expiresAt)}. If you did not expect it, ignore this message.` },
    ],
    action: { label: 'Accept the invitation', url: f.acceptUrl },
    footer: `Sent by Sequent for ${f.firmName}.`,
  });
}

/** To an account holder who asked to reset their password. */
export function passwordResetMessage(f: { name: string; resetUrl: string; expiresInMinutes: number }): MailMessage {
  return renderMail({
    masthead: 'Sequent',
    subject: 'Reset your Sequent password',
    greeting: `Hello ${f.name},`,
    blocks: [
      { kind: 'paragraph', text: `Someone, probably you, asked to reset the password of your Sequent account. The link works once, within ${f.expiresInMinutes} minutes.` },
      { kind: 'paragraph', text: 'If you did not ask, ignore this message: your password stays as it is.' },
    ],
    action: { label: 'Choose a new password', url: f.resetUrl },
    footer: 'Sent by Sequent because a password reset was requested for this address.',
  });
}
