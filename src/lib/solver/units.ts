/**
 * Units of measure: SI and US customary, converted by exact factors to SI.
 * Source: Thompson, A. and Taylor, B. N., 2008, Guide for the Use of the International System
 * of Units (SI), NIST Special Publication 811, App. B (1 ft = 0.3048 m exactly,
 * 1 lb = 0.45359237 kg exactly, 1 hp (550 ft·lbf/s) = 745.69987158227 W, gn = 9.80665 m/s²).
 *
 * Manning's n is carried as the SI coefficient (s/m^(1/3)); the US form Q = (1.486/n)·A·R^(2/3)·S^(1/2)
 * uses the same n because 1.486 ≈ (1 m / 0.3048 m)^(1/3), so n needs no conversion.
 */
import type { Quantity } from './quantity';
import { fail, type SolverResult, succeed } from './result';

/** Unit systems for display. */
export const UNIT_SYSTEMS = ['SI', 'US'] as const;

/** One of {@link UNIT_SYSTEMS}. */
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

/** A unit: `valueSI = value × factor`. */
export interface UnitDefinition {
  /** Canonical symbol, ASCII, e.g. `"m3/s"`. */
  readonly symbol: string;
  /** Symbol for display, e.g. `"m³/s"`. */
  readonly display: string;
  /** Quantity measured. */
  readonly quantity: Quantity;
  /** Multiply by this to get SI. */
  readonly factor: number;
  /** System the unit belongs to; `both` for dimensionless ratios and time. */
  readonly system: UnitSystem | 'both';
  /** Other accepted spellings (matched after normalisation). */
  readonly aliases: readonly string[];
  /** When true only exact-case spellings match (kW vs mW…). */
  readonly caseSensitive?: boolean;
}

const FT = 0.3048;
const LB = 0.45359237;
const GN = 9.80665;

const u = (
  symbol: string,
  display: string,
  quantity: Quantity,
  factor: number,
  system: UnitSystem | 'both',
  aliases: readonly string[] = [],
  caseSensitive = false,
): UnitDefinition => ({ symbol, display, quantity, factor, system, aliases, caseSensitive });

/** The unit table. Small on purpose: each entry is tested. */
export const UNITS: readonly UnitDefinition[] = [
  u('m', 'm', 'length', 1, 'SI', ['meter', 'metre', 'meters', 'metres']),
  u('mm', 'mm', 'length', 1e-3, 'SI'),
  u('cm', 'cm', 'length', 1e-2, 'SI'),
  u('km', 'km', 'length', 1e3, 'SI'),
  u('ft', 'ft', 'length', FT, 'US', ['foot', 'feet']),
  u('in', 'in', 'length', FT / 12, 'US', ['inch', 'inches']),
  u('m2', 'm²', 'area', 1, 'SI'),
  u('ft2', 'ft²', 'area', FT * FT, 'US', ['sqft']),
  u('m3', 'm³', 'volume', 1, 'SI'),
  u('ft3', 'ft³', 'volume', FT ** 3, 'US'),
  u('m3/s', 'm³/s', 'discharge', 1, 'SI', ['cumec', 'cumecs', 'cms']),
  u('L/s', 'L/s', 'discharge', 1e-3, 'SI', ['l/s', 'lps']),
  u('cfs', 'ft³/s', 'discharge', FT ** 3, 'US', ['ft3/s', 'cusec', 'cusecs']),
  u('m2/s', 'm²/s', 'unitDischarge', 1, 'SI', ['m3/s/m']),
  u('L/s/m', 'L/s/m', 'unitDischarge', 1e-3, 'SI', ['l/s/m']),
  u('ft2/s', 'ft²/s', 'unitDischarge', FT * FT, 'US', ['cfs/ft', 'ft3/s/ft']),
  u('m/s', 'm/s', 'velocity', 1, 'SI'),
  u('ft/s', 'ft/s', 'velocity', FT, 'US', ['fps']),
  u('W', 'W', 'power', 1, 'SI', [], true),
  u('kW', 'kW', 'power', 1e3, 'SI', [], true),
  u('MW', 'MW', 'power', 1e6, 'SI', [], true),
  u('hp', 'hp', 'power', (550 * FT * LB * GN), 'US'),
  u('m/s2', 'm/s²', 'acceleration', 1, 'SI'),
  u('ft/s2', 'ft/s²', 'acceleration', FT, 'US'),
  u('kg/m3', 'kg/m³', 'density', 1, 'SI'),
  u('lb/ft3', 'lb/ft³', 'density', LB / FT ** 3, 'US', ['lbm/ft3', 'pcf']),
  u('slug/ft3', 'slug/ft³', 'density', (LB * GN) / FT / FT ** 3, 'US'),
  u('m/m', 'm/m', 'slope', 1, 'SI'),
  u('ft/ft', 'ft/ft', 'slope', 1, 'US'),
  u('%', '%', 'slope', 0.01, 'both', ['percent']),
  u('s/m^(1/3)', 's/m^(1/3)', 'manningN', 1, 'both', ['s/m1/3', 's·m^-1/3']),
  u('s', 's', 'time', 1, 'both', ['sec']),
  u('min', 'min', 'time', 60, 'both'),
  u('h', 'h', 'time', 3600, 'both', ['hr']),
  u('-', '', 'dimensionless', 1, 'both', ['']),
];

