/**
 * Input-field descriptions shared by several kinds (section, gravity, density), and the
 * helper that turns validated values back into a typed section.
 */
import { STANDARD_GRAVITY, WATER_DENSITY } from './constants';
import type { InputFieldSpec, InputValues, OutputFieldSpec } from './kindSpec';
import type { Quantity } from './quantity';
import { SECTION_SHAPES, type Section, type SectionShape } from './section';

/** Section inputs: `shape`, `width`, `sideSlope`, `diameter`. */
export function sectionFields(shapes: readonly SectionShape[] = SECTION_SHAPES): InputFieldSpec[] {
  const on = (...s: SectionShape[]) => ({ field: 'shape', oneOf: s.filter((x) => shapes.includes(x)) });
  return [
    { name: 'shape', label: 'Section shape', symbol: 'shape', latex: '\\text{shape}', type: 'choice', quantity: 'text', required: false, default: 'rectangular', choices: shapes, description: 'Cross-section of the channel: rectangular, trapezoidal, triangular or circular (a partly full pipe).' },
    { name: 'width', label: 'Bottom width', symbol: 'b', latex: 'b', type: 'number', quantity: 'length', required: true, min: 0, when: on('rectangular', 'trapezoidal'), description: 'Bottom width b of a rectangular (> 0) or trapezoidal (≥ 0) channel.' },
    { name: 'sideSlope', label: 'Side slope (H:V)', symbol: 'z', latex: 'z', type: 'number', quantity: 'dimensionless', required: true, min: 0, when: on('trapezoidal', 'triangular'), description: 'Side slope z, horizontal per unit vertical, on each side (z = 2 means 2H:1V).' },
    { name: 'diameter', label: 'Diameter', symbol: 'D', latex: 'D', type: 'number', quantity: 'length', required: true, min: 0, exclusiveMin: true, when: on('circular'), description: 'Inside diameter D of a circular conduit flowing partly full.' },
  ];
}

/** Optional gravity override `g`. */
export const GRAVITY_FIELD: InputFieldSpec = { name: 'g', label: 'Gravity', symbol: 'g', latex: 'g', type: 'number', quantity: 'acceleration', required: false, default: STANDARD_GRAVITY, min: 0, exclusiveMin: true, description: 'Acceleration of gravity; standard gravity 9.80665 m/s² by default.' };

/** Optional water-density override `density`. */
export const DENSITY_FIELD: InputFieldSpec = { name: 'density', label: 'Water density', symbol: 'rho', latex: '\\rho', type: 'number', quantity: 'density', required: false, default: WATER_DENSITY, min: 0, exclusiveMin: true, description: 'Density of the water, for power; 1000 kg/m³ by default.' };

/** Builds a positive-number input field. */
export function positiveField(name: string, label: string, symbol: string, latex: string, quantity: Quantity, description: string, extra: Partial<InputFieldSpec> = {}): InputFieldSpec {
  return { name, label, symbol, latex, type: 'number', quantity, required: true, min: 0, exclusiveMin: true, description, ...extra };
}

/** Builds a numeric output field. */
export function numberOutput(name: string, label: string, symbol: string, latex: string, quantity: Quantity, description: string, nullable = false): OutputFieldSpec {
  return nullable ? { name, label, symbol, latex, type: 'number', quantity, nullable, description } : { name, label, symbol, latex, type: 'number', quantity, description };
}

/** The typed section described by validated `shape`/`width`/`sideSlope`/`diameter` values. */
export function sectionFromValues(v: InputValues): Section {
  switch (v['shape']) {
    case 'trapezoidal':
      return { shape: 'trapezoidal', width: v['width'] as number, sideSlope: v['sideSlope'] as number };
    case 'triangular':
      return { shape: 'triangular', sideSlope: v['sideSlope'] as number };
    case 'circular':
      return { shape: 'circular', diameter: v['diameter'] as number };
    default:
      return { shape: 'rectangular', width: v['width'] as number };
  }
}

/** Total discharge from validated `discharge` or (rectangular) `unitDischarge` × `width`. */
export function dischargeFromValues(v: InputValues): number {
  return v['discharge'] !== undefined ? (v['discharge'] as number) : (v['unitDischarge'] as number) * (v['width'] as number);
}
