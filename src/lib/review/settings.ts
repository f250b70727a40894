/** A firm's review rules: how many approvals publish a case (1 unless the firm asked for 2). */
import { eq } from 'drizzle-orm';
import type { Database, Queryable } from '../../db/client';
import { firmReviewSetting } from '../../db/schema';
import { recordAudit } from '../audit';

/** Approvals that publish a case in the firm. */
export async function requiredApprovalsOf(database: Queryable, firmId: string): Promise<number> {
  const [setting] = await database.select({ n: firmReviewSetting.requiredApprovals }).from(firmReviewSetting).where(eq(firmReviewSetting.firmId, firmId));
  return setting?.n ?? 1;
}

/** Sets the firm's approvals per publication (1 or 2) and records it; returns whether it changed. */
export async function setRequiredApprovals(database: Database, input: { firmId: string; actorUserId: string; requiredApprovals: 1 | 2 }): Promise<boolean> {
  return database.transaction(async (tx) => {
    const before = await requiredApprovalsOf(tx, input.firmId);
    if (before === input.requiredApprovals) return false;
    await tx
      .insert(firmReviewSetting)
      .values({ firmId: input.firmId, requiredApprovals: input.requiredApprovals })
      .onConflictDoUpdate({ target: firmReviewSetting.firmId, set: { requiredApprovals: input.requiredApprovals, updatedAt: new Date() } });
    await recordAudit(tx, {
      firmId: input.firmId,
      actorUserId: input.actorUserId,
      action: 'firm.review_setting_changed',
      targetType: 'firm',
      targetId: input.firmId,
      details: { from: before, to: input.requiredApprovals },
    });
    return true;
  });
}
