/**
 * The states of a case. Only `draft` is used so far; the review workflow adds the others,
 * which the database already accepts (see src/db/schema/cases.ts). Pure: no imports.
 */
export const CASE_STATES = ['draft', 'in_review', 'returned', 'published', 'superseded', 'withdrawn'] as const;

/** A state of a case. */
export type CaseState = (typeof CASE_STATES)[number];

/** How the product names each state. */
export const CASE_STATE_LABELS: Record<CaseState, string> = {
  draft: 'Draft',
  in_review: 'In review',
  returned: 'Returned',
  published: 'Published',
  superseded: 'Superseded',
  withdrawn: 'Withdrawn',
};
