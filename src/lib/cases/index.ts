// The browser imports ./validation, ./states, ./diff, ./slug and ./keyFigures directly:
// this barrel also carries the services, which need the database.
export { CASE_FAILURES } from './messages';
export { CASE_STATE_LABELS, CASE_STATES, type CaseState } from './states';
export {
  CASE_SORTS,
  CaseMetadataPatchSchema,
  CaseMetadataSchema,
  CreateCaseSchema,
  DiffQuerySchema,
  ListCasesQuerySchema,
  MAX_BODY_LENGTH,
  MAX_TAGS,
  SaveCaseSchema,
  SECTION_SHAPE_LABELS,
  SECTION_SHAPES,
  STRUCTURE_TYPE_LABELS,
  STRUCTURE_TYPES,
  type CaseMetadata,
  type CaseMetadataPatch,
  type CaseSectionShape,
  type CreateCaseRequest,
  type ListCasesQuery,
  type SaveCaseRequest,
  type StructureType,
} from './validation';
export { formatRange, keyFigures, NO_KEY_FIGURES, type KeyFigures } from './keyFigures';
export { MAX_SLUG_LENGTH, nextFreeSlug, slugify } from './slug';
export { diffRevisions, type DiffHunk, type DiffLine, type DiffOptions, type TextDiff } from './diff';
export { createCase, type NewCase } from './create';
export { saveCase, type CaseSave, type SaveCaseResult } from './save';
export { getCase, listCases, type CaseList, type ListCasesOptions } from './queries';
export { lockCase } from './rows';
export { revisionBody, writeRecalculatedRevision } from './recalculate';
export { getCaseReading, READING_HISTORY_LENGTH, type CaseReading, type HistoryEntry } from './reading';
export { diffCaseRevisions, getRevision, listRevisions, type RevisionDiff, type RevisionDiffResult } from './revisions';
export type { CaseDetail, CaseRevisionDetail, CaseSummary, LatestRevisionInfo, RevisionSummary } from './types';
