/**
 * The numbers a search document carries for a case: the key figures of its published
 * revision (as `KeyFigures` defines them, in SI) and the surge or bore front speed. One list,
 * so the document, the attributes a search retrieves and the hits the API answers agree.
 * Pure and tiny (the search island imports what it needs of the results directly).
 */
import type { KeyFigures } from '../cases/keyFigures';

/** The figure names, in the order a result lists them. */
export const FIGURE_NAMES = ['fr1Min', 'fr1Max', 'dischargeMin', 'dischargeMax', 'v1', 'y1', 'y2', 'relativeLoss', 'surgeCelerity'] as const;

/** A case's figures; null where no block gives the value. */
export type SearchFigures = Omit<KeyFigures, 'sectionShapes' | 'calcKinds'> & {
  /** Largest surge or bore front speed over the bed, m/s, where a block computes one. */
  surgeCelerity: number | null;
};

/** The figures of `source` by name; anything that is not a finite number becomes null. */
export function pickFigures(source: Record<string, unknown>): SearchFigures {
  const out = {} as Record<(typeof FIGURE_NAMES)[number], number | null>;
  for (const name of FIGURE_NAMES) {
    const value = source[name];
    out[name] = typeof value === 'number' && Number.isFinite(value) ? value : null;
  }
  return out;
}
