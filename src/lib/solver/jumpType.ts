/**
 * Classification of the hydraulic jump by inflow Froude number.
 * Source: Chow, V. T., 1959, Open-Channel Hydraulics, ch. 15 (types of jump, after the
 * U.S. Bureau of Reclamation studies), ranges from memory.
 */

/** Jump types, from the weakest to the strongest. */
export const JUMP_TYPES = ['undular', 'weak', 'oscillating', 'steady', 'strong'] as const;

/** One of {@link JUMP_TYPES}. */
export type JumpType = (typeof JUMP_TYPES)[number];

/** Lower Fr1 bound of each type (the type holds for lower ≤ Fr1 < next lower). */
export const JUMP_TYPE_BOUNDS: Readonly<Record<JumpType, number>> = {
  undular: 1,
  weak: 1.7,
  oscillating: 2.5,
  steady: 4.5,
  strong: 9,
};

/**
 * Jump type for an inflow Froude number `fr1` > 1: undular 1–1.7, weak 1.7–2.5,
 * oscillating 2.5–4.5, steady 4.5–9, strong ≥ 9. Throws `RangeError` for `fr1` ≤ 1 or NaN
 * (callers must reject those first: no jump forms).
 */
export function jumpType(fr1: number): JumpType {
  if (!(fr1 > 1)) throw new RangeError(`jumpType: Fr1 must exceed 1, got ${fr1}`);
  if (fr1 < JUMP_TYPE_BOUNDS.weak) return 'undular';
  if (fr1 < JUMP_TYPE_BOUNDS.oscillating) return 'weak';
  if (fr1 < JUMP_TYPE_BOUNDS.steady) return 'oscillating';
  if (fr1 < JUMP_TYPE_BOUNDS.strong) return 'steady';
  return 'strong';
}
