/**
 * Peer review: each submission of a case (a review round, with the reviewers asked for),
 * the approvals given in it (with the solver version and the results snapshot that were
 * checked), and the firm's review settings. Decisions live in src/lib/review/transitions.ts.
 */
import { sql } from 'drizzle-orm';
import { check, foreignKey, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex } from 'drizzle-orm/pg-core';
import type { CaseEvaluation } from '../../lib/calc/results';
import { organization, user } from './auth';
import { caseFile } from './cases';

/** A firm's review rules: how many approvals publish a case (1 or 2). */
export const firmReviewSetting = pgTable(
  'firm_review_setting',
  {
    firmId: text('firm_id')
      .primaryKey()
      .references(() => organization.id, { onDelete: 'restrict' }),
    requiredApprovals: integer('required_approvals').notNull().default(1),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [check('firm_review_required_approvals_check', sql`${t.requiredApprovals} in (1, 2)`)],
);

/** One submission of a case for review, open until it is returned or publishes. */
export const reviewRound = pgTable(
  'review_round',
  {
    id: text('id').primaryKey(),
    caseId: text('case_id').notNull(),
    firmId: text('firm_id').notNull(),
    /** The revision that was submitted. */
    submittedRevision: integer('submitted_revision').notNull(),
    submittedBy: text('submitted_by')
      .notNull()
      .references(() => user.id, { onDelete: 'restrict' }),
    submittedAt: timestamp('submitted_at', { withTimezone: true }).notNull().defaultNow(),
    /** Reviewers asked for; empty: anyone in the firm's reviewer pool. */
    reviewerIds: text('reviewer_ids').array().notNull().default(sql`'{}'::text[]`),
    /** `returned` or `published` once the round ends; null while open. */
    outcome: text('outcome'),
    closedAt: timestamp('closed_at', { withTimezone: true }),
  },
  (t) => [
    foreignKey({ name: 'review_round_case_fk', columns: [t.caseId, t.firmId], foreignColumns: [caseFile.id, caseFile.firmId] }).onDelete('restrict'),
    // At most one open round per case.
    uniqueIndex('review_round_one_open').on(t.caseId).where(sql`${t.outcome} is null`),
    index('review_round_firm_idx').on(t.firmId, t.submittedAt),
    check('review_round_outcome_check', sql`${t.outcome} is null or ${t.outcome} in ('returned', 'published')`),
  ],
);

/**
 * An approval of one revision by one reviewer: who, when, which solver, and the results
 * of every block as they checked them. An edit during the review cancels it (never deletes).
 */
export const approval = pgTable(
  'approval',
  {
    id: text('id').primaryKey(),
    roundId: text('round_id')
      .notNull()
      .references(() => reviewRound.id, { onDelete: 'restrict' }),
    caseId: text('case_id').notNull(),
    firmId: text('firm_id').notNull(),
    revisionNumber: integer('revision_number').notNull(),
    reviewerId: text('reviewer_id')
      .notNull()
      .references(() => user.id, { onDelete: 'restrict' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    solverVersion: text('solver_version').notNull(),
    snapshot: jsonb('snapshot').$type<CaseEvaluation>().notNull(),
    cancelledAt: timestamp('cancelled_at', { withTimezone: true }),
  },
  (t) => [
    foreignKey({ name: 'approval_case_fk', columns: [t.caseId, t.firmId], foreignColumns: [caseFile.id, caseFile.firmId] }).onDelete('restrict'),
    // The database, too, refuses a second standing approval of a revision by the same person.
    uniqueIndex('approval_one_per_reviewer').on(t.caseId, t.revisionNumber, t.reviewerId).where(sql`${t.cancelledAt} is null`),
  ],
);

/**
 * A comment in a case's review: on the case as a whole or anchored to one calculation
 * block (by its position and the title it had). A thread is a root comment and its
 * replies (`threadId` points at the root); resolving marks the root.
 */
export const reviewComment = pgTable(
  'review_comment',
  {
    id: text('id').primaryKey(),
    caseId: text('case_id').notNull(),
    firmId: text('firm_id').notNull(),
    /** Null for the first comment of a thread; otherwise the thread's first comment. */
    threadId: text('thread_id'),
    authorId: text('author_id')
      .notNull()
      .references(() => user.id, { onDelete: 'restrict' }),
    body: text('body').notNull(),
    /** The revision on screen when the comment was written. */
    revisionNumber: integer('revision_number').notNull(),
    /** Position of the block commented on (from 0), null for a comment on the whole case. */
    blockIndex: integer('block_index'),
    /** The block's title when commented on, so the anchor still reads after edits. */
    blockTitle: text('block_title'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    /** Set on a thread's first comment when the thread is resolved. */
    resolvedAt: timestamp('resolved_at', { withTimezone: true }),
    resolvedBy: text('resolved_by').references(() => user.id, { onDelete: 'restrict' }),
  },
  (t) => [
    foreignKey({ name: 'review_comment_case_fk', columns: [t.caseId, t.firmId], foreignColumns: [caseFile.id, caseFile.firmId] }).onDelete('restrict'),
    foreignKey({ name: 'review_comment_thread_fk', columns: [t.threadId], foreignColumns: [t.id] }).onDelete('restrict'),
    index('review_comment_case_idx').on(t.caseId, t.createdAt),
    check('review_comment_body_check', sql`length(${t.body}) between 1 and 10000`),
  ],
);

/**
 * One re-run of a firm's published cases against today's solver, compared with the
 * snapshots their approvals recorded. Progress is written as it goes, so a page can show it.
 */
export const driftRun = pgTable(
  'drift_run',
  {
    id: text('id').primaryKey(),
    firmId: text('firm_id')
      .notNull()
      .references(() => organization.id, { onDelete: 'restrict' }),
    startedBy: text('started_by').references(() => user.id, { onDelete: 'set null' }),
    startedAt: timestamp('started_at', { withTimezone: true }).notNull().defaultNow(),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
    solverVersion: text('solver_version').notNull(),
    /** Published cases to check, and how many are done. */
    total: integer('total').notNull().default(0),
    checked: integer('checked').notNull().default(0),
    /** The cases whose results drift, with the blocks and figures. */
    findings: jsonb('findings').$type<unknown[]>().notNull().default(sql`'[]'::jsonb`),
    /** Set when the run stopped on an error. */
    error: text('error'),
  },
  (t) => [index('drift_run_firm_idx').on(t.firmId, t.startedAt)],
);
