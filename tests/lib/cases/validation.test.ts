import { describe, expect, it } from 'vitest';
import {
  CaseMetadataSchema,
  CreateCaseSchema,
  DiffQuerySchema,
  ListCasesQuerySchema,
  SaveCaseSchema,
  SECTION_SHAPE_LABELS,
  SECTION_SHAPES,
  STRUCTURE_TYPE_LABELS,
  STRUCTURE_TYPES,
} from '../../../src/lib/cases/validation';

const valid = { title: 'Aldmere weir stilling basin', structureType: 'spillway-basin', sectionShape: 'rectangular' };
const issuesOf = (result: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  Object.fromEntries((result.error?.issues ?? []).map((i) => [i.path.join('.'), i.message]));

describe('CaseMetadataSchema', () => {
  it('accepts the three required fields and fills the rest', () => {
    expect(CaseMetadataSchema.parse(valid)).toEqual({ ...valid, tags: [] });
  });

  it('trims the title and blanks optional texts to null', () => {
    const parsed = CaseMetadataSchema.parse({ ...valid, title: '  Outfall  ', projectReference: '  ', region: ' Vale of Tarn ' });
    expect(parsed).toMatchObject({ title: 'Outfall', projectReference: null, region: 'Vale of Tarn' });
  });

  it('lower-cases, trims and de-duplicates tags', () => {
    expect(CaseMetadataSchema.parse({ ...valid, tags: [' Basin ', 'basin', 'USBR  II', 'usbr ii'] }).tags).toEqual(['basin', 'usbr ii']);
  });

  it('counts tags after dropping duplicates', () => {
    const tags = [...Array.from({ length: 12 }, (_, i) => `t${i}`), 'T0', 't1'];
    expect(CaseMetadataSchema.safeParse({ ...valid, tags }).success).toBe(true);
    expect(issuesOf(CaseMetadataSchema.safeParse({ ...valid, tags: [...tags, 't12'] }))).toEqual({ tags: 'A case can have at most 12 tags.' });
  });

  it('explains every wrong field at once, in the words of the trade', () => {
    const result = CaseMetadataSchema.safeParse({
      title: 'ab',
      structureType: 'bridge',
      sectionShape: 'oval',
      projectReference: 'x'.repeat(61),
      region: 'y'.repeat(81),
      tags: ['', 'z'.repeat(33)],
    });
    expect(issuesOf(result)).toEqual({
      title: 'Give the case a title of at least 3 characters.',
      structureType: `Choose a structure type: ${STRUCTURE_TYPES.join(', ')}.`,
      sectionShape: `Choose a section shape: ${SECTION_SHAPES.join(', ')}.`,
      projectReference: 'Keep the project reference to 60 characters or fewer.',
      region: 'Keep the region to 80 characters or fewer.',
      'tags.0': 'A tag cannot be empty.',
      'tags.1': 'Keep each tag to 32 characters or fewer.',
    });
  });

  it('asks for a title when it is missing or too long', () => {
    expect(issuesOf(CaseMetadataSchema.safeParse({ ...valid, title: undefined })).title).toBe('Give the case a title.');
    expect(issuesOf(CaseMetadataSchema.safeParse({ ...valid, title: 't'.repeat(161) })).title).toBe('Keep the title to 160 characters or fewer.');
  });

  it('refuses fields it does not know (a slug is derived, never sent)', () => {
    expect(CaseMetadataSchema.safeParse({ ...valid, slug: 'mine' }).success).toBe(false);
  });

  it('labels every structure type and section shape', () => {
    expect(Object.keys(STRUCTURE_TYPE_LABELS).sort()).toEqual([...STRUCTURE_TYPES].sort());
    expect(Object.keys(SECTION_SHAPE_LABELS).sort()).toEqual([...SECTION_SHAPES].sort());
  });
});

describe('CreateCaseSchema', () => {
  it('defaults the body to empty', () => expect(CreateCaseSchema.parse(valid).body).toBe(''));
  it('refuses a body over 200,000 characters', () => {
    expect(CreateCaseSchema.safeParse({ ...valid, body: 'x'.repeat(200_000) }).success).toBe(true);
    expect(Object.keys(issuesOf(CreateCaseSchema.safeParse({ ...valid, body: 'x'.repeat(200_001) })))).toEqual(['body']);
  });
});

describe('SaveCaseSchema', () => {
  it('takes a body, metadata or both', () => {
    expect(SaveCaseSchema.parse({ baseRevision: 1, body: '' })).toEqual({ baseRevision: 1, body: '' });
    expect(SaveCaseSchema.parse({ baseRevision: 1, metadata: { tags: ['Basin'] } })).toEqual({ baseRevision: 1, metadata: { tags: ['basin'] } });
  });

  it('keeps fields left out of the metadata undefined, and blank optional texts as null (to clear them)', () => {
    const parsed = SaveCaseSchema.parse({ baseRevision: 2, metadata: { region: '', projectReference: null } });
    expect(parsed.metadata).toEqual({ region: null, projectReference: null });
  });

  it('asks for something to save', () => {
    expect(issuesOf(SaveCaseSchema.safeParse({ baseRevision: 1 }))).toEqual({ body: 'Send a new body, metadata to change, or both.' });
  });

  it.each([[-1], [1.5], ['1'], [null], [Number.NaN]])('refuses baseRevision %j', (baseRevision) => {
    expect(Object.keys(issuesOf(SaveCaseSchema.safeParse({ baseRevision, body: 'x' })))).toContain('baseRevision');
  });

  it('validates the metadata it changes', () => {
    expect(issuesOf(SaveCaseSchema.safeParse({ baseRevision: 1, metadata: { title: ' x ' } }))).toEqual({
      'metadata.title': 'Give the case a title of at least 3 characters.',
    });
  });
});

describe('ListCasesQuerySchema', () => {
  it('has defaults for an empty query', () => {
    expect(ListCasesQuerySchema.parse({})).toEqual({ mine: false, sort: 'updated', limit: 50, offset: 0 });
  });
  it('reads query strings', () => {
    expect(ListCasesQuerySchema.parse({ mine: '1', sort: 'fr1', dir: 'asc', limit: '10', offset: '20', state: 'draft' })).toEqual({
      mine: true,
      sort: 'fr1',
      dir: 'asc',
      limit: 10,
      offset: 20,
      state: 'draft',
    });
  });
  it.each([
    [{ limit: '101' }, 'limit'],
    [{ limit: '0' }, 'limit'],
    [{ limit: 'ten' }, 'limit'],
    [{ offset: '-1' }, 'offset'],
    [{ sort: 'froude' }, 'sort'],
    [{ dir: 'up' }, 'dir'],
    [{ state: 'approved' }, 'state'],
    [{ mine: 'yes' }, 'mine'],
  ])('refuses %j', (query, field) => expect(Object.keys(issuesOf(ListCasesQuerySchema.safeParse(query)))).toEqual([field]));
});

describe('DiffQuerySchema', () => {
  it('reads two revision numbers', () => expect(DiffQuerySchema.parse({ from: '1', to: '3' })).toEqual({ from: 1, to: 3 }));
  it('needs both', () => expect(Object.keys(issuesOf(DiffQuerySchema.safeParse({ from: '1' })))).toEqual(['to']));
  it('refuses zero and fractions', () => expect(Object.keys(issuesOf(DiffQuerySchema.safeParse({ from: '0', to: '1.5' })))).toEqual(['from', 'to']));
});
