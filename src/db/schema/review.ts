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
