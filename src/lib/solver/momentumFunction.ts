/**
 * Specific force (momentum function) per unit weight of water.
 * Source: Chow, V. T., 1959, Open-Channel Hydraulics, §3-6 (M = Q²/(gA) + A·ȳ).
 */
import { circularArea, circularFirstMoment, circularHalfAngle } from './circularSegment';
import type { Section } from './section';

/** Momentum function M(y) = Q²/(gA) + A·ȳ, m³. Conserved across a jump on a horizontal, frictionless bed. */
export function momentumFunction(section: Section, discharge: number, y: number, g: number): number {
  let a: number;
  let m: number;
  switch (section.shape) {
    case 'rectangular':
      a = section.width * y;
      m = 0.5 * a * y;
      break;
    case 'trapezoidal':
      a = (section.width + section.sideSlope * y) * y;
      m = y * y * (0.5 * section.width + (section.sideSlope * y) / 3);
      break;
    case 'triangular':
      a = section.sideSlope * y * y;
      m = (a * y) / 3;
      break;
    case 'circular': {
      const alpha = circularHalfAngle(y, section.diameter);
      a = circularArea(alpha, section.diameter);
      m = circularFirstMoment(alpha, section.diameter);
      break;
    }
  }
  return (discharge * discharge) / (g * a) + m;
}
