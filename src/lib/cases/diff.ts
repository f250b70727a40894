/**
 * Line differences between two revisions of a case body, as plain JSON for the history view.
 * Pure (jsdiff's `diffLines`, Myers' O(ND) algorithm), so the browser can use it too.
 */
import { diffLines } from 'diff';

/** One line of a difference. */
export interface DiffLine {
  kind: 'added' | 'removed' | 'same';
  /** Line number in the older text, from 1; null for an added line. */
  oldNumber: number | null;
  /** Line number in the newer text, from 1; null for a removed line. */
  newNumber: number | null;
  /** The line without its line break. */
  text: string;
}

/** A run of changed lines with up to `context` unchanged lines around it. */
export interface DiffHunk {
  /** First line of the hunk in the older text (from 1; the line before it when it has none). */
  oldStart: number;
  oldLines: number;
  newStart: number;
  newLines: number;
  lines: DiffLine[];
}

/** The difference between two texts. */
export interface TextDiff {
  hunks: DiffHunk[];
  /** Lines only in the newer text. */
  added: number;
  /** Lines only in the older text. */
  removed: number;
  /** Lines in both. */
  unchanged: number;
}

/** Options of {@link diffRevisions}. */
export interface DiffOptions {
  /** Unchanged lines kept around each change (3 by default; `Infinity` for the whole text). */
  context?: number;
}

// Beyond this many edits the texts are simply shown as replaced: Myers' algorithm is
// O((N+M)·D) and two unrelated 200,000-character bodies should not hold up a request.
const MAX_EDIT_LENGTH = 4000;

function linesOf(text: string): string[] {
  const normalised = text.replace(/\r\n?/g, '\n');
  if (normalised === '') return [];
  const lines = normalised.split('\n');
  if (normalised.endsWith('\n')) lines.pop();
  return lines;
}

// Every text ends with a line break here, so a missing break at the end is not a change.
const withFinalBreak = (lines: string[]) => (lines.length ? `${lines.join('\n')}\n` : '');

function allLines(a: string[], b: string[]): DiffLine[] {
  const changes = diffLines(withFinalBreak(a), withFinalBreak(b), { maxEditLength: MAX_EDIT_LENGTH });
  const out: DiffLine[] = [];
  let oldNumber = 0;
  let newNumber = 0;
  const push = (kind: DiffLine['kind'], text: string) => {
    if (kind !== 'added') oldNumber += 1;
    if (kind !== 'removed') newNumber += 1;
    out.push({ kind, oldNumber: kind === 'added' ? null : oldNumber, newNumber: kind === 'removed' ? null : newNumber, text });
  };
  if (!changes) {
    a.forEach((text) => push('removed', text));
    b.forEach((text) => push('added', text));
    return out;
  }
  for (const change of changes) {
    const kind = change.added ? 'added' : change.removed ? 'removed' : 'same';
    for (const text of linesOf(change.value)) push(kind, text);
  }
  return out;
}

// `oldBefore`/`newBefore`: lines of each text before the hunk. An empty side starts at the
// line before it, as unified diffs write it (`@@ -4,0 +5,2 @@`).
function hunkOf(lines: DiffLine[], oldBefore: number, newBefore: number): DiffHunk {
  const oldLines = lines.filter((l) => l.kind !== 'added').length;
  const newLines = lines.filter((l) => l.kind !== 'removed').length;
  return {
    oldStart: oldLines ? oldBefore + 1 : oldBefore,
    oldLines,
    newStart: newLines ? newBefore + 1 : newBefore,
    newLines,
    lines,
  };
}

/**
 * The line-by-line difference from text `a` (older) to text `b` (newer), in hunks with
 * `context` unchanged lines around each change, plus counts. Line breaks `\r\n` and `\n`
 * are the same; identical texts give no hunks.
 */
export function diffRevisions(a: string, b: string, options: DiffOptions = {}): TextDiff {
  const context = Math.max(0, options.context ?? 3);
  const lines = allLines(linesOf(String(a ?? '')), linesOf(String(b ?? '')));
  const added = lines.filter((l) => l.kind === 'added').length;
  const removed = lines.filter((l) => l.kind === 'removed').length;
  const unchanged = lines.length - added - removed;

  // Keep each changed line and the unchanged lines within `context` of one.
  const keep = new Array<boolean>(lines.length).fill(false);
  let lastChange = -Infinity;
  lines.forEach((line, i) => {
    if (line.kind !== 'same') lastChange = i;
    if (i - lastChange <= context) keep[i] = true;
  });
  let nextChange = Infinity;
  for (let i = lines.length - 1; i >= 0; i -= 1) {
    if (lines[i]!.kind !== 'same') nextChange = i;
    if (nextChange - i <= context) keep[i] = true;
  }

  const hunks: DiffHunk[] = [];
  let current: DiffLine[] = [];
  let oldSeen = 0;
  let newSeen = 0;
  let start = { old: 0, new: 0 };
  lines.forEach((line, i) => {
    if (keep[i]) {
      if (!current.length) start = { old: oldSeen, new: newSeen };
      current.push(line);
    } else if (current.length) {
      hunks.push(hunkOf(current, start.old, start.new));
      current = [];
    }
    if (line.kind !== 'added') oldSeen += 1;
    if (line.kind !== 'removed') newSeen += 1;
  });
  if (current.length) hunks.push(hunkOf(current, start.old, start.new));
  return { hunks, added, removed, unchanged };
}
