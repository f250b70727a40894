/** The shapes the case services return (plain data; dates are `Date`, JSON gives ISO strings). */
import type { CaseEvaluation } from '../calc';
import type { KeyFigures } from './keyFigures';
import type { CaseState } from './states';

/** A case in a list: metadata, author, and the key figures of its latest revision. */
export interface CaseSummary {
  id: string;
  slug: string;
  title: string;
  structureType: string;
  sectionShape: string;
  projectReference: string | null;
  /** One or two sentences on what the case found; null for none. */
  summary: string | null;
  region: string | null;
  tags: string[];
  state: CaseState;
  authorId: string;
  authorName: string;
  latestRevision: number;
  /** The revision colleagues rely on; null until first published. A new draft leaves it standing. */
  publishedRevision: number | null;
  createdAt: Date;
  updatedAt: Date;
  keyFigures: KeyFigures;
}

/** A revision without its body and results, for the history list. */
export interface RevisionSummary {
  number: number;
  authorId: string;
  authorName: string;
  createdAt: Date;
  solverVersion: string;
  keyFigures: KeyFigures;
}

/** A whole revision: body, key figures, the evaluation stored at save time. */
export interface CaseRevisionDetail extends RevisionSummary {
  body: string;
  results: CaseEvaluation;
}

/** A case with its latest revision. */
export interface CaseDetail extends CaseSummary {
  revision: CaseRevisionDetail;
}

/** What an editor needs to show a save conflict beside its own text. */
export interface LatestRevisionInfo {
  number: number;
  body: string;
  authorName: string;
  createdAt: Date;
}
