/**
 * The attached files a revision's blocks read (`rating = file "river-rating.csv"`), loaded
 * for `evaluateCase`: every file's name, and the text of the CSV files wanted. Whatever
 * evaluates a revision (a save, a recalculation after a file change, an approval, the
 * reading page, the sheet, a drift check) loads them here, so all of them agree.
 */
import { and, asc, eq } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { attachment } from '../../db/schema';
import { evaluateCase, filesNamedIn, matchFileName, NO_FILES, type BlockFiles, type CaseEvaluation } from '../calc';
import { fileStore, type FileStore } from '../storage';
import { formatBytes } from './limits';
import { visibleIn } from './visibility';

/** The largest CSV a block reads (a rating is a few hundred rows; this is thousands). */
export const MAX_BLOCK_FILE_BYTES = 2 * 1024 * 1024;
/** The most CSV text loaded for one revision (the editor preview loads every CSV). */
export const MAX_BLOCK_FILES_BYTES = 8 * 1024 * 1024;

const decoder = new TextDecoder('utf-8', { fatal: false });

/**
 * The files revision `revision` of the firm's case shows, with the text of the CSVs named in
 * `wanted` (`'all'`: every CSV, for the editor). Returns {@link NO_FILES} without a query
 * when nothing is wanted.
 */
export async function loadBlockFiles(
  database: Pick<Queryable, 'select'>,
  input: { firmId: string; caseId: string; revision: number; wanted: readonly string[] | 'all' },
  store: FileStore = fileStore(),
): Promise<BlockFiles> {
  if (input.wanted !== 'all' && input.wanted.length === 0) return NO_FILES;
  const rows = await database
    .select({ fileName: attachment.fileName, contentType: attachment.contentType, size: attachment.size, storageKey: attachment.storageKey })
    .from(attachment)
    .where(and(eq(attachment.firmId, input.firmId), eq(attachment.caseId, input.caseId), visibleIn(input.revision)))
    // The newest of two files with one name is the one a block reads.
    .orderBy(asc(attachment.createdAt), asc(attachment.id));
  const byName = new Map(rows.map((r) => [r.fileName, r]));
  const names = [...byName.keys()];
  const wanted = input.wanted === 'all' ? names.filter((n) => byName.get(n)!.contentType === 'text/csv') : input.wanted.map((w) => matchFileName(w, names)).filter((n): n is string => n !== undefined);
  const texts: Record<string, string> = {};
  const unreadable: Record<string, string> = {};
  let total = 0;
  for (const name of new Set(wanted)) {
    const row = byName.get(name)!;
    if (row.contentType !== 'text/csv') continue; // readBlockFile says it is not a CSV
    if (row.size > MAX_BLOCK_FILE_BYTES) {
      unreadable[name] = `it is ${formatBytes(row.size)}, and a table file may be at most ${formatBytes(MAX_BLOCK_FILE_BYTES)}.`;
      continue;
    }
    if (total + row.size > MAX_BLOCK_FILES_BYTES) {
      unreadable[name] = `the CSV files of this revision together pass ${formatBytes(MAX_BLOCK_FILES_BYTES)}; name fewer of them.`;
      continue;
    }
    const bytes = await store.get(row.storageKey);
    if (!bytes) {
      unreadable[name] = 'its stored copy is missing; attach it again.';
      continue;
    }
    total += row.size;
    texts[name] = decoder.decode(bytes);
  }
  return { names, texts, ...(Object.keys(unreadable).length ? { unreadable } : {}) };
}

/** Evaluates `body` as revision `revision` of the firm's case, with the files it names. */
export async function evaluateRevision(
  database: Pick<Queryable, 'select'>,
  input: { firmId: string; caseId: string; revision: number; body: string },
  store?: FileStore,
): Promise<CaseEvaluation> {
  const wanted = filesNamedIn(input.body);
  const files = wanted.length ? await loadBlockFiles(database, { ...input, wanted }, store) : NO_FILES;
  return evaluateCase(input.body, files);
}
