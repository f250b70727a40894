/**
 * The review workflow as a pure decision: given a case's state, who is acting and what
 * the review so far holds, may this action happen, and what state follows? The database
 * services run this inside the transaction that locks the case, with the state they read,
 * so two concurrent approvals or submits cannot both pass. Pure: no I/O.
 *
 *   draft ──submit──▶ in_review ──approve (enough approvals)──▶ published ──withdraw──▶ withdrawn
 *   returned ─submit─▶    │  ╰──return──▶ returned
 *
 * Editing a published case starts a new draft revision while the published one stays
 * visible; publishing that revision marks the older publication superseded (the services
 * handle revisions; this module decides the case's working state).
 */
import { can, type Role } from '../auth/roles';
import { CASE_STATE_LABELS, type CaseState } from '../cases/states';

/** What people do to a case in review. */
export const REVIEW_ACTIONS = ['submit', 'return', 'approve', 'withdraw'] as const;
export type ReviewAction = (typeof REVIEW_ACTIONS)[number];

/** From which states each action starts. */
export const ACTION_FROM: Readonly<Record<ReviewAction, readonly CaseState[]>> = {
  submit: ['draft', 'returned'],
  return: ['in_review'],
  approve: ['in_review'],
  withdraw: ['published'],
};

/** Everything the decision needs to know, read in the same transaction. */
export interface ReviewSituation {
  /** The case's current state. */
  readonly state: CaseState;
  /** The case's author. */
  readonly authorId: string;
  /** Everyone who wrote a revision of the version under review (the author included). */
  readonly editorIds: readonly string[];
  /** Reviewers the author asked for; empty means the firm's reviewer pool. */
  readonly requestedReviewerIds: readonly string[];
  /** Who has approved the revision under review so far. */
  readonly approverIds: readonly string[];
  /** Approvals that publish (a firm setting: 1 or 2). */
  readonly requiredApprovals: number;
}

/** The person acting. */
export interface ReviewActor {
  readonly userId: string;
  readonly role: Role;
  /** Unresolved comments this person wrote on the case. */
  readonly openComments?: number;
}

/** Why an action is refused, with the HTTP status that fits. */
export type ReviewRefusal =
  | 'not_author'
  | 'not_reviewer'
  | 'own_work'
  | 'not_requested'
  | 'wrong_state'
  | 'already_approved'
  | 'open_comments'
  | 'reason_required';

/** The outcome of {@link decideReview}. */
export type ReviewDecision =
  | {
      readonly ok: true;
      readonly to: CaseState;
      /** True when this action publishes the revision under review. */
      readonly publishes: boolean;
      /** Approvals of the revision after the action (approve adds the actor). */
      readonly approverIds: readonly string[];
    }
  | { readonly ok: false; readonly reason: ReviewRefusal; readonly status: 403 | 409 | 422; readonly message: string };

const STATUS: Readonly<Record<ReviewRefusal, 403 | 409 | 422>> = {
  not_author: 403,
  not_reviewer: 403,
  own_work: 403,
  not_requested: 403,
  wrong_state: 409,
  already_approved: 409,
  open_comments: 409,
  reason_required: 422,
};

const VERB: Readonly<Record<ReviewAction, string>> = { submit: 'submitted', return: 'returned', approve: 'approved', withdraw: 'withdrawn' };

function refuse(reason: ReviewRefusal, message: string): ReviewDecision {
  return { ok: false, reason, status: STATUS[reason], message };
}

function wrongState(action: ReviewAction, state: CaseState): ReviewDecision {
  const from = ACTION_FROM[action].map((s) => CASE_STATE_LABELS[s].toLowerCase()).join(' or ');
  return refuse(
    'wrong_state',
    `This case is ${CASE_STATE_LABELS[state].toLowerCase()}: only a case that is ${from} can be ${VERB[action]}. Someone may have acted on it meanwhile; reload to see where it stands.`,
  );
}

/**
 * Decides `action` by `actor` on a case in `situation`. Checks, in order: the role's
 * permission, the rule against checking one's own work, the state, then the rules of the
 * action (requested reviewers, one approval per person, own open comments, a reason).
 * Never throws.
 *
 * @example
 * decideReview('approve', { userId: 'u2', role: 'reviewer' }, situation)
 * // → { ok: true, to: 'published', publishes: true, approverIds: ['u2'] }
 */
export function decideReview(action: ReviewAction, actor: ReviewActor, situation: ReviewSituation, input: { reason?: string } = {}): ReviewDecision {
  const ownWork = actor.userId === situation.authorId || situation.editorIds.includes(actor.userId);
  switch (action) {
    case 'submit': {
      if (actor.userId !== situation.authorId) return refuse('not_author', 'Only the author submits a case for review.');
      if (!ACTION_FROM.submit.includes(situation.state)) return wrongState(action, situation.state);
      return { ok: true, to: 'in_review', publishes: false, approverIds: [] };
    }
    case 'return':
    case 'approve': {
      if (!can(actor.role, 'case', 'review')) return refuse('not_reviewer', `Only a reviewer can ${action === 'approve' ? 'approve' : 'return'} a case.`);
      if (ownWork) return refuse('own_work', 'Nobody checks their own work: a case is reviewed by someone who neither wrote nor edited it.');
      if (!ACTION_FROM[action].includes(situation.state)) return wrongState(action, situation.state);
      if (situation.requestedReviewerIds.length > 0 && !situation.requestedReviewerIds.includes(actor.userId)) {
        return refuse('not_requested', 'The author asked other reviewers to check this case.');
      }
      if (action === 'return') {
        if (!input.reason?.trim()) return refuse('reason_required', 'Say what needs changing: a returned case goes back to its author with your comments.');
        return { ok: true, to: 'returned', publishes: false, approverIds: [] };
      }
      if (situation.approverIds.includes(actor.userId)) return refuse('already_approved', 'You have already approved this revision.');
      if ((actor.openComments ?? 0) > 0) {
        const n = actor.openComments!;
        return refuse('open_comments', `Resolve your ${n === 1 ? 'open comment' : `${n} open comments`} before approving.`);
      }
      const approverIds = [...situation.approverIds, actor.userId];
      const publishes = approverIds.length >= Math.max(1, situation.requiredApprovals);
      return { ok: true, to: publishes ? 'published' : 'in_review', publishes, approverIds };
    }
    case 'withdraw': {
      if (!can(actor.role, 'case', 'withdraw')) return refuse('not_reviewer', 'Only a reviewer or a firm admin can withdraw a published case.');
      if (!ACTION_FROM.withdraw.includes(situation.state)) return wrongState(action, situation.state);
      if (!input.reason?.trim()) return refuse('reason_required', 'Give the reason for withdrawing: colleagues who relied on the case will read it.');
      return { ok: true, to: 'withdrawn', publishes: false, approverIds: situation.approverIds };
    }
  }
}

/**
 * What an edit does to a case: a published case gets a new draft revision (the
 * publication stays visible); an edit in review cancels the approvals given so far (the
 * reviewers are told); drafts and returned cases stay as they are. Null for states no one
 * edits (withdrawn, superseded).
 */
export function afterEdit(state: CaseState): { readonly state: CaseState; readonly cancelsApprovals: boolean } | null {
  switch (state) {
    case 'draft':
    case 'returned':
      return { state, cancelsApprovals: false };
    case 'in_review':
      return { state: 'in_review', cancelsApprovals: true };
    case 'published':
      return { state: 'draft', cancelsApprovals: false };
    default:
      return null;
  }
}
