/**
 * Channel cross-sections and their validation. Dimensions in metres.
 */
import { fail, type SolverFailure } from './result';

/** Section shape identifiers, as used by the `shape` input of every kind. */
export const SECTION_SHAPES = ['rectangular', 'trapezoidal', 'triangular', 'circular'] as const;

/** One of {@link SECTION_SHAPES}. */
export type SectionShape = (typeof SECTION_SHAPES)[number];

/** Rectangular channel of bottom width `width` (m). */
export interface RectangularSection {
  readonly shape: 'rectangular';
  readonly width: number;
}

/** Trapezoidal channel: bottom width `width` (m, ≥ 0) and side slope `sideSlope` z (H:V, each side, ≥ 0). */
export interface TrapezoidalSection {
  readonly shape: 'trapezoidal';
  readonly width: number;
  readonly sideSlope: number;
}

/** Symmetric triangular (V) channel with side slope `sideSlope` z (H:V, each side, > 0). */
export interface TriangularSection {
  readonly shape: 'triangular';
  readonly sideSlope: number;
}

/** Circular conduit of diameter `diameter` (m), flowing partly full. */
export interface CircularSection {
  readonly shape: 'circular';
  readonly diameter: number;
}

/** Any supported cross-section. */
export type Section = RectangularSection | TrapezoidalSection | TriangularSection | CircularSection;

const positive = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v) && v > 0;
const nonNegative = (v: unknown): v is number =>
  typeof v === 'number' && Number.isFinite(v) && v >= 0;

/**
 * Checks a section's dimensions; returns a failure naming the field, or `null` when valid.
 * Accepts untyped data so it can guard the public entry points.
 */
export function validateSection(section: unknown): SolverFailure | null {
  if (typeof section !== 'object' || section === null) {
    return fail('invalid-input', 'A channel section is required.', 'shape');
  }
  const s = section as Record<string, unknown>;
  switch (s['shape']) {
    case 'rectangular':
      return positive(s['width'])
        ? null
        : fail('invalid-input', 'Width b must be a finite number greater than zero.', 'width');
    case 'trapezoidal':
      if (!nonNegative(s['width'])) {
        return fail('invalid-input', 'Bottom width b must be a finite number ≥ 0.', 'width');
      }
      if (!nonNegative(s['sideSlope'])) {
        return fail('invalid-input', 'Side slope z (H:V) must be a finite number ≥ 0.', 'sideSlope');
      }
      return s['width'] === 0 && s['sideSlope'] === 0
        ? fail('invalid-input', 'A trapezoid needs b > 0 or z > 0 (both are zero).', 'width')
        : null;
    case 'triangular':
      return positive(s['sideSlope'])
        ? null
        : fail('invalid-input', 'Side slope z (H:V) must be a finite number greater than zero.', 'sideSlope');
    case 'circular':
      return positive(s['diameter'])
        ? null
        : fail('invalid-input', 'Diameter D must be a finite number greater than zero.', 'diameter');
    default:
      return fail(
        'invalid-input',
        `Unknown section shape; use one of: ${SECTION_SHAPES.join(', ')}.`,
        'shape',
      );
  }
}

/** Depth at which the section is full: the crown for circular conduits, `Infinity` for open shapes. */
export function sectionFullDepth(section: Section): number {
  return section.shape === 'circular' ? section.diameter : Number.POSITIVE_INFINITY;
}
