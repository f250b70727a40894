/**
 * Who is told what when a case moves through review. Each function queues its messages
 * with `queueMail` inside the transaction of the change it announces, so the message and
 * the change commit together; the mail worker sends them later and retries while the SMTP
 * server is down. Sending never fails a change. The actor is never mailed about their own act.
 */
import { and, eq, inArray } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { member, organization, user } from '../../db/schema';
import { config } from '../config';
import {
  approvalsCancelledMessage,
  casePublishedMessage,
  caseWithdrawnMessage,
  commentMentionMessage,
  queueMail,
  reviewApprovedMessage,
  reviewReturnedMessage,
  reviewRequestedMessage,
  type CaseMailFacts,
  type MailKind,
  type MailMessage,
} from '../mail';
import { findMentions } from './mentions';

/** The case a message is about. */
export interface NotifiedCase {
  firmId: string;
  caseId: string;
  title: string;
  revision: number;
  authorId: string;
}

interface Person {
  userId: string;
  name: string;
  email: string;
}

async function people(tx: Queryable, firmId: string, userIds: readonly string[]): Promise<Person[]> {
  if (!userIds.length) return [];
  // Members of the firm only: someone who has left is not mailed about its cases.
  return tx
    .select({ userId: user.id, name: user.name, email: user.email })
    .from(user)
    .innerJoin(member, and(eq(member.userId, user.id), eq(member.organizationId, firmId)))
    .where(inArray(user.id, [...new Set(userIds)]));
}

async function factsOf(tx: Queryable, c: NotifiedCase): Promise<CaseMailFacts> {
  const [firm] = await tx.select({ name: organization.name }).from(organization).where(eq(organization.id, c.firmId));
  return { firmName: firm?.name ?? 'your firm', caseTitle: c.title, caseUrl: new URL(`/cases/${c.caseId}`, config().SEQUENT_BASE_URL).href, revision: c.revision };
}

async function send(tx: Queryable, c: NotifiedCase, kind: MailKind, to: readonly Person[], actorId: string, message: MailMessage): Promise<number> {
  return queueMail(tx, { kind, firmId: c.firmId, to: to.filter((p) => p.userId !== actorId).map((p) => p.email), ...message });
}

/** Everything a review action may announce. */
export type ReviewNotice =
  | { kind: 'submitted'; reviewerIds: readonly string[] }
  | { kind: 'returned'; comments: string }
  | { kind: 'approved'; approvals: number; requiredApprovals: number }
  | { kind: 'published'; approverIds: readonly string[] }
  | { kind: 'withdrawn'; reason: string; notifyIds: readonly string[] }
  | { kind: 'approvals_cancelled'; reviewerIds: readonly string[] };

/**
 * Queues the messages of `notice` about case `c`, done by `actorId`. For a submission to the
 * firm's pool (`reviewerIds` empty) every reviewer of the firm but the author is told.
 * Returns the number of messages queued.
 */
export async function notifyReview(tx: Queryable, c: NotifiedCase, actorId: string, notice: ReviewNotice): Promise<number> {
  const facts = await factsOf(tx, c);
  const [actor] = await tx.select({ name: user.name }).from(user).where(eq(user.id, actorId));
  const actorName = actor?.name ?? 'A colleague';
  const author = await people(tx, c.firmId, [c.authorId]);
  switch (notice.kind) {
    case 'submitted': {
      let reviewers = await people(tx, c.firmId, notice.reviewerIds);
      if (!notice.reviewerIds.length) {
        const pool = await tx.select({ userId: member.userId }).from(member).where(and(eq(member.organizationId, c.firmId), eq(member.role, 'reviewer')));
        reviewers = await people(tx, c.firmId, pool.map((p) => p.userId).filter((id) => id !== c.authorId));
      }
      const message = reviewRequestedMessage({ ...facts, authorName: actorName, ...(notice.reviewerIds.length ? { reviewerNames: reviewers.map((r) => r.name) } : {}) });
      return send(tx, c, 'review.requested', reviewers, actorId, message);
    }
    case 'returned':
      return send(tx, c, 'review.returned', author, actorId, reviewReturnedMessage({ ...facts, reviewerName: actorName, comments: notice.comments }));
    case 'approved':
      return send(tx, c, 'review.approved', author, actorId, reviewApprovedMessage({ ...facts, reviewerName: actorName, ...notice }));
    case 'published': {
      const approvers = await people(tx, c.firmId, notice.approverIds);
      const message = casePublishedMessage({ ...facts, reviewerNames: approvers.map((a) => a.name) });
      return send(tx, c, 'review.published', [...author, ...approvers], actorId, message);
    }
    case 'withdrawn': {
      const told = await people(tx, c.firmId, [c.authorId, ...notice.notifyIds]);
      return send(tx, c, 'case.withdrawn', told, actorId, caseWithdrawnMessage({ ...facts, actorName, reason: notice.reason }));
    }
    case 'approvals_cancelled': {
      const reviewers = await people(tx, c.firmId, notice.reviewerIds);
      return send(tx, c, 'review.approvals_cancelled', reviewers, actorId, approvalsCancelledMessage({ ...facts, editorName: actorName }));
    }
  }
}

/** Queues a mention message to every member of the firm mentioned in `body` (not the writer). */
export async function notifyMentions(
  tx: Queryable,
  c: NotifiedCase,
  commenterId: string,
  comment: { body: string; blockTitle: string | null },
): Promise<number> {
  if (!comment.body.includes('@')) return 0;
  const members = await tx
    .select({ userId: user.id, name: user.name, email: user.email })
    .from(user)
    .innerJoin(member, and(eq(member.userId, user.id), eq(member.organizationId, c.firmId)));
  const mentioned = findMentions(comment.body, members);
  if (!mentioned.length) return 0;
  const facts = await factsOf(tx, c);
  const commenter = members.find((m) => m.userId === commenterId);
  const excerpt = comment.body.length > 400 ? `${comment.body.slice(0, 400)}…` : comment.body;
  const message = commentMentionMessage({ ...facts, commenterName: commenter?.name ?? 'A colleague', excerpt, blockTitle: comment.blockTitle });
  return send(tx, c, 'comment.mention', mentioned, commenterId, message);
}
