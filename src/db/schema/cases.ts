/**
 * Cases and their revisions. A case's metadata (title, structure, tags…) lives on `case`
 * and may change; its body lives only in `case_revision`, one row per save, never changed
 * or deleted (a trigger in drizzle/0002_case_revision_immutable.sql refuses both).
 */
import { sql } from 'drizzle-orm';
import {
  check,
  doublePrecision,
  foreignKey,
  index,
  integer,
  jsonb,
  pgTable,
  text,
  timestamp,
  unique,
  uniqueIndex,
} from 'drizzle-orm/pg-core';
import type { CaseEvaluation } from '../../lib/calc/results';
// A pure constant module: every state the review workflow will need is allowed from the start.
import { CASE_STATES, type CaseState } from '../../lib/cases/states';
import { organization, user } from './auth';

const stateList = sql.raw(CASE_STATES.map((s) => `'${s}'`).join(', '));

/** A worked case of a firm: its metadata, owner, state and the number of its latest revision. */
export const caseFile = pgTable(
  'case',
  {
    id: text('id').primaryKey(),
    firmId: text('firm_id')
      .notNull()
      .references(() => organization.id, { onDelete: 'restrict' }),
    title: text('title').notNull(),
    /** Derived from the title at creation, unique in the firm, never changed afterwards. */
    slug: text('slug').notNull(),
    structureType: text('structure_type').notNull(),
    sectionShape: text('section_shape').notNull(),
    projectReference: text('project_reference'),
    /** One or two sentences: what the case found, for search results and lists (null for none). */
    summary: text('summary'),
    region: text('region'),
    tags: text('tags').array().notNull().default(sql`'{}'::text[]`),
    authorId: text('author_id')
      .notNull()
      .references(() => user.id, { onDelete: 'restrict' }),
    state: text('state').$type<CaseState>().notNull().default('draft'),
    latestRevision: integer('latest_revision').notNull(),
    /** The revision colleagues rely on (null until first published); a new draft leaves it standing. */
    publishedRevision: integer('published_revision'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('case_firm_slug_unique').on(t.firmId, t.slug),
    // Target of case_revision's (case_id, firm_id) key: a revision is always in its case's firm.
    unique('case_id_firm_unique').on(t.id, t.firmId),
    index('case_firm_updated_idx').on(t.firmId, t.updatedAt.desc()),
    index('case_author_idx').on(t.authorId),
    check('case_state_check', sql`${t.state} in (${stateList})`),
    check('case_latest_revision_check', sql`${t.latestRevision} >= 1`),
  ],
);

/**
 * One saved version of a case body, with the key figures of its evaluated blocks (for
 * search and lists) and the whole evaluation as it was when saved. Immutable.
 */
export const caseRevision = pgTable(
  'case_revision',
  {
    id: text('id').primaryKey(),
    caseId: text('case_id').notNull(),
    /** Denormalised from the case, so isolation checks need no join. */
    firmId: text('firm_id')
      .notNull()
      .references(() => organization.id, { onDelete: 'restrict' }),
    /** 1, 2, 3… within the case. */
    number: integer('number').notNull(),
    /** Markdown with calculation blocks. */
    body: text('body').notNull(),
    authorId: text('author_id')
      .notNull()
      .references(() => user.id, { onDelete: 'restrict' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    /** Smallest and largest inflow Froude number Fr1 over the blocks. */
    fr1Min: doublePrecision('fr1_min'),
    fr1Max: doublePrecision('fr1_max'),
    /** Smallest and largest discharge, m³/s. */
    dischargeMin: doublePrecision('discharge_min'),
    dischargeMax: doublePrecision('discharge_max'),
    /** Largest inflow velocity V1, m/s. */
    v1: doublePrecision('v1'),
    /** Smallest inflow (toe) depth y1, m. */
    y1: doublePrecision('y1'),
    /** Largest sequent depth y2, m. */
    y2: doublePrecision('y2'),
    /** Largest relative head loss ΔE/E1. */
    relativeLoss: doublePrecision('relative_loss'),
    sectionShapes: text('section_shapes').array().notNull().default(sql`'{}'::text[]`),
    calcKinds: text('calc_kinds').array().notNull().default(sql`'{}'::text[]`),
    /** The whole evaluation of the body (`evaluateCase`) at save time. */
    results: jsonb('results').$type<CaseEvaluation>().notNull(),
    solverVersion: text('solver_version').notNull(),
  },
  (t) => [
    uniqueIndex('case_revision_case_number_unique').on(t.caseId, t.number),
    foreignKey({ name: 'case_revision_case_fk', columns: [t.caseId, t.firmId], foreignColumns: [caseFile.id, caseFile.firmId] }).onDelete(
      'restrict',
    ),
    check('case_revision_number_check', sql`${t.number} >= 1`),
  ],
);
