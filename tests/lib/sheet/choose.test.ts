import { describe, expect, it } from 'vitest';
import { chooseRevision, paperOf } from '../../../src/lib/sheet/choose';

const base = { latestRevision: 3, publishedRevision: 2, state: 'draft', isAuthor: false, isReviewer: false };

describe('chooseRevision', () => {
  it.each([
    ['a colleague reads the published revision', base, null, 2],
    ['the author reads the newest', { ...base, isAuthor: true }, null, 3],
    ['a reviewer reads the newest while it is in review', { ...base, isReviewer: true, state: 'in_review' }, null, 3],
    ['a reviewer reads the published revision of a draft', { ...base, isReviewer: true }, null, 2],
    ['never published: the newest', { ...base, publishedRevision: null }, null, 3],
    ['latest asked', base, 'latest', 3],
    ['published asked by the author', { ...base, isAuthor: true }, 'published', 2],
    ['published asked, none yet: the newest', { ...base, publishedRevision: null }, 'published', 3],
    ['a number', base, '1', 1],
    ['a number past the newest', base, '4', null],
    ['zero', base, '0', null],
    ['not a number', base, '1e2', null],
    ['empty: the default', base, '', 2],
  ] as const)('%s', (_what, facts, asked, expected) => {
    expect(chooseRevision(facts, asked)).toBe(expected);
  });
});

describe('paperOf', () => {
  it('is A4 unless Letter is asked for', () => {
    expect(paperOf(null)).toBe('a4');
    expect(paperOf('letter')).toBe('letter');
    expect(paperOf('LETTER')).toBe('letter');
    expect(paperOf('a3')).toBe('a4');
  });
});
