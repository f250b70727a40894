/**
 * Critical depth: the depth where Fr = 1, i.e. Q²T/(gA³) = 1.
 * Source: Chow, V. T., 1959, Open-Channel Hydraulics, §4-2 (section factor Z = Q/√g) and §4-3.
 */
import { brent } from './brent';
import { froudeSquared } from './froudeNumber';
import type { Section } from './section';

/** Relative depth tolerance of the solver's root finding. */
export const DEPTH_TOLERANCE = 1e-12;

/**
 * Critical depth yc (m) for discharge `discharge` (m³/s, > 0).
 * Closed form for rectangles yc = (q²/g)^(1/3) and triangles yc = (2Q²/(gz²))^(1/5);
 * a bracketed root otherwise. Returns `NaN` when no root can be bracketed.
 */
export function criticalDepth(section: Section, discharge: number, g: number): number {
  switch (section.shape) {
    case 'rectangular': {
      const q = discharge / section.width;
      return Math.cbrt((q * q) / g);
    }
    case 'triangular':
      return Math.pow((2 * discharge * discharge) / (g * section.sideSlope * section.sideSlope), 0.2);
    case 'trapezoidal': {
      // Upper bound: a trapezoid is wider than its bottom rectangle and its side triangle.
      const b = section.width;
      const z = section.sideSlope;
      const rect = b > 0 ? Math.cbrt((discharge * discharge) / (g * b * b)) : Infinity;
      const tri = z > 0 ? Math.pow((2 * discharge * discharge) / (g * z * z), 0.2) : Infinity;
      return rootBelow((y) => froudeSquared(section, discharge, y, g) - 1, Math.min(rect, tri));
    }
    case 'circular':
      // Fr² falls from +∞ at the invert to 0 at the crown (T = 0): one root in (0, D).
      return rootBelow((y) => froudeSquared(section, discharge, y, g) - 1, section.diameter);
  }
}

/**
 * Root of a function that is positive near 0 and ≤ 0 at (or a little above) `hi`: halves down
 * from `hi` to find a sign change, then runs Brent on it. `NaN` when no sign change is found.
 */
export function rootBelow(f: (y: number) => number, hi: number): number {
  if (!(hi > 0) || !Number.isFinite(hi)) return Number.NaN;
  let upper = hi;
  // Rounding can leave f slightly positive at an analytic upper bound: step up a little.
  for (let i = 0; i < 64 && f(upper) > 0; i++) upper *= 1.25;
  if (f(upper) > 0) return Number.NaN;
  let lower = 0.5 * upper;
  for (let i = 0; i < 1100 && f(lower) <= 0; i++) {
    upper = lower;
    lower *= 0.5;
    if (lower === 0) return Number.NaN;
  }
  return brent(f, lower, upper, DEPTH_TOLERANCE * upper);
}
