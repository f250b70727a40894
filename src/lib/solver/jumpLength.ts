/**
 * Empirical length of a classical hydraulic jump on a horizontal rectangular apron.
 * Sources (both from memory):
 * - Peterka, A. J., 1958, Hydraulic Design of Stilling Basins and Energy Dissipators,
 *   USBR Engineering Monograph 25, Basin I (length of jump curve): L_j ≈ 6.1·y2, the flat
 *   part of the curve for 4.5 ≤ Fr1 ≤ 13.
 * - Hager, W. H., Bremen, R. and Kawagoshi, N., 1990, Classical hydraulic jump: length of
 *   roller, J. Hydraulic Research 28(5); also Hager, W. H., 1992, Energy Dissipators and
 *   Hydraulic Jump, ch. 2: L_r = 8·y1·(Fr1 − 1.5) for 2.5 ≤ Fr1 ≤ 8.
 */
import type { Warning } from './result';

/** Fr1 range of the USBR L_j ≈ 6.1·y2 plateau. */
export const JUMP_LENGTH_RANGE = { min: 4.5, max: 13 } as const;

/** Fr1 range of Hager's roller-length relation. */
export const ROLLER_LENGTH_RANGE = { min: 2.5, max: 8 } as const;

/** Jump length L_j ≈ 6.1·y2 (m), USBR EM 25. */
export function jumpLengthUsbr(y2: number): number {
  return 6.1 * y2;
}

/** Roller length L_r = 8·y1·(Fr1 − 1.5) (m), Hager et al. 1990. */
export function rollerLengthHager(y1: number, fr1: number): number {
  return 8 * y1 * (fr1 - 1.5);
}

/**
 * Appends warnings when `fr1` is outside the ranges of the length relations, or the
 * section is not rectangular (both relations come from rectangular-flume data).
 */
export function jumpLengthWarnings(fr1: number, rectangular: boolean, into: Warning[]): void {
  if (fr1 < JUMP_LENGTH_RANGE.min || fr1 > JUMP_LENGTH_RANGE.max) {
    into.push({
      code: 'jump-length-out-of-range',
      message: `Jump length L_j ≈ 6.1·y2 (USBR EM 25) holds for ${JUMP_LENGTH_RANGE.min} ≤ Fr1 ≤ ${JUMP_LENGTH_RANGE.max}; Fr1 = ${fr1.toPrecision(3)} is outside, so treat L_j as a rough estimate (the USBR curve gives shorter relative lengths below 4.5).`,
    });
  }
  if (fr1 < ROLLER_LENGTH_RANGE.min || fr1 > ROLLER_LENGTH_RANGE.max) {
    into.push({
      code: 'roller-length-out-of-range',
      message: `Roller length L_r = 8·y1·(Fr1 − 1.5) (Hager et al. 1990) holds for ${ROLLER_LENGTH_RANGE.min} ≤ Fr1 ≤ ${ROLLER_LENGTH_RANGE.max}; Fr1 = ${fr1.toPrecision(3)} is outside.`,
    });
  }
  if (!rectangular) {
    into.push({
      code: 'jump-length-rectangular-data',
      message:
        'Jump and roller lengths come from rectangular-channel data; in sloping-sided or circular sections jumps are usually longer and less stable (common practice). Confirm by model tests or section-specific data.',
    });
  }
}
