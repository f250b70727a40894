import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { MAX_SLUG_LENGTH, nextFreeSlug, slugify } from '../../../src/lib/cases/slug';

describe('slugify(title)', () => {
  it.each([
    ['', 'case'],
    ['   ', 'case'],
    ['—', 'case'],
    ['日本語', 'case'],
    ['Stilling basin', 'stilling-basin'],
    ['  Aldmere weir -- outlet  ', 'aldmere-weir-outlet'],
    ['Q = 85 m³/s, Fr1 ≈ 4.6', 'q-85-m3-s-fr1-4-6'],
    ['Überfall à Sœurs, Øresund, Straße', 'uberfall-a-soeurs-oresund-strasse'],
    ['Łódź culvert', 'lodz-culvert'],
  ])('turns %j into %j', (title, slug) => expect(slugify(title)).toBe(slug));

  it('keeps at most 60 characters and never ends on a hyphen', () => {
    const slug = slugify(`${'a'.repeat(59)} b and more words`);
    expect(slug).toBe('a'.repeat(59));
    expect(slugify('x'.repeat(200))).toHaveLength(MAX_SLUG_LENGTH);
  });

  it('never throws for a title that is not a string', () => {
    expect(slugify(undefined as unknown as string)).toBe('case');
  });

  it('always gives lower-case ASCII words joined by single hyphens', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 300 }), (title) => {
        const slug = slugify(title);
        expect(slug).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*$/);
        expect(slug.length).toBeLessThanOrEqual(MAX_SLUG_LENGTH);
        expect(slugify(slug)).toBe(slug);
      }),
    );
  });
});

describe('nextFreeSlug(base, taken)', () => {
  it('keeps the base when it is free', () => expect(nextFreeSlug('basin', ['basin-2', 'outlet'])).toBe('basin'));
  it('adds -2 for the first repeat', () => expect(nextFreeSlug('basin', ['basin'])).toBe('basin-2'));
  it('goes one past the highest suffix in use', () => expect(nextFreeSlug('basin', ['basin', 'basin-2', 'basin-7'])).toBe('basin-8'));
  it('ignores slugs that only start like the base', () =>
    expect(nextFreeSlug('basin', ['basin', 'basin-outlet-9', 'basin-3a'])).toBe('basin-2'));
});
