import { describe, expect, it } from 'vitest';
import { actionInWords, summariseDetails } from '../../../src/lib/audit/labels';

describe('actionInWords(action)', () => {
  it('names known actions and words unknown ones', () => {
    expect(actionInWords('case.submitted')).toBe('Submitted for review');
    expect(actionInWords('member.role_changed')).toBe('Role changed');
    expect(actionInWords('invitation.sent')).toBe('Invitation sent');
  });
});

describe('summariseDetails(action, details)', () => {
  it('reads a role change as from → to', () => {
    expect(summariseDetails('member.role_changed', { userId: 'u1', from: 'engineer', to: 'reviewer' })).toBe('Engineer → Reviewer');
  });

  it('reads an approval with revision, solver and count', () => {
    expect(summariseDetails('case.approved', { revision: 3, solverVersion: '1.4.0', approvals: 1, requiredApprovals: 2 })).toBe('revision 3 · solver 1.4.0 · approval 1 of 2');
  });

  it('quotes reasons, counts reviewers asked and hides ids', () => {
    expect(summariseDetails('case.withdrawn', { revision: 2, reason: 'New survey' })).toBe('revision 2 · reason “New survey”');
    expect(summariseDetails('case.submitted', { revision: 1, reviewerIds: ['a', 'b'] })).toBe('2 reviewers asked · revision 1');
    expect(summariseDetails('member.added', { userId: 'u', email: 'x@y.example', role: 'admin', existingAccount: false })).toBe('as Firm admin · e-mail x@y.example');
  });

  it('stays short and copes with nothing', () => {
    expect(summariseDetails('case.saved', null)).toBe('');
    expect(summariseDetails('case.saved', { reason: 'x'.repeat(500), comments: 'y'.repeat(500), other: 'z'.repeat(500) }).length).toBeLessThanOrEqual(200);
  });
});
