/**
 * Queueing a search update: one `search_outbox` row, written in the transaction of the
 * change that makes it (see src/db/schema/search.ts). The worker does the rest.
 */
import type { Queryable } from '../../db/client';
import { searchOutbox } from '../../db/schema';

/** Why a case's search document is to be rebuilt or removed. */
export type SearchUpdateReason = 'published' | 'superseded' | 'withdrawn' | 'edited';

/** Queues a rebuild of `caseId`'s search document inside `tx`. */
export async function queueSearchUpdate(tx: Queryable, update: { firmId: string; caseId: string; reason: SearchUpdateReason }): Promise<void> {
  await tx.insert(searchOutbox).values(update);
}
