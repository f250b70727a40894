import type { Queryable } from '../../db/client';
import { auditEvent } from '../../db/schema';

/** Every kind of event the audit trail records. */
export type AuditAction =
  | 'member.added'
  | 'member.role_changed'
  | 'member.invited'
  | 'member.invitation_revoked'
  | 'member.joined'
  | 'firm.created'
  | 'firm.review_setting_changed'
  | 'case.created'
  | 'case.saved'
  | 'case.submitted'
  | 'case.returned'
  | 'case.approved'
  | 'case.approvals_cancelled'
  | 'case.published'
  | 'case.superseded'
  | 'case.withdrawn'
  | 'case.attachment_added'
  | 'case.attachment_captioned'
  | 'case.attachment_removed';

/** One event to append. */
export interface AuditEntry {
  firmId: string;
  actorUserId: string | null;
  action: AuditAction;
  targetType?: string;
  targetId?: string;
  details?: Record<string, unknown>;
}

/**
 * Appends an event to the audit trail. Pass the transaction of the change it records so
 * that the change and its record commit or fail together.
 */
export async function recordAudit(tx: Queryable, entry: AuditEntry): Promise<void> {
  await tx.insert(auditEvent).values({
    firmId: entry.firmId,
    actorUserId: entry.actorUserId,
    action: entry.action,
    targetType: entry.targetType ?? null,
    targetId: entry.targetId ?? null,
    details: entry.details ?? {},
  });
}
