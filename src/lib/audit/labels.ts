/**
 * How the audit trail reads to people: each action in words and a one-line summary of an
 * event's details. Pure: used by the audit page (and anything else that shows events).
 */
import type { AuditAction } from './record';

/** Each known action in words. Actions added later fall back to {@link actionInWords}'s rule. */
export const AUDIT_ACTION_LABELS: Record<AuditAction, string> = {
  'firm.created': 'Firm created',
  'member.added': 'Member added',
  'member.role_changed': 'Role changed',
  'member.invited': 'Colleague invited',
  'member.invitation_revoked': 'Invitation revoked',
  'member.joined': 'Joined through an invitation',
  'firm.review_setting_changed': 'Review rule changed',
  'case.created': 'Case created',
  'case.saved': 'Case saved',
  'case.submitted': 'Submitted for review',
  'case.returned': 'Returned to the author',
  'case.approved': 'Approved',
  'case.approvals_cancelled': 'Approvals cancelled by an edit',
  'case.published': 'Published',
  'case.superseded': 'Earlier publication superseded',
  'case.withdrawn': 'Withdrawn',
  'case.attachment_added': 'File attached',
  'case.attachment_captioned': 'File caption changed',
  'case.attachment_removed': 'File removed',
};

/** `case.approved` → "Approved"; an unknown `invitation.sent` → "Invitation sent". */
export function actionInWords(action: string): string {
  const known = (AUDIT_ACTION_LABELS as Record<string, string>)[action];
  if (known) return known;
  const words = action.replace(/[._]+/g, ' ').trim();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

const ROLE_WORDS: Record<string, string> = { engineer: 'Engineer', reviewer: 'Reviewer', admin: 'Firm admin' };
const role = (value: unknown) => ROLE_WORDS[String(value)] ?? String(value);

/** Keys that identify rather than describe (shown in the CSV's JSON, not in the summary). */
// The title is the case's, which the target column already shows.
const HIDDEN = new Set(['userId', 'from', 'to', 'reviewerIds', 'slug', 'title']);

const MAX_SUMMARY = 200;

/** Free text people wrote, shown in quotes. */
const QUOTED = new Set(['reason', 'comments']);

function show(value: unknown, quote: boolean): string | null {
  if (value === null || value === undefined || value === '') return null;
  if (typeof value === 'string') {
    const text = value.length > 80 ? `${value.slice(0, 79)}…` : value;
    return quote ? `“${text}”` : text;
  }
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  if (Array.isArray(value)) return value.length === 0 ? null : value.every((v) => typeof v === 'string') ? value.join(', ') : `${value.length} items`;
  return null;
}

const KEY_WORDS: Record<string, string> = {
  revision: 'revision',
  solverVersion: 'solver',
  reason: 'reason',
  comments: 'comments',
  changedFields: 'changed',
  approvals: 'approvals',
  requiredApprovals: 'of',
  supersededRevision: 'superseded revision',
  email: 'e-mail',
  title: 'title',
};

/**
 * One line for people: `Engineer → Reviewer`, `revision 3 · solver 1.4.0`, `reason “…”`.
 * Never longer than 200 characters; empty when there is nothing worth saying.
 */
export function summariseDetails(action: string, details: Record<string, unknown> | null | undefined): string {
  const d = details ?? {};
  const parts: string[] = [];
  if (action === 'member.role_changed' && d.from !== undefined && d.to !== undefined) parts.push(`${role(d.from)} → ${role(d.to)}`);
  if (action === 'member.added' && d.role !== undefined) parts.push(`as ${role(d.role)}`);
  if (Array.isArray(d.reviewerIds) && d.reviewerIds.length > 0) parts.push(`${d.reviewerIds.length} reviewer${d.reviewerIds.length === 1 ? '' : 's'} asked`);
  for (const [key, value] of Object.entries(d)) {
    if (HIDDEN.has(key) || key === 'role' || key === 'existingAccount' || key === 'revisionCreated') continue;
    const text = show(value, QUOTED.has(key));
    if (text === null) continue;
    if (key === 'approvals' && d.requiredApprovals !== undefined) {
      parts.push(`approval ${text} of ${String(d.requiredApprovals)}`);
      continue;
    }
    if (key === 'requiredApprovals') continue;
    parts.push(`${KEY_WORDS[key] ?? key.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase()} ${text}`);
  }
  const line = parts.join(' · ');
  return line.length > MAX_SUMMARY ? `${line.slice(0, MAX_SUMMARY - 1)}…` : line;
}
