/** Why an attachment change was refused; the route maps each to a status and words. */
export type AttachmentFailure = 'not_found' | 'attachment_not_found' | 'not_author' | 'not_editable' | 'too_many' | 'already_removed';

/** HTTP status and wording for each refusal; shared by the API and the editor. */
export const ATTACHMENT_FAILURES: Record<AttachmentFailure, { status: number; code: string; message: string }> = {
  not_found: { status: 404, code: 'not_found', message: 'That case was not found.' },
  attachment_not_found: { status: 404, code: 'not_found', message: 'That attachment was not found.' },
  not_author: { status: 403, code: 'not_author', message: 'Only the author of a case adds or removes its files.' },
  not_editable: {
    status: 409,
    code: 'not_editable',
    message: 'The files of this case cannot change now: in review they are what the reviewers check, and a withdrawn or superseded case is no longer edited.',
  },
  too_many: { status: 409, code: 'too_many_files', message: 'This case already has as many files as it may carry (50). Remove one first.' },
  already_removed: { status: 409, code: 'already_removed', message: 'That file was already removed from the case.' },
};
