/**
 * Specific energy above the channel bottom.
 * Source: Chow, V. T., 1959, Open-Channel Hydraulics, §3-1 (E = y + V²/2g, α = 1).
 */
import type { Section } from './section';
import { area } from './sectionGeometry';

/** Specific energy E = y + Q²/(2gA²), m. */
export function specificEnergy(section: Section, discharge: number, y: number, g: number): number {
  const a = area(section, y);
  return y + (discharge * discharge) / (2 * g * a * a);
}
