import type { SaveCaseResult } from './save';

type Failure = Extract<SaveCaseResult, { ok: false }>['reason'];

/** HTTP status and wording for each refused case change; shared by pages and API. */
export const CASE_FAILURES: Record<Failure, { status: number; code: string; message: string }> = {
  not_found: { status: 404, code: 'not_found', message: 'That case was not found.' },
  forbidden: {
    status: 403,
    code: 'forbidden',
    message: 'Only the author can edit this case: for now a case is a draft owned by its author.',
  },
  not_editable: {
    status: 409,
    code: 'not_editable',
    message: 'Only a draft can be edited, and this case is no longer a draft.',
  },
  conflict: {
    status: 409,
    code: 'conflict',
    message:
      'This case was saved again after you opened it. Compare your text with the latest revision, then save on top of it.',
  },
};
