/**
 * Sequent (conjugate) depths: the two depths with equal momentum function on either side of
 * critical depth. Allocation-free cores used by the jump and tailwater solvers.
 * Sources: Bélanger, J.-B., 1828 (rectangular closed form), as given by Chow, V. T., 1959,
 * Open-Channel Hydraulics, §15-2, eq. 15-3; general sections by M(y1) = M(y2), Chow §15-2.
 */
import { brent } from './brent';
import { DEPTH_TOLERANCE } from './criticalDepth';
import { momentumFunction } from './momentumFunction';
import type { Section } from './section';

/** Bélanger: y2/y1 = ½(√(1 + 8 Fr1²) − 1); the same form gives y1/y2 from Fr2. */
export function belangerRatio(froude: number): number {
  return 0.5 * (Math.sqrt(1 + 8 * froude * froude) - 1);
}

/**
 * Subcritical sequent depth y2 (m) of a supercritical depth `y1` < `yc`.
 * Returns `Infinity` when a circular conduit would have to surcharge (M at the crown is less
 * than M(y1)) and `NaN` if the root cannot be bracketed or does not converge.
 */
export function sequentOfSupercritical(
  section: Section,
  discharge: number,
  y1: number,
  yc: number,
  g: number,
): number {
  if (section.shape === 'rectangular') {
    const q = discharge / section.width;
    return y1 * belangerRatio(q / (y1 * Math.sqrt(g * y1)));
  }
  const target = momentumFunction(section, discharge, y1, g);
  const f = (y: number): number => momentumFunction(section, discharge, y, g) - target;
  let hi: number;
  if (section.shape === 'circular') {
    hi = section.diameter;
    if (f(hi) < 0) return Number.POSITIVE_INFINITY;
  } else {
    hi = 2 * yc;
    for (let i = 0; i < 200 && f(hi) < 0; i++) hi *= 2;
  }
  return brent(f, yc, hi, DEPTH_TOLERANCE * hi);
}

/**
 * Supercritical sequent depth y1 (m) of a subcritical depth `y2` > `yc`.
 * Returns `NaN` if the root cannot be bracketed or does not converge.
 */
export function sequentOfSubcritical(
  section: Section,
  discharge: number,
  y2: number,
  yc: number,
  g: number,
): number {
  if (section.shape === 'rectangular') {
    const q = discharge / section.width;
    return y2 * belangerRatio(q / (y2 * Math.sqrt(g * y2)));
  }
  const target = momentumFunction(section, discharge, y2, g);
  const f = (y: number): number => momentumFunction(section, discharge, y, g) - target;
  let lo = 0.5 * yc;
  let hi = yc;
  for (let i = 0; i < 1100 && f(lo) <= 0; i++) {
    hi = lo;
    lo *= 0.5;
    if (lo === 0) return Number.NaN;
  }
  return brent(f, lo, hi, DEPTH_TOLERANCE * hi);
}
