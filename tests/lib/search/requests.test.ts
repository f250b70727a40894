import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { emptyQuery, type PrecedentQuery } from '../../../src/lib/search/params';
import { HIGHLIGHT_POST, HIGHLIGHT_PRE, quote, searchFilter, searchRequests } from '../../../src/lib/search/requests';

const q = (change: Partial<PrecedentQuery> = {}): PrecedentQuery => ({ ...emptyQuery(), ...change });

/** Reads a double-quoted filter string literal back, as the Meilisearch filter syntax defines escapes. */
function unquote(literal: string): string | null {
  if (!literal.startsWith('"') || !literal.endsWith('"') || literal.length < 2) return null;
  let out = '';
  for (let i = 1; i < literal.length - 1; i += 1) {
    const c = literal[i]!;
    if (c === '\\') {
      i += 1;
      if (i >= literal.length - 1) return null;
      out += literal[i];
    } else if (c === '"') return null; // an unescaped quote would end the string early
    else out += c;
  }
  return out;
}

describe('quote(value)', () => {
  it('gives one string literal that reads back as the value, whatever the value holds (property)', () => {
    fc.assert(
      fc.property(fc.string(), (value) => {
        expect(unquote(quote(value))).toBe(value);
      }),
    );
  });

  it('escapes quotes and backslashes of a crafted value', () => {
    expect(quote('a" OR firmId = "b')).toBe('"a\\" OR firmId = \\"b"');
    expect(quote('back\\')).toBe('"back\\\\"');
  });
});

describe('searchFilter(firmId, query)', () => {
  it('always starts with the firm, as its own element of the array form', () => {
    fc.assert(
      fc.property(fc.string({ minLength: 1 }), fc.array(fc.string(), { maxLength: 3 }), (firm, tags) => {
        const filter = searchFilter(firm, q({ facets: { ...emptyQuery().facets, tag: tags } }));
        expect(filter[0]).toBe(`firmId = ${quote(firm)}`);
      }),
    );
  });

  it('matches Fr1 and discharge ranges by overlap with the case range', () => {
    expect(searchFilter('F', q({ frMin: 4, frMax: 6, dischargeMin: 10 }))).toEqual([
      'firmId = "F"',
      'fr1Max >= 4',
      'fr1Min <= 6',
      'dischargeMax >= 10',
    ]);
  });

  it('ORs the values of one facet and ANDs the facets', () => {
    const facets = { ...emptyQuery().facets, structure: ['culvert-outlet', 'outfall'], tag: ['apron'] };
    expect(searchFilter('F', q({ facets }))).toEqual(['firmId = "F"', 'structureType IN ["culvert-outlet", "outfall"]', 'tags IN ["apron"]']);
    expect(searchFilter('F', q({ facets }), 'structure')).toEqual(['firmId = "F"', 'tags IN ["apron"]']);
  });
});

describe('searchRequests(index, firmId, query)', () => {
  it('asks for the hits with highlight sentinels and counts each selected facet group apart (disjunctive)', () => {
    const facets = { ...emptyQuery().facets, structure: ['culvert-outlet'] };
    const { requests, groups } = searchRequests('cases', 'F', q({ q: ' culvert ', frMin: 4, facets, page: 3 }));
    expect(groups).toEqual(['structure']);
    const [main, counts] = requests;
    expect(main).toMatchObject({ indexUid: 'cases', q: 'culvert', limit: 20, offset: 40, highlightPreTag: HIGHLIGHT_PRE, highlightPostTag: HIGHLIGHT_POST });
    expect(main!.facets).not.toContain('structureType');
    expect(main!.facets).toEqual(['sectionShapes', 'calcKinds', 'region', 'tags']);
    expect(main!.sort).toBeUndefined();
    expect(counts).toEqual({ indexUid: 'cases', q: 'culvert', filter: ['firmId = "F"', 'fr1Max >= 4'], facets: ['structureType'], limit: 0, offset: 0 });
  });

  it('orders by newest without words, and by the chosen order otherwise', () => {
    expect(searchRequests('i', 'F', q()).requests[0]!.sort).toEqual(['publishedAt:desc']);
    expect(searchRequests('i', 'F', q({ q: 'x', sort: 'fr1-asc' })).requests[0]!.sort).toEqual(['fr1Min:asc']);
    expect(searchRequests('i', 'F', q({ q: 'x', sort: 'fr1-desc' })).requests[0]!.sort).toEqual(['fr1Max:desc']);
  });
});
