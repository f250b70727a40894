/**
 * Review comments: threads on a case as a whole or on one calculation block. The case's
 * author and the firm's reviewers write, reply, resolve and reopen; a reply to a resolved
 * thread reopens it (the point is not settled). Every change locks the case row first, so
 * a comment and a review decision on the same case never interleave.
 */
import { randomUUID } from 'node:crypto';
import { and, asc, eq, isNull, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { z } from 'zod';
import type { Database, Queryable } from '../../db/client';
import { caseRevision, reviewComment, user } from '../../db/schema';
import { can, type Role } from '../auth/roles';
import { lockCase } from '../cases';
import { wakeMailWorker } from '../mail';
import { notifyMentions } from './notify';

/** Longest comment accepted (the database refuses longer ones too). */
export const MAX_COMMENT_LENGTH = 10_000;

/** A new comment or reply, as the API and the page form send it. */
export const NewCommentSchema = z.object({
  body: z
    .string()
    .trim()
    .min(1, 'Write the comment first.')
    .max(MAX_COMMENT_LENGTH, `Keep a comment under ${MAX_COMMENT_LENGTH.toLocaleString('en')} characters.`),
  /** The thread replied to; absent for a new thread. */
  threadId: z.string().min(1).max(100).optional(),
  /** The block commented on (position from 0); absent or null for the whole case. */
  blockIndex: z.coerce.number().int().min(0).max(999).nullable().optional(),
});
export type NewComment = z.output<typeof NewCommentSchema>;

/** Resolving or reopening a thread. */
export const ResolveCommentSchema = z.object({ resolved: z.boolean({ message: 'resolved must be true or false' }) });

/** One comment as shown. */
export interface CommentEntry {
  id: string;
  authorId: string;
  authorName: string;
  body: string;
  revisionNumber: number;
  createdAt: Date;
}

/** A thread: its first comment, anchor, state and replies (oldest first). */
export interface CommentThread extends CommentEntry {
  blockIndex: number | null;
  blockTitle: string | null;
  resolvedAt: Date | null;
  resolvedByName: string | null;
  replies: CommentEntry[];
}

/** Why a comment change is refused, with the status that fits. */
export type CommentRefusal = 'not_found' | 'thread_not_found' | 'not_participant' | 'withdrawn';

/** HTTP status and wording of each refusal; shared by the page and the API. */
export const COMMENT_FAILURES: Record<CommentRefusal, { status: number; code: string; message: string }> = {
  not_found: { status: 404, code: 'not_found', message: 'That case was not found.' },
  thread_not_found: { status: 404, code: 'not_found', message: 'That comment thread was not found on this case.' },
  not_participant: {
    status: 403,
    code: 'forbidden',
    message: 'Review comments are written by the case’s author and the firm’s reviewers.',
  },
  withdrawn: { status: 409, code: 'withdrawn', message: 'This case has been withdrawn: its review is closed.' },
};

/** How a block is named in a comment's anchor ("Title (name)"). */
export function blockAnchorTitle(block: { readonly title: string; readonly name: string | null }): string {
  return block.name ? `${block.title} (${block.name})` : block.title;
}

/** How each block of an evaluation is named in a comment's anchor ("Title (name)"). */
export function blockAnchorTitles(evaluation: { readonly blocks: readonly { readonly title: string; readonly name: string | null }[] }): string[] {
  return evaluation.blocks.map(blockAnchorTitle);
}

/**
 * The anchor title of block `index` in the stored results of revision `revision`, or null
 * when the revision has no such block. Reads only that block's title and name, not the results.
 */
async function storedBlockTitle(tx: Queryable, input: { firmId: string; caseId: string; revision: number; index: number }): Promise<string | null> {
  const block = sql`${caseRevision.results} -> 'blocks' -> ${input.index}::int`;
  const [row] = await tx
    .select({ title: sql<string | null>`${block} ->> 'title'`, name: sql<string | null>`${block} ->> 'name'` })
    .from(caseRevision)
    .where(and(eq(caseRevision.firmId, input.firmId), eq(caseRevision.caseId, input.caseId), eq(caseRevision.number, input.revision)));
  return row?.title == null ? null : blockAnchorTitle({ title: row.title, name: row.name });
}

/** Who is commenting. */
export interface Commenter {
  userId: string;
  role: Role;
}

const mayTakePart = (who: Commenter, authorId: string) => who.userId === authorId || can(who.role, 'case', 'review');

/** The outcome of adding a comment. */
export type AddCommentResult =
  | { ok: true; id: string; threadId: string; reopened: boolean; revisionNumber: number; /** Colleagues told by e-mail. */ mentioned: number }
  | { ok: false; reason: CommentRefusal };

/**
 * Adds a comment to the case (a new thread, or a reply when `threadId` is given). A block
 * anchor records the block's title as the latest revision's stored results name it (read
 * in the same transaction, under the case lock) so it still reads after edits; an index
 * past the last block anchors to the whole case. Colleagues mentioned as `@name` (their
 * e-mail before the @) are told by e-mail.
 */
export async function addComment(
  database: Database,
  input: { firmId: string; caseId: string; commenter: Commenter; comment: NewComment },
): Promise<AddCommentResult> {
  const result = await database.transaction(async (tx): Promise<AddCommentResult> => {
    const current = await lockCase(tx, input.firmId, input.caseId);
    if (!current) return { ok: false, reason: 'not_found' };
    if (!mayTakePart(input.commenter, current.authorId)) return { ok: false, reason: 'not_participant' };
    if (current.state === 'withdrawn') return { ok: false, reason: 'withdrawn' };

    let threadId: string | null = null;
    let reopened = false;
    if (input.comment.threadId) {
      const [thread] = await tx
        .select({ id: reviewComment.id, resolvedAt: reviewComment.resolvedAt })
        .from(reviewComment)
        .where(and(eq(reviewComment.id, input.comment.threadId), eq(reviewComment.caseId, current.id), isNull(reviewComment.threadId)));
      if (!thread) return { ok: false, reason: 'thread_not_found' };
      threadId = thread.id;
      if (thread.resolvedAt) {
        await tx.update(reviewComment).set({ resolvedAt: null, resolvedBy: null }).where(eq(reviewComment.id, thread.id));
        reopened = true;
      }
    }
    const blockIndex = threadId ? null : (input.comment.blockIndex ?? null);
    const blockTitle =
      blockIndex === null ? null : await storedBlockTitle(tx, { firmId: input.firmId, caseId: current.id, revision: current.latestRevision, index: blockIndex });
    const id = randomUUID();
    await tx.insert(reviewComment).values({
      id,
      caseId: current.id,
      firmId: input.firmId,
      threadId,
      authorId: input.commenter.userId,
      body: input.comment.body,
      revisionNumber: current.latestRevision,
      blockIndex: blockTitle === null ? null : blockIndex,
      blockTitle,
    });
    const notified = { firmId: input.firmId, caseId: current.id, title: current.title, revision: current.latestRevision, authorId: current.authorId };
    const mentioned = await notifyMentions(tx, notified, input.commenter.userId, { body: input.comment.body, blockTitle });
    return { ok: true, id, threadId: threadId ?? id, reopened, revisionNumber: current.latestRevision, mentioned };
  });
  if (result.ok && result.mentioned > 0) wakeMailWorker();
  return result;
}

/** Resolves (or reopens) a thread of the case. */
export async function resolveThread(
  database: Database,
  input: { firmId: string; caseId: string; threadId: string; commenter: Commenter; resolved: boolean },
): Promise<{ ok: true; resolved: boolean } | { ok: false; reason: CommentRefusal }> {
  return database.transaction(async (tx) => {
    const current = await lockCase(tx, input.firmId, input.caseId);
    if (!current) return { ok: false as const, reason: 'not_found' as const };
    if (!mayTakePart(input.commenter, current.authorId)) return { ok: false as const, reason: 'not_participant' as const };
    const updated = await tx
      .update(reviewComment)
      .set(input.resolved ? { resolvedAt: new Date(), resolvedBy: input.commenter.userId } : { resolvedAt: null, resolvedBy: null })
      .where(and(eq(reviewComment.id, input.threadId), eq(reviewComment.caseId, current.id), isNull(reviewComment.threadId)))
      .returning({ id: reviewComment.id });
    if (!updated.length) return { ok: false as const, reason: 'thread_not_found' as const };
    return { ok: true as const, resolved: input.resolved };
  });
}

const commentAuthor = alias(user, 'comment_author');
const resolver = alias(user, 'comment_resolver');

/** One comment row as threads are built from it (a root when `threadId` is null). */
export interface CommentRow extends CommentEntry {
  threadId: string | null;
  blockIndex: number | null;
  blockTitle: string | null;
  resolvedAt: Date | null;
  resolvedByName: string | null;
}

/** Threads from comment rows ordered oldest first: roots in order, each with its replies. */
export function threadsOf(rows: readonly CommentRow[]): CommentThread[] {
  const threads = new Map<string, CommentThread>();
  for (const row of rows) {
    const entry: CommentEntry = { id: row.id, authorId: row.authorId, authorName: row.authorName, body: row.body, revisionNumber: row.revisionNumber, createdAt: row.createdAt };
    if (row.threadId === null) {
      threads.set(row.id, { ...entry, blockIndex: row.blockIndex, blockTitle: row.blockTitle, resolvedAt: row.resolvedAt, resolvedByName: row.resolvedByName, replies: [] });
    } else {
      threads.get(row.threadId)?.replies.push(entry);
    }
  }
  return [...threads.values()];
}

/** Every thread of the case, oldest first, with replies; empty for another firm's case. */
export async function listComments(database: Queryable, firmId: string, caseId: string): Promise<CommentThread[]> {
  const rows = await database
    .select({
      id: reviewComment.id,
      threadId: reviewComment.threadId,
      authorId: reviewComment.authorId,
      authorName: commentAuthor.name,
      body: reviewComment.body,
      revisionNumber: reviewComment.revisionNumber,
      blockIndex: reviewComment.blockIndex,
      blockTitle: reviewComment.blockTitle,
      createdAt: reviewComment.createdAt,
      resolvedAt: reviewComment.resolvedAt,
      resolvedByName: resolver.name,
    })
    .from(reviewComment)
    .innerJoin(commentAuthor, eq(commentAuthor.id, reviewComment.authorId))
    .leftJoin(resolver, eq(resolver.id, reviewComment.resolvedBy))
    .where(and(eq(reviewComment.firmId, firmId), eq(reviewComment.caseId, caseId)))
    .orderBy(asc(reviewComment.createdAt), asc(reviewComment.id));
  return threadsOf(rows);
}

/** Unresolved threads on the case, in all and started by `userId` (who may not approve while any is open). */
export async function openCommentCounts(database: Queryable, caseId: string, userId: string): Promise<{ open: number; mine: number }> {
  const [row] = await database
    .select({
      open: sql<number>`count(*)::int`,
      mine: sql<number>`count(*) filter (where ${reviewComment.authorId} = ${userId})::int`,
    })
    .from(reviewComment)
    .where(and(eq(reviewComment.caseId, caseId), isNull(reviewComment.threadId), isNull(reviewComment.resolvedAt)));
  return { open: row?.open ?? 0, mine: row?.mine ?? 0 };
}
