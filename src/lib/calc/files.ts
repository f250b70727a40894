/**
 * The attached files a case's blocks may read (`rating = file "river-rating.csv"`): the
 * names of every file of the revision, and the text of the CSV files blocks name. Plain
 * data, so the server, the editor preview and a what-if panel evaluate a body the same way.
 * Loading the bytes is the caller's business (see `src/lib/attachments/blockFiles.ts`).
 */
import { extractBlocks } from './extractBlocks';
import { parseBlock } from './parseBlock';
import { closest } from './resolveInputs';

/** The files of one revision, as blocks see them. */
export interface BlockFiles {
  /** Every file attached to the revision, by name (for "did you mean"). */
  readonly names: readonly string[];
  /** The text of each CSV file a block names, by its name as attached. */
  readonly texts: Readonly<Record<string, string>>;
  /** Files a block names that cannot be read as a table, with the reason. */
  readonly unreadable?: Readonly<Record<string, string>>;
}

/** No attached files (a new case, a preview with nothing loaded). */
export const NO_FILES: BlockFiles = { names: [], texts: {} };

/** What a block gets for `file "name"`: the file's text, or why not. */
export type FileRead = { ok: true; fileName: string; text: string } | { ok: false; message: string; hint?: string };

/** Every file name the blocks of `markdown` name, once each, in order. Never throws. */
export function filesNamedIn(markdown: string): string[] {
  if (typeof markdown !== 'string' || !/\bfile\s/i.test(markdown)) return [];
  const names = new Set<string>();
  for (const raw of extractBlocks(markdown)) {
    for (const a of parseBlock(raw).assignments) if (a.value.type === 'file') names.add(a.value.name);
  }
  return [...names];
}

/** The attached name `asked` means: exact, else the one name equal to it without case. */
export function matchFileName(asked: string, names: readonly string[]): string | undefined {
  if (names.includes(asked)) return asked;
  const folded = names.filter((n) => n.toLowerCase() === asked.toLowerCase());
  return folded.length === 1 ? folded[0] : undefined;
}

/** Reads `file "asked"` from `files`, with a message naming the files there are. */
export function readBlockFile(files: BlockFiles, asked: string): FileRead {
  const name = matchFileName(asked, files.names);
  if (name === undefined) {
    const csvs = files.names.filter((n) => /\.csv$/i.test(n));
    const guess = closest(asked, files.names);
    return {
      ok: false,
      message: files.names.length
        ? `No file named "${asked}" is attached to this revision.${csvs.length ? ` CSV files attached: ${csvs.join(', ')}.` : ' None of its files is a CSV.'}`
        : `No file named "${asked}" is attached to this revision: attach the CSV in the Files panel first.`,
      ...(guess ? { hint: `rating = file "${guess}"` } : {}),
    };
  }
  const why = files.unreadable?.[name];
  if (why !== undefined) return { ok: false, message: `"${name}" cannot be read as a table: ${why}` };
  const text = files.texts[name];
  if (text === undefined) {
    return /\.csv$/i.test(name)
      ? { ok: false, message: `"${name}" has not been loaded yet.` }
      : { ok: false, message: `"${name}" is not a CSV file; a rating is read from a CSV file (discharge and depth or stage, with units in the header).` };
  }
  return { ok: true, fileName: name, text };
}
