/**
 * Everything a calculation sheet or an export of one case needs from the database: the
 * case (as the reading page reads it), the chosen revision, its sign-off and its files.
 */
import type { Database } from '../../db/client';
import { attachmentsOfRevision, type AttachmentView } from '../attachments';
import { loadBlockFiles } from '../attachments/blockFiles';
import { filesNamedIn, type BlockFiles } from '../calc';
import { getCaseReading, getRevision, type CaseReading } from '../cases';
import { chooseRevision } from './choose';
import { getSheetSignoff, type SheetSignoff } from './signoff';

/** The revision a sheet shows. */
export interface SheetRevision {
  number: number;
  body: string;
  authorName: string;
  createdAt: Date;
  /** The solver the revision was saved with. */
  solverVersion: string;
}

/** A case with the revision its sheet shows. */
export interface SheetCase {
  case: CaseReading;
  revision: SheetRevision;
  signoff: SheetSignoff;
  /** The files the revision shows, oldest first (as the reading page lists them). */
  attachments: AttachmentView[];
}

/** Who asks: decides the default revision as on the reading page. */
export interface SheetViewer {
  userId: string;
  /** May review cases (role permission `case.review`). */
  mayReview: boolean;
}

/**
 * The firm's case `caseId` with revision `asked` (`published`, `latest`, a number, or null
 * for what the viewer would read), or null when the case (of this firm) or that revision
 * does not exist.
 */
export async function getSheetCase(database: Database, firmId: string, caseId: string, viewer: SheetViewer, asked: string | null): Promise<SheetCase | null> {
  const found = await getCaseReading(database, firmId, caseId);
  if (!found) return null;
  const number = chooseRevision({ ...found, isAuthor: found.authorId === viewer.userId, isReviewer: viewer.mayReview }, asked);
  if (number === null) return null;
  let revision: SheetRevision;
  if (number === found.latestRevision) revision = { ...found.revision };
  else {
    const other = await getRevision(database, firmId, found.id, number);
    if (!other) return null;
    revision = { number, body: other.body, authorName: other.authorName, createdAt: other.createdAt, solverVersion: other.solverVersion };
  }
  const [signoff, attachments] = await Promise.all([
    getSheetSignoff(database, firmId, found.id, number),
    attachmentsOfRevision(database, firmId, found.id, number),
  ]);
  return { case: found, revision, signoff, attachments };
}

/** Loads the attached files the sheet's revision's blocks read (for `sheetBody`). */
export function sheetFilesLoader(database: Database, firmId: string, sheet: SheetCase): () => Promise<BlockFiles> {
  const { case: found, revision } = sheet;
  return () => loadBlockFiles(database, { firmId, caseId: found.id, revision: revision.number, wanted: filesNamedIn(revision.body) });
}
