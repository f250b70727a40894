import { describe, expect, it } from 'vitest';
import type { Role } from '@/lib/auth/roles';
import { CASE_STATES, type CaseState } from '@/lib/cases/states';
import { afterEdit, decideReview, REVIEW_ACTIONS, type ReviewAction, type ReviewSituation } from '@/lib/review/transitions';

/** The people of the table: the author, a colleague, two reviewers, an admin, and a reviewer who edited the case. */
const PEOPLE: Record<string, { userId: string; role: Role }> = {
  author: { userId: 'u-author', role: 'engineer' },
  colleague: { userId: 'u-colleague', role: 'engineer' },
  reviewer: { userId: 'u-reviewer', role: 'reviewer' },
  reviewer2: { userId: 'u-reviewer2', role: 'reviewer' },
  admin: { userId: 'u-admin', role: 'admin' },
  editingReviewer: { userId: 'u-editor', role: 'reviewer' },
};

const situation = (state: CaseState, extra: Partial<ReviewSituation> = {}): ReviewSituation => ({
  state,
  authorId: PEOPLE.author!.userId,
  editorIds: [PEOPLE.author!.userId, PEOPLE.editingReviewer!.userId],
  requestedReviewerIds: [],
  approverIds: [],
  requiredApprovals: 1,
  ...extra,
});

/**
 * Every allowed (action, state, person) and the state it leads to, written out from the
 * workflow of the product brief; every other combination must be refused.
 */
const ALLOWED: Array<[ReviewAction, CaseState, string, CaseState]> = [
  ['submit', 'draft', 'author', 'in_review'],
  ['submit', 'returned', 'author', 'in_review'],
  ['return', 'in_review', 'reviewer', 'returned'],
  ['return', 'in_review', 'reviewer2', 'returned'],
  ['approve', 'in_review', 'reviewer', 'published'],
  ['approve', 'in_review', 'reviewer2', 'published'],
  ['withdraw', 'published', 'reviewer', 'withdrawn'],
  ['withdraw', 'published', 'reviewer2', 'withdrawn'],
  ['withdraw', 'published', 'admin', 'withdrawn'],
  ['withdraw', 'published', 'editingReviewer', 'withdrawn'],
];

describe('decideReview: the whole table', () => {
  const rows = REVIEW_ACTIONS.flatMap((action) => CASE_STATES.flatMap((state) => Object.keys(PEOPLE).map((who) => [action, state, who] as const)));

  it.each(rows)('%s on a %s case by %s', (action, state, who) => {
    const decision = decideReview(action, PEOPLE[who]!, situation(state), { reason: 'Check the tailwater rating.' });
    const allowed = ALLOWED.find(([a, s, p]) => a === action && s === state && p === who);
    if (allowed) {
      expect(decision).toMatchObject({ ok: true, to: allowed[3] });
    } else {
      expect(decision.ok).toBe(false);
      if (!decision.ok) {
        expect([403, 409]).toContain(decision.status);
        expect(decision.message.length).toBeGreaterThan(20);
      }
    }
  });

  it('has every allowed row reachable (the table names real people and states)', () => {
    for (const [action, state, who] of ALLOWED) expect(decideReview(action, PEOPLE[who]!, situation(state), { reason: 'x' }).ok).toBe(true);
  });
});

describe('decideReview: the rules', () => {
  it('refuses self-approval and approval by anyone who edited the case (403), even a reviewer author', () => {
    const reviewerAuthor = { userId: 'u-ra', role: 'reviewer' as const };
    const own = decideReview('approve', reviewerAuthor, situation('in_review', { authorId: 'u-ra', editorIds: ['u-ra'] }));
    expect(own).toMatchObject({ ok: false, reason: 'own_work', status: 403 });
    expect(decideReview('approve', PEOPLE.editingReviewer!, situation('in_review'))).toMatchObject({ ok: false, reason: 'own_work' });
    expect(decideReview('return', PEOPLE.editingReviewer!, situation('in_review'), { reason: 'x' })).toMatchObject({ ok: false, reason: 'own_work' });
  });

  it('lets only reviewers approve or return: engineers and admins get 403', () => {
    for (const who of ['colleague', 'admin'] as const) {
      expect(decideReview('approve', PEOPLE[who]!, situation('in_review'))).toMatchObject({ ok: false, reason: 'not_reviewer', status: 403 });
    }
  });

  it('answers 409 when the state moved on (a second approval after publication, a second submit)', () => {
    expect(decideReview('approve', PEOPLE.reviewer2!, situation('published'))).toMatchObject({ ok: false, reason: 'wrong_state', status: 409 });
    const again = decideReview('submit', PEOPLE.author!, situation('in_review'));
    expect(again).toMatchObject({ ok: false, reason: 'wrong_state', status: 409 });
    if (!again.ok) expect(again.message).toMatch(/in review.*draft or returned/);
  });

  it('publishes on the second approval when the firm requires two, and refuses the same reviewer twice', () => {
    const first = decideReview('approve', PEOPLE.reviewer!, situation('in_review', { requiredApprovals: 2 }));
    expect(first).toEqual({ ok: true, to: 'in_review', publishes: false, approverIds: ['u-reviewer'] });
    const twice = decideReview('approve', PEOPLE.reviewer!, situation('in_review', { requiredApprovals: 2, approverIds: ['u-reviewer'] }));
    expect(twice).toMatchObject({ ok: false, reason: 'already_approved', status: 409 });
    const second = decideReview('approve', PEOPLE.reviewer2!, situation('in_review', { requiredApprovals: 2, approverIds: ['u-reviewer'] }));
    expect(second).toEqual({ ok: true, to: 'published', publishes: true, approverIds: ['u-reviewer', 'u-reviewer2'] });
  });

  it('keeps a review to the reviewers the author asked for, when they asked', () => {
    const asked = situation('in_review', { requestedReviewerIds: ['u-reviewer'] });
    expect(decideReview('approve', PEOPLE.reviewer2!, asked)).toMatchObject({ ok: false, reason: 'not_requested', status: 403 });
    expect(decideReview('approve', PEOPLE.reviewer!, asked).ok).toBe(true);
  });

  it('refuses to approve while the reviewer’s own comments are open', () => {
    const decision = decideReview('approve', { ...PEOPLE.reviewer!, openComments: 2 }, situation('in_review'));
    expect(decision).toMatchObject({ ok: false, reason: 'open_comments', status: 409 });
    if (!decision.ok) expect(decision.message).toContain('2 open comments');
  });

  it('needs a reason to return or withdraw (422)', () => {
    expect(decideReview('return', PEOPLE.reviewer!, situation('in_review'), { reason: '  ' })).toMatchObject({ ok: false, reason: 'reason_required', status: 422 });
    expect(decideReview('withdraw', PEOPLE.admin!, situation('published'))).toMatchObject({ ok: false, reason: 'reason_required', status: 422 });
  });
});

describe('afterEdit', () => {
  it.each([
    ['draft', { state: 'draft', cancelsApprovals: false }],
    ['returned', { state: 'returned', cancelsApprovals: false }],
    ['in_review', { state: 'in_review', cancelsApprovals: true }],
    ['published', { state: 'draft', cancelsApprovals: false }],
    ['superseded', null],
    ['withdrawn', null],
  ] as const)('an edit of a %s case', (state, expected) => {
    expect(afterEdit(state)).toEqual(expected);
  });
});
