import { describe, expect, it } from 'vitest';
import { DESIGN_AID_CAUTION } from '../../../src/lib/caution';
import {
  approvalsCancelledMessage,
  casePublishedMessage,
  caseWithdrawnMessage,
  commentMentionMessage,
  invitationMessage,
  listNames,
  passwordResetMessage,
  reviewApprovedMessage,
  reviewRequestedMessage,
  reviewReturnedMessage,
} from '../../../src/lib/mail/messages';
import type { MailMessage } from '../../../src/lib/mail/outbox';

const facts = {
  firmName: 'Kestrel Weir Consulting',
  caseTitle: 'Stilling basin below the Arden chute',
  caseUrl: 'http://127.0.0.1:4321/cases/abc-123',
  revision: 4,
};

const caseMessages: Array<[string, MailMessage, boolean]> = [
  ['review requested', reviewRequestedMessage({ ...facts, authorName: 'Tomas Ilvar', reviewerNames: ['Helena Brandt', 'Josef Warrick'] }), true],
  ['returned', reviewReturnedMessage({ ...facts, reviewerName: 'Helena Brandt', comments: 'Check the tailwater rating at Q = 85 m3/s.' }), false],
  ['approved', reviewApprovedMessage({ ...facts, reviewerName: 'Helena Brandt', approvals: 1, requiredApprovals: 2 }), true],
  ['published', casePublishedMessage({ ...facts, reviewerNames: ['Helena Brandt'] }), true],
  ['approvals cancelled', approvalsCancelledMessage({ ...facts, editorName: 'Tomas Ilvar' }), true],
  ['withdrawn', caseWithdrawnMessage({ ...facts, actorName: 'Maren Castell', reason: 'Superseded by the 2031 survey.' }), false],
  ['mention', commentMentionMessage({ ...facts, commenterName: 'Helena Brandt', excerpt: '@Tomas is y2 right here?', blockTitle: 'basin' }), false],
];

describe('case messages', () => {
  it.each(caseMessages)('%s: firm name, case title, revision and the link in both bodies', (_name, message) => {
    for (const body of [message.text, message.html]) {
      expect(body).toContain('Kestrel Weir Consulting');
      expect(body).toContain(facts.caseUrl);
    }
    expect(message.subject).toContain(facts.caseTitle);
    expect(message.subject).toContain('rev. 4');
    expect(message.html).toContain(`href="${facts.caseUrl}"`);
    expect(message.subject).not.toMatch(/[\r\n]/);
  });

  it.each(caseMessages)('%s: carries the design-aid caution only where results are concerned', (_name, message, caution) => {
    expect(message.text.includes(DESIGN_AID_CAUTION)).toBe(caution);
    expect(message.html.includes(DESIGN_AID_CAUTION)).toBe(caution);
  });

  it('names the requested reviewers, or says the firm pool when none are named', () => {
    expect(reviewRequestedMessage({ ...facts, authorName: 'Tomas Ilvar', reviewerNames: ['Helena Brandt', 'Josef Warrick'] }).text).toContain('Helena Brandt and Josef Warrick');
    expect(reviewRequestedMessage({ ...facts, authorName: 'Tomas Ilvar' }).text).toContain("firm's reviewers");
  });

  it('quotes the return comments line by line in the text body', () => {
    const m = reviewReturnedMessage({ ...facts, reviewerName: 'Helena Brandt', comments: 'Line one\nLine two' });
    expect(m.text).toContain('> Line one\n> Line two');
    expect(m.html).toContain('Line one<br>Line two');
  });

  it('counts the approvals still needed', () => {
    expect(reviewApprovedMessage({ ...facts, reviewerName: 'H', approvals: 1, requiredApprovals: 2 }).text).toContain('one more is needed');
    expect(reviewApprovedMessage({ ...facts, reviewerName: 'H', approvals: 1, requiredApprovals: 3 }).text).toContain('2 more are needed');
  });
});

describe('escaping', () => {
  const hostile = {
    firmName: 'Weir & <Sons>',
    caseTitle: '<script>alert("x")</script> basin',
    caseUrl: 'http://127.0.0.1:4321/cases/a?x=1&y="2"',
    revision: 1,
  };
  const m = commentMentionMessage({ ...hostile, commenterName: '<b>Eve</b>', excerpt: "it's <img src=x onerror=alert(1)>", blockTitle: '"jump"' });

  it('escapes every value in the HTML body', () => {
    expect(m.html).not.toContain('<script>');
    expect(m.html).not.toContain('<img');
    expect(m.html).not.toContain('<b>Eve');
    expect(m.html).toContain('Weir &#38; &#60;Sons&#62;');
    expect(m.html).toContain('&#60;script&#62;');
    expect(m.html).toContain('href="http://127.0.0.1:4321/cases/a?x=1&#38;y=%222%22"');
  });

  it('keeps the plain-text body as written', () => {
    expect(m.text).toContain('<script>alert("x")</script> basin');
    expect(m.text).toContain("it's <img src=x onerror=alert(1)>");
  });

  it('never makes a javascript: URL a link', () => {
    const evil = reviewRequestedMessage({ ...facts, caseUrl: 'javascript:alert(1)', authorName: 'A' });
    expect(evil.html).not.toContain('href="javascript:');
  });

  it('collapses line breaks in subjects', () => {
    expect(reviewRequestedMessage({ ...facts, caseTitle: 'Two\r\nBcc: x@y.example', authorName: 'A' }).subject).toBe('Review requested: Two Bcc: x@y.example (rev. 4)');
  });
});

describe('account and firm messages', () => {
  it('invitation: firm, inviter, role, expiry and the accept link in both bodies', () => {
    const m = invitationMessage({
      firmName: 'Brightwater Ridge Engineers',
      inviterName: 'Rowan Fairlie',
      roleLabel: 'Reviewer',
      acceptUrl: 'http://127.0.0.1:4321/invitations/tok',
      expiresAt: new Date('2031-03-05T12:00:00Z'),
    });
    for (const body of [m.text, m.html]) {
      expect(body).toContain('Brightwater Ridge Engineers');
      expect(body).toContain('Rowan Fairlie');
      expect(body).toContain('Reviewer');
      expect(body).toContain('http://127.0.0.1:4321/invitations/tok');
      expect(body).toContain('5 March 2031');
    }
  });

  it('password reset: greeting, expiry and the link in both bodies', () => {
    const m = passwordResetMessage({ name: 'Ada Quillon', resetUrl: 'http://127.0.0.1:4321/reset-password?token=t0k', expiresInMinutes: 60 });
    expect(m.subject).toBe('Reset your Sequent password');
    for (const body of [m.text, m.html]) {
      expect(body).toContain('Ada Quillon');
      expect(body).toContain('60 minutes');
      expect(body).toContain('http://127.0.0.1:4321/reset-password?token=t0k');
    }
  });
});

describe('listNames(names)', () => {
  it.each([
    [[], ''],
    [['A'], 'A'],
    [['A', 'B'], 'A and B'],
    [['A', 'B', 'C'], 'A, B and C'],
    [[' A ', '', 'B'], 'A and B'],
  ])('%j → %s', (names, expected) => {
    expect(listNames(names)).toBe(expected);
  });
});