/** Display unit per quantity and system. Power shows in kW / hp, everything else in base units. */
const DISPLAY: Readonly<Record<UnitSystem, Readonly<Partial<Record<Quantity, string>>>>> = {
  SI: {
    length: 'm', area: 'm2', volume: 'm3', discharge: 'm3/s', unitDischarge: 'm2/s', velocity: 'm/s',
    power: 'kW', acceleration: 'm/s2', density: 'kg/m3', slope: 'm/m', manningN: 's/m^(1/3)', time: 's',
    dimensionless: '-',
  },
  US: {
    length: 'ft', area: 'ft2', volume: 'ft3', discharge: 'cfs', unitDischarge: 'ft2/s', velocity: 'ft/s',
    power: 'hp', acceleration: 'ft/s2', density: 'lb/ft3', slope: 'ft/ft', manningN: 's/m^(1/3)', time: 's',
    dimensionless: '-',
  },
};

function normalise(text: string): string {
  return text
    .trim()
    .replace(/\s+/g, '')
    .replace(/²/g, '2')
    .replace(/³/g, '3')
    .replace(/\^(?=\d)/g, '')
    .replace(/\/sec$/, '/s');
}

const spellings = (unit: UnitDefinition): string[] => [unit.symbol, unit.display, ...unit.aliases].map(normalise);

/**
 * Parses a unit string (`"m3/s"`, `"m³/s"`, `"cumec"`, `"cfs"`, `"ft3/s"`, `"kW"`, `"%"`…),
 * optionally requiring a quantity. Exact-case matches win; a case-insensitive match is
 * accepted only for units that are not case-sensitive (so `"mW"` never becomes megawatts).
 *
 * @example parseUnit('ft³/s', 'discharge') // ok: cfs, factor 0.028316846592
 */
export function parseUnit(text: string, quantity?: Quantity): SolverResult<UnitDefinition> {
  if (typeof text !== 'string') throw new RangeError('parseUnit: text must be a string');
  const key = normalise(text);
  const pool = quantity === undefined ? UNITS : UNITS.filter((x) => x.quantity === quantity);
  const exact = pool.find((x) => spellings(x).includes(key));
  const loose = exact ?? pool.find((x) => !x.caseSensitive && spellings(x).some((s) => s.toLowerCase() === key.toLowerCase()));
  if (loose) return succeed(loose);
  const other = quantity === undefined ? undefined : UNITS.find((x) => spellings(x).includes(key));
  if (other) {
    return fail('unit-mismatch', `"${text}" is a unit of ${other.quantity}, but a ${quantity} is expected (e.g. ${unitsFor(quantity as Quantity).map((x) => x.display || x.symbol).join(', ')}).`);
  }
  const known = pool.map((x) => x.symbol).join(', ');
  return fail('unknown-unit', `Unknown unit "${text}"${quantity ? ` for ${quantity}` : ''}. Known: ${known}.`);
}

/** Units measuring `quantity`. */
export function unitsFor(quantity: Quantity): readonly UnitDefinition[] {
  return UNITS.filter((x) => x.quantity === quantity);
}

/** Converts a value in `unit` to SI. */
export function toSI(value: number, unit: UnitDefinition): number {
  return value * unit.factor;
}

/** Converts an SI value to `unit`. */
export function fromSI(valueSI: number, unit: UnitDefinition): number {
  return valueSI / unit.factor;
}

/** Preferred display unit of `quantity` in `system`; `undefined` for `text`. */
export function displayUnit(quantity: Quantity, system: UnitSystem): UnitDefinition | undefined {
  const symbol = DISPLAY[system][quantity];
  return symbol === undefined ? undefined : UNITS.find((x) => x.symbol === symbol);
}
