/** Which attachments a revision sees: `added_in_revision <= n < removed_in_revision`. */
import { and, gt, isNull, lte, or } from 'drizzle-orm';
import { attachment } from '../../db/schema';

/** The condition of the attachments revision `revision` sees. */
export function visibleIn(revision: number) {
  return and(lte(attachment.addedInRevision, revision), or(isNull(attachment.removedInRevision), gt(attachment.removedInRevision, revision)));
}
