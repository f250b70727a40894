import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { diffRevisions, type TextDiff } from '../../../src/lib/cases/diff';

const lines = (n: number, prefix = 'line') => Array.from({ length: n }, (_, i) => `${prefix} ${i + 1}`).join('\n') + '\n';

/** Rebuilds both texts from a diff's lines (with context = Infinity every line is in a hunk). */
function sides(diff: TextDiff) {
  const all = diff.hunks.flatMap((h) => h.lines);
  return {
    old: all.filter((l) => l.kind !== 'added').map((l) => l.text),
    new: all.filter((l) => l.kind !== 'removed').map((l) => l.text),
  };
}

describe('diffRevisions(a, b)', () => {
  it('gives no hunks for identical texts, and counts their lines', () => {
    expect(diffRevisions('a\nb\n', 'a\nb\n')).toEqual({ hunks: [], added: 0, removed: 0, unchanged: 2 });
  });

  it('gives nothing at all for two empty texts', () => {
    expect(diffRevisions('', '')).toEqual({ hunks: [], added: 0, removed: 0, unchanged: 0 });
  });

  it('treats \\r\\n like \\n and a missing final line break as no change', () => {
    expect(diffRevisions('a\r\nb', 'a\nb\n').hunks).toEqual([]);
  });

  it('never throws for input that is not a string', () => {
    expect(diffRevisions(undefined as unknown as string, 'a').added).toBe(1);
  });

  it('numbers the lines of a change on both sides, with three lines of context', () => {
    const diff = diffRevisions(lines(10), lines(10).replace('line 5\n', 'line five\n'));
    expect(diff).toMatchObject({ added: 1, removed: 1, unchanged: 9 });
    expect(diff.hunks).toHaveLength(1);
    const [hunk] = diff.hunks;
    expect(hunk).toMatchObject({ oldStart: 2, oldLines: 7, newStart: 2, newLines: 7 });
    expect(hunk!.lines.map((l) => [l.kind, l.oldNumber, l.newNumber, l.text])).toEqual([
      ['same', 2, 2, 'line 2'],
      ['same', 3, 3, 'line 3'],
      ['same', 4, 4, 'line 4'],
      ['removed', 5, null, 'line 5'],
      ['added', null, 5, 'line five'],
      ['same', 6, 6, 'line 6'],
      ['same', 7, 7, 'line 7'],
      ['same', 8, 8, 'line 8'],
    ]);
  });

  it('splits changes far apart into separate hunks and merges close ones', () => {
    const far = lines(30).replace('line 2\n', 'x\n').replace('line 28\n', 'y\n');
    expect(diffRevisions(lines(30), far).hunks).toHaveLength(2);
    const near = lines(30).replace('line 10\n', 'x\n').replace('line 15\n', 'y\n');
    expect(diffRevisions(lines(30), near).hunks).toHaveLength(1);
  });

  it('places a pure insertion after the old line before it, as unified diffs do', () => {
    const [hunk] = diffRevisions('a\nb\n', 'a\nnew\nb\n', { context: 0 }).hunks;
    expect(hunk).toEqual({ oldStart: 1, oldLines: 0, newStart: 2, newLines: 1, lines: [{ kind: 'added', oldNumber: null, newNumber: 2, text: 'new' }] });
  });

  it('shows a deletion of everything and a first body', () => {
    expect(diffRevisions('', 'a\nb\n')).toMatchObject({ added: 2, removed: 0, hunks: [{ oldStart: 0, oldLines: 0, newStart: 1, newLines: 2 }] });
    expect(diffRevisions('a\nb\n', '')).toMatchObject({ added: 0, removed: 2, hunks: [{ oldStart: 1, oldLines: 2, newStart: 0, newLines: 0 }] });
  });

  it('is plain JSON', () => {
    const diff = diffRevisions(lines(5), lines(6));
    expect(JSON.parse(JSON.stringify(diff))).toEqual(diff);
  });

  it('shows two unrelated long texts as replaced without hanging', () => {
    const a = lines(5_000, 'old');
    const b = lines(5_000, 'new');
    const diff = diffRevisions(a, b);
    expect(diff).toMatchObject({ added: 5_000, removed: 5_000, unchanged: 0 });
  });

  it('always rebuilds both texts from the whole diff', () => {
    // The lines of a text: split at line breaks, a final break ending the last line.
    const linesOfText = (text: string) => (text === '' ? [] : text.replace(/\n$/, '').split('\n'));
    const text = fc.array(fc.constantFrom('a', 'b', 'c', '', '```jump', 'Q = 85 m3/s'), { maxLength: 30 }).map((l) => l.join('\n'));
    fc.assert(
      fc.property(text, text, (a, b) => {
        const diff = diffRevisions(a, b, { context: Infinity });
        const rebuilt = sides(diff);
        expect(rebuilt.old).toEqual(linesOfText(a));
        expect(rebuilt.new).toEqual(linesOfText(b));
        expect(diff.added + diff.unchanged).toBe(rebuilt.new.length);
        expect(diff.removed + diff.unchanged).toBe(rebuilt.old.length);
      }),
    );
  });
});
