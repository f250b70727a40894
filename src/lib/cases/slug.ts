/** Longest slug {@link slugify} returns (a de-duplicating suffix may follow it). */
export const MAX_SLUG_LENGTH = 60;

// Letters that do not decompose into an ASCII base letter plus marks under NFKD.
const SPECIAL_LETTERS: Record<string, string> = {
  ß: 'ss', æ: 'ae', œ: 'oe', ø: 'o', đ: 'd', ð: 'd', ł: 'l', þ: 'th', ı: 'i', ŋ: 'n',
};

/**
 * A URL-safe name for a case from its title: ASCII letters and digits, lower-case, words
 * joined by single hyphens, at most {@link MAX_SLUG_LENGTH} characters, `case` when
 * nothing usable is left.
 *
 * @example slugify('Stilling basin — Aldmere weir, Q = 85 m³/s') // 'stilling-basin-aldmere-weir-q-85-m3-s'
 */
export function slugify(title: string): string {
  const ascii = String(title ?? '')
    .toLowerCase()
    .replace(/[ßæœøđðłþıŋ]/g, (letter) => SPECIAL_LETTERS[letter] ?? '')
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '');
  const slug = ascii
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, MAX_SLUG_LENGTH)
    .replace(/-+$/, '');
  return slug || 'case';
}

/**
 * The first free slug for `base` given the slugs already taken: `base`, else `base-2`,
 * `base-3`… (one more than the highest suffix in use).
 */
export function nextFreeSlug(base: string, taken: readonly string[]): string {
  const used = new Set(taken);
  if (!used.has(base)) return base;
  let highest = 1;
  for (const slug of used) {
    const match = slug.startsWith(`${base}-`) ? /^\d+$/.exec(slug.slice(base.length + 1)) : null;
    if (match) highest = Math.max(highest, Number(match[0]));
  }
  return `${base}-${highest + 1}`;
}
