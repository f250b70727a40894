/**
 * What the review panel of a case page shows: the open round (who submitted, whom they
 * asked, the approvals so far), who checked the published revision, the firm's reviewers
 * (to ask for on submission), the comment threads and the case's review history; and
 * what the drift notice starts from. All in one prepared query (each part a JSON
 * subquery), because the case page reads it on every view.
 */
import { and, eq, sql, type SQL } from 'drizzle-orm';
import { prepared, type Database } from '../../db/client';
import { approval, auditEvent, caseFile, firmReviewSetting, member, reviewComment, reviewRound, user } from '../../db/schema';
import { threadsOf, type CommentRow, type CommentThread } from './comments';
import type { DriftBasis } from './driftCheck';

/** A person by id and name. */
export interface Person {
  userId: string;
  name: string;
}

/** A standing approval: who checked which revision, when, with which solver. */
export interface ApprovalEntry {
  reviewerId: string;
  reviewerName: string;
  revisionNumber: number;
  solverVersion: string;
  createdAt: Date;
}

/** One event of the case's review history, newest first. */
export interface ReviewEvent {
  action: string;
  actorName: string | null;
  createdAt: Date;
  details: Record<string, unknown>;
}

/** Everything the review panel shows. */
export interface ReviewPanel {
  requiredApprovals: number;
  round: {
    submittedByName: string;
    submittedAt: Date;
    submittedRevision: number;
    /** Reviewers asked for; empty: the firm's reviewer pool. */
    reviewers: Person[];
    /** Approvals of the revision under review that still stand. */
    approvals: ApprovalEntry[];
  } | null;
  /** Standing approvals of the published revision ("checked by … on …"). */
  checkedBy: ApprovalEntry[];
  /** The firm's reviewers. */
  reviewers: Person[];
  threads: CommentThread[];
  openThreads: number;
  history: ReviewEvent[];
}

/** What the case page needs of the review: the panel and, for a published case, the drift basis. */
export interface CaseReview {
  panel: ReviewPanel;
  /** The latest standing approval of the published revision (null: not published, withdrawn or none). */
  driftBasis: DriftBasis | null;
}

/** The review actions recorded against a case, as history shows them. */
const REVIEW_EVENTS = [
  'case.submitted',
  'case.returned',
  'case.approved',
  'case.approvals_cancelled',
  'case.published',
  'case.superseded',
  'case.withdrawn',
] as const;

/** How many history events the panel shows. */
const HISTORY_LENGTH = 30;

// JSON carries timestamps as ISO text; these are the rows before they become Dates.
type Json<T> = { [K in keyof T]: T[K] extends Date ? string : T[K] extends Date | null ? string | null : T[K] };
type ApprovalJson = Json<ApprovalEntry>;

const personJson = sql`json_build_object('userId', u.id, 'name', u.name)`;
const approvalJson = sql`json_build_object('reviewerId', a.reviewer_id, 'reviewerName', u.name, 'revisionNumber', a.revision_number, 'solverVersion', a.solver_version, 'createdAt', a.created_at)`;

// Columns of the outer case row, qualified (Drizzle leaves them bare in a query of one table).
const outer = {
  id: sql`${caseFile}.id`,
  firmId: sql`${caseFile}.firm_id`,
  title: sql`${caseFile}.title`,
  state: sql`${caseFile}.state`,
  latestRevision: sql`${caseFile}.latest_revision`,
  publishedRevision: sql`${caseFile}.published_revision`,
};
const jsonList = (item: SQL, order: SQL) => sql`coalesce(json_agg(${item} order by ${order}), '[]'::json)`;

const requiredApprovals = sql<number>`coalesce((select s.required_approvals from ${firmReviewSetting} s where s.firm_id = ${outer.firmId}), 1)`;

const reviewers = sql<Person[]>`(
  select ${jsonList(personJson, sql`u.name`)}
  from ${member} m join ${user} u on u.id = m.user_id
  where m.firm_id = ${outer.firmId} and m.role = 'reviewer'
)`;

const round = sql<(Json<Omit<NonNullable<ReviewPanel['round']>, 'reviewers' | 'approvals'>> & { reviewerIds: string[]; approvals: ApprovalJson[] }) | null>`(
  select json_build_object(
    'submittedByName', s.name, 'submittedAt', r.submitted_at, 'submittedRevision', r.submitted_revision, 'reviewerIds', r.reviewer_ids,
    'approvals', (
      select ${jsonList(approvalJson, sql`a.created_at`)}
      from ${approval} a join ${user} u on u.id = a.reviewer_id
      where a.round_id = r.id and a.revision_number = ${outer.latestRevision} and a.cancelled_at is null
    )
  )
  from ${reviewRound} r join ${user} s on s.id = r.submitted_by
  where r.firm_id = ${outer.firmId} and r.case_id = ${outer.id} and r.outcome is null
)`;

const publishedApprovals = sql`from ${approval} a join ${user} u on u.id = a.reviewer_id
  where a.firm_id = ${outer.firmId} and a.case_id = ${outer.id} and a.revision_number = ${outer.publishedRevision} and a.cancelled_at is null`;

