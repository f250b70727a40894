/**
 * Froude number of a section flow.
 * Source: Chow, V. T., 1959, Open-Channel Hydraulics, §1-3 and §3-2 (Fr = V/√(g·A/T)).
 */
import type { Section } from './section';
import { area, topWidth } from './sectionGeometry';

/** Squared Froude number Fr² = Q²T/(gA³) at depth `y`. Zero above a pipe crown (T = 0). */
export function froudeSquared(section: Section, discharge: number, y: number, g: number): number {
  const a = area(section, y);
  return (discharge * discharge * topWidth(section, y)) / (g * a * a * a);
}

/** Froude number Fr = V/√(g·A/T) at depth `y`. */
export function froudeNumber(section: Section, discharge: number, y: number, g: number): number {
  return Math.sqrt(froudeSquared(section, discharge, y, g));
}
