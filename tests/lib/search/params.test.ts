import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { emptyQuery, FACET_PARAMS, paramsFromQuery, queryFromParams, SEARCH_SORTS, type PrecedentQuery } from '../../../src/lib/search/params';
import { PrecedentQuerySchema } from '../../../src/lib/search/validation';

const bound = fc.option(fc.double({ min: 0, max: 50, noNaN: true, noDefaultInfinity: true }), { nil: null });
const words = fc.array(fc.string({ minLength: 1, maxLength: 12 }), { maxLength: 3 }).map((a) => [...new Set(a)]);
const query: fc.Arbitrary<PrecedentQuery> = fc.record({
  q: fc.string({ maxLength: 30 }).filter((q) => q.trim() !== '' || q === ''),
  frMin: bound,
  frMax: bound,
  dischargeMin: bound,
  dischargeMax: bound,
  facets: fc.record({ structure: words, shape: words, kind: words, region: words, tag: words }),
  sort: fc.constantFrom(...SEARCH_SORTS),
  page: fc.integer({ min: 1, max: 50 }),
});

describe('precedent query in the URL', () => {
  it('reads back what it wrote, for any query (property)', () => {
    fc.assert(
      fc.property(query, (q) => {
        const back = queryFromParams(new URLSearchParams(paramsFromQuery(q).toString()));
        expect(back).toEqual({ ...q, q: q.q.trim() ? q.q : '' });
      }),
    );
  });

  it('leaves defaults out so links stay short', () => {
    expect(paramsFromQuery(emptyQuery()).toString()).toBe('');
    const q = { ...emptyQuery(), q: 'culvert', frMin: 4, frMax: 6, facets: { ...emptyQuery().facets, tag: ['apron', 'outlet'] } };
    expect(paramsFromQuery(q).toString()).toBe('q=culvert&frMin=4&frMax=6&tag=apron&tag=outlet');
  });

  it('opens any link: unknown parameters ignored, a bad number kept as NaN for the validator to name', () => {
    const q = queryFromParams(new URLSearchParams('frMin=four&sort=sideways&page=-3&colour=red&tag=&tag=apron&tag=apron'));
    expect(q.frMin).toBeNaN();
    expect(q.sort).toBe('relevance');
    expect(q.page).toBe(1);
    expect(q.facets.tag).toEqual(['apron']);
    const checked = PrecedentQuerySchema.safeParse(q);
    expect(checked.success).toBe(false);
    expect(checked.error?.issues.map((i) => i.message)).toContain('The lowest Fr₁ must be a number.');
  });

  it('refuses inverted ranges, unknown facet values and deep pages with messages that say what to do', () => {
    const base = emptyQuery();
    const messages = (q: PrecedentQuery) => PrecedentQuerySchema.safeParse(q).error?.issues.map((i) => i.message) ?? [];
    expect(messages({ ...base, frMin: 6, frMax: 4 })).toEqual(['The lowest Fr₁ must not be above the highest.']);
    expect(messages({ ...base, dischargeMin: 10, dischargeMax: 1 })).toEqual(['The lowest discharge must not be above the highest.']);
    expect(messages({ ...base, facets: { ...base.facets, structure: ['aqueduct'] } })[0]).toMatch(/^Unknown structure type: choose from spillway-basin/);
    expect(messages({ ...base, page: 51 })).toEqual(['Pages stop at 50: narrow the search to see more.']);
    expect(messages({ ...base, frMax: -1 })).toEqual(['The highest Fr₁ cannot be negative.']);
    expect(PrecedentQuerySchema.safeParse({ ...base, frMin: 4, frMax: 4 }).success).toBe(true);
  });

  it('names every facet parameter once', () => {
    expect(FACET_PARAMS).toEqual(['structure', 'shape', 'kind', 'region', 'tag']);
  });
});
