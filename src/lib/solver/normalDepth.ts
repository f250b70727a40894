/**
 * Normal (uniform-flow) depth by Manning's formula, SI form Q = (1/n)·A·R^(2/3)·S^(1/2).
 * The US customary form Q = (1.486/n)·A·R^(2/3)·S^(1/2) in ft and cfs uses the same n
 * (1.486 ≈ (1/0.3048)^(1/3)); inputs here are SI, so no constant is needed.
 * Source: Chow, V. T., 1959, Open-Channel Hydraulics, §5-6 (Manning formula) and §6-2;
 * maximum of a circle's A·R^(2/3) at θ ≈ 5.278 rad (y ≈ 0.938·D), Chow §6-3 (from memory),
 * verified in the tests as the root of 3θ − 5θ·cos θ + 2 sin θ = 0.
 */
import { brent } from './brent';
import { DEPTH_TOLERANCE } from './criticalDepth';
import type { Section } from './section';
import { area, wettedPerimeter } from './sectionGeometry';

/** Central angle θ (rad) at which a circle's Manning conveyance A·R^(2/3) is largest. */
export const CIRCLE_MAX_CONVEYANCE_ANGLE = 5.278107137933795;

/** Relative depth y/D of the circle's largest Manning discharge (≈ 0.938). */
export const CIRCLE_MAX_CONVEYANCE_DEPTH_RATIO = 0.5 * (1 - Math.cos(CIRCLE_MAX_CONVEYANCE_ANGLE / 2));

/** Manning discharge Q = (1/n)·A·R^(2/3)·√S at depth y, m³/s (0 for y ≤ 0). */
export function manningDischarge(section: Section, y: number, n: number, slope: number): number {
  if (!(y > 0)) return 0;
  const a = area(section, y);
  return (a * Math.cbrt((a / wettedPerimeter(section, y)) ** 2) * Math.sqrt(slope)) / n;
}

/**
 * Normal depth for discharge Q (m³/s), roughness n and bed slope S (m/m).
 * For a pipe the lower root is returned; `Infinity` when Q exceeds the pipe's largest
 * open-channel discharge (it would flow full); `NaN` when the root search fails.
 */
export function normalDepth(section: Section, discharge: number, n: number, slope: number): number {
  const f = (y: number): number => manningDischarge(section, y, n, slope) - discharge;
  let hi: number;
  if (section.shape === 'circular') {
    hi = CIRCLE_MAX_CONVEYANCE_DEPTH_RATIO * section.diameter;
    if (f(hi) < 0) return Number.POSITIVE_INFINITY;
  } else {
    // Wide-rectangle estimate, then doubling: Q grows without bound with y in open shapes.
    const width = section.shape === 'triangular' ? section.sideSlope : Math.max(section.width, section.shape === 'trapezoidal' ? section.sideSlope : 0);
    hi = Math.pow((n * discharge) / (width * Math.sqrt(slope)), 0.6);
    if (!(hi > 0) || !Number.isFinite(hi)) hi = 1;
    for (let i = 0; i < 400 && f(hi) < 0; i++) hi *= 2;
  }
  return brent(f, 0, hi, DEPTH_TOLERANCE * hi);
}
