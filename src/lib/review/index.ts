/**
 * Peer review (`@/lib/review`): the workflow's decisions (pure, `./transitions`, which the
 * browser may import directly) and the database services that apply them.
 */
export { ACTION_FROM, afterEdit, decideReview, REVIEW_ACTIONS, type ReviewAction, type ReviewActor, type ReviewDecision, type ReviewRefusal, type ReviewSituation } from './transitions';
export { actOnCase, type ReviewRequest, type ReviewResult } from './services';
export {
  addComment,
  blockAnchorTitles,
  COMMENT_FAILURES,
  listComments,
  MAX_COMMENT_LENGTH,
  NewCommentSchema,
  openCommentCounts,
  ResolveCommentSchema,
  resolveThread,
  type AddCommentResult,
  type CommentEntry,
  type Commenter,
  type CommentRefusal,
  type CommentThread,
  type NewComment,
} from './comments';
export { getCaseReview, getReviewPanel, type ApprovalEntry, type CaseReview, type Person, type ReviewEvent, type ReviewPanel } from './panel';
export { requiredApprovalsOf, setRequiredApprovals } from './settings';
export { MAX_REASON_LENGTH, ReviewActionSchema, ReviewSettingSchema, type ReviewActionRequest } from './validation';
export { listReviewQueue, type QueueEntry, type ReviewQueue } from './queue';
export { compareEvaluations, DRIFT_TOLERANCE, MAX_TABLE_CELLS_LISTED, withinTolerance, type BlockChange, type BlockDrift, type DriftTolerance, type FigureDrift, type FigureSide } from './drift';
export {
  caseDrift,
  caseDriftFrom,
  DRIFT_BATCH_SIZE,
  DRIFT_RUN_STALE_MS,
  getDriftRun,
  latestDriftRun,
  startDriftRun,
  type CaseDrift,
  type DriftBasis,
  type DriftRunFinding,
  type DriftRunView,
  type StartedDriftRun,
} from './driftCheck';
