import type { SaveCaseResult } from './save';

type Failure = Extract<SaveCaseResult, { ok: false }>['reason'];

/** HTTP status and wording for each refused case change; shared by pages and API. */
export const CASE_FAILURES: Record<Failure, { status: number; code: string; message: string }> = {
  not_found: { status: 404, code: 'not_found', message: 'That case was not found.' },
  forbidden: {
    status: 403,
    code: 'forbidden',
    message: 'Only the author edits a case; a reviewer says what to change in a comment or by returning it.',
  },
  not_editable: {
    status: 409,
    code: 'not_editable',
    message: 'This case has been withdrawn and is no longer edited. Start a new case from it instead.',
  },
  conflict: {
    status: 409,
    code: 'conflict',
    message:
      'This case was saved again after you opened it. Compare your text with the latest revision, then save on top of it.',
  },
};