const checkedBy = sql<ApprovalJson[]>`(select ${jsonList(approvalJson, sql`a.created_at`)} ${publishedApprovals})`;

// The same approval `caseDrift` compares with: the latest standing one of the published revision, unless
// withdrawn; its row version is `xmin`, as `approvalRowVersion` (driftCache.ts) reads it.
const driftBasis = sql<Json<DriftBasis> | null>`(
  select json_build_object(
    'caseId', ${outer.id}, 'title', ${outer.title}, 'revision', a.revision_number, 'approvalId', a.id, 'rowVersion', a.xmin::text,
    'approvedBy', u.name, 'approvedAt', a.created_at, 'solverVersionApproved', a.solver_version
  )
  ${publishedApprovals} and ${outer.state} <> 'withdrawn'
  order by a.created_at desc
  limit 1
)`;

const comments = sql<Json<CommentRow>[]>`(
  select ${jsonList(
    sql`json_build_object('id', c.id, 'threadId', c.thread_id, 'authorId', c.author_id, 'authorName', w.name, 'body', c.body, 'revisionNumber', c.revision_number,
      'blockIndex', c.block_index, 'blockTitle', c.block_title, 'createdAt', c.created_at, 'resolvedAt', c.resolved_at, 'resolvedByName', v.name)`,
    sql`c.created_at, c.id`,
  )}
  from ${reviewComment} c join ${user} w on w.id = c.author_id left join ${user} v on v.id = c.resolved_by
  where c.firm_id = ${outer.firmId} and c.case_id = ${outer.id}
)`;

const history = sql<Json<ReviewEvent>[]>`(
  select ${jsonList(sql`json_build_object('action', h.action, 'actorName', h.actor_name, 'createdAt', h.created_at, 'details', h.details)`, sql`h.created_at desc, h.id desc`)}
  from (
    select e.id, e.action, u.name as actor_name, e.created_at, e.details
    from ${auditEvent} e left join ${user} u on u.id = e.actor_user_id
    where e.target_id = ${outer.id} and e.firm_id = ${outer.firmId} and e.action in (${sql.raw(REVIEW_EVENTS.map((a) => `'${a}'`).join(', '))})
    order by e.created_at desc, e.id desc
    limit ${sql.raw(String(HISTORY_LENGTH))}
  ) h
)`;

const panelQuery = prepared((database: Database) =>
  database
    .select({
      requiredApprovals: requiredApprovals.as('required_approvals'),
      round: round.as('round'),
      checkedBy: checkedBy.as('checked_by'),
      reviewers: reviewers.as('reviewers'),
      comments: comments.as('comments'),
      history: history.as('history'),
      driftBasis: driftBasis.as('drift_basis'),
    })
    .from(caseFile)
    .where(and(eq(caseFile.firmId, sql.placeholder('firmId')), eq(caseFile.id, sql.placeholder('caseId'))))
    .prepare('review_panel'),
);

const date = (iso: string) => new Date(iso);
const dateOrNull = (iso: string | null) => (iso === null ? null : new Date(iso));
const approvalEntry = (a: ApprovalJson): ApprovalEntry => ({ ...a, createdAt: date(a.createdAt) });

const EMPTY_PANEL: ReviewPanel = { requiredApprovals: 1, round: null, checkedBy: [], reviewers: [], threads: [], openThreads: 0, history: [] };

/**
 * The review panel of a case of the firm and the basis of its drift check, in one query.
 * Revisions (latest, published) and the state are the case row's as the query reads it.
 * Another firm's case (or none) gives an empty panel.
 */
export async function getCaseReview(database: Database, firmId: string, caseId: string): Promise<CaseReview> {
  const [row] = await panelQuery(database).execute({ firmId, caseId });
  if (!row) return { panel: EMPTY_PANEL, driftBasis: null };
  const reviewerList = row.reviewers;
  const byId = new Map(reviewerList.map((r) => [r.userId, r]));
  const threads = threadsOf(row.comments.map((c) => ({ ...c, createdAt: date(c.createdAt), resolvedAt: dateOrNull(c.resolvedAt) })));
  const panel: ReviewPanel = {
    requiredApprovals: row.requiredApprovals,
    round: row.round
      ? {
          submittedByName: row.round.submittedByName,
          submittedAt: date(row.round.submittedAt),
          submittedRevision: row.round.submittedRevision,
          reviewers: row.round.reviewerIds.map((id) => byId.get(id) ?? { userId: id, name: 'a former member' }),
          approvals: row.round.approvals.map(approvalEntry),
        }
      : null,
    checkedBy: row.checkedBy.map(approvalEntry),
    reviewers: reviewerList,
    threads,
    openThreads: threads.filter((t) => !t.resolvedAt).length,
    history: row.history.map((e) => ({ ...e, createdAt: date(e.createdAt) })),
  };
  const basis = row.driftBasis;
  return { panel, driftBasis: basis ? { ...basis, approvedAt: date(basis.approvedAt) } : null };
}

/** The review panel of a case of the firm (see {@link getCaseReview}). */
export async function getReviewPanel(database: Database, firmId: string, caseFacts: { id: string }): Promise<ReviewPanel> {
  return (await getCaseReview(database, firmId, caseFacts.id)).panel;
}
