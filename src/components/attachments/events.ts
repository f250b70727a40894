/**
 * The page event the Files panel sends when the case's files change (an upload or a
 * removal), so the editor can reload the CSV files its preview's blocks read.
 */
export const ATTACHMENTS_CHANGED = 'sequent:attachments-changed';

/** Tells the page that the files of `caseId` changed. */
export function announceAttachmentsChanged(caseId: string): void {
  window.dispatchEvent(new CustomEvent(ATTACHMENTS_CHANGED, { detail: { caseId } }));
}
