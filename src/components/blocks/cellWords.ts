/**
 * Words (and their tone classes) for the coded cells of a block's rows table: a tailwater
 * check's jump position, a basin screening's fits column.
 */

/** Words for the jump positions of a tailwater check, and their tone. */
export const JUMP_POSITION_TEXT: Readonly<Record<string, { readonly text: string; readonly tone: string }>> = {
  'swept-out': { text: 'swept out', tone: 'text-fault font-semibold' },
  'at-toe': { text: 'at the toe', tone: 'text-sound' },
  submerged: { text: 'submerged', tone: 'text-tailwater' },
  'no-tailwater': { text: 'no tailwater', tone: 'text-caution' },
  'no-jump': { text: 'no jump (Fr1 ≤ 1)', tone: 'text-ink-soft' },
  surcharged: { text: 'conduit full', tone: 'text-caution' },
};

/** Words for the `fits` column of a basin screening, and their tone. */
export const FITS_TEXT: Readonly<Record<string, { readonly text: string; readonly tone: string }>> = {
  yes: { text: 'fits', tone: 'text-sound' },
  no: { text: 'outside', tone: 'text-caution' },
};

/** Columns whose values read as toned words, by column name. */
export const WORD_COLUMNS: Readonly<Record<string, typeof FITS_TEXT>> = { state: JUMP_POSITION_TEXT, fits: FITS_TEXT };

/**
 * Columns of long text (a basin family's stated range and relations) that read better as
 * notes under the table, one entry per row, than as narrow cells that stretch every row.
 */
export const NOTE_COLUMNS: ReadonlySet<string> = new Set(['range', 'relations']);
