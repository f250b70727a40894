/**
 * The published stilling-basin families a design case is screened against: each one's
 * stated range, length, tailwater need and the sizes of its chute blocks, baffles (or floor
 * blocks) and end sill, all as multiples of the toe depth y1 and sequent depth y2.
 *
 * Sources (all from memory; the method note content/methods/stilling-basin.md lists them):
 * - Peterka, A. J., 1958 (rev. 1984), Hydraulic Design of Stilling Basins and Energy
 *   Dissipators, USBR Engineering Monograph 25: Basin I (the natural jump on a horizontal
 *   apron, length of jump L ≈ 6.1·y2), Basin II (high inflow velocity), Basin III (moderate
 *   velocity, with baffle piers) and Basin IV (the oscillating range 2.5 ≤ Fr1 ≤ 4.5).
 * - Blaisdell, F. W., 1948, Development and hydraulic design, Saint Anthony Falls stilling
 *   basin, Transactions ASCE 113, 483–520 (the SAF basin, 1.7 ≤ Fr1 ≤ 17).
 * The lengths of Basins II and III are the values Peterka's design curves approach at the
 * high end of the Froude range (4.3·y2 and 2.7·y2); lower down the curves give slightly less,
 * so these are on the long side. Pure: no I/O.
 */
import { trimmed as fmt, type Say } from './say';

/** Ids of the families, in the order of the screening table. */
export const BASIN_FAMILIES = ['natural', 'usbr2', 'usbr3', 'usbr4', 'saf'] as const;

/** One of {@link BASIN_FAMILIES}. */
export type BasinFamilyId = (typeof BASIN_FAMILIES)[number];

/** The hydraulics of one flow at the toe (SI). */
export interface ToeFlow {
  readonly y1: number;
  readonly v1: number;
  /** Discharge per unit width V1·y1, m²/s. */
  readonly q: number;
  readonly fr1: number;
  /** Sequent depth by Bélanger, m. */
  readonly y2: number;
}

/** Sizes of the basin's elements for one flow (m); null where the family has none. */
export interface BasinElements {
  readonly chuteBlockHeight: number | null;
  readonly chuteBlockWidth: number | null;
  readonly chuteBlockSpacing: number | null;
  /** Baffle piers (USBR III) or floor blocks (SAF). */
  readonly baffleHeight: number | null;
  readonly baffleWidth: number | null;
  readonly baffleSpacing: number | null;
  /** From the upstream end of the basin to the upstream face of the baffles. */
  readonly baffleDistance: number | null;
  readonly endSillHeight: number | null;
  /** Teeth of a dentated sill (USBR II). */
  readonly sillToothWidth: number | null;
  readonly sillToothSpacing: number | null;
}

/** What the method of a family gives. */
export interface BasinFamily {
  readonly id: BasinFamilyId;
  /** Name in results, e.g. "USBR III". */
  readonly label: string;
  /** The stated range, in words, in the block's units (SI with the source's US figures). */
  readonly range: (say: Say) => string;
  /** The relations used, in words. */
  readonly relations: string;
  /** Why a flow is outside the family's range, or null when it is inside. */
  readonly outside: (f: ToeFlow, say: Say) => string | null;
  /** Basin length (m). */
  readonly length: (f: ToeFlow) => number;
  /** Required tailwater as a multiple of y2. */
  readonly tailwaterFactor: (f: ToeFlow) => number;
  readonly elements: (f: ToeFlow, length: number) => BasinElements;
  /** True when the family has baffle piers or floor blocks in the jump (cavitation risk). */
  readonly baffled: boolean;
}

/** One foot in metres (exact, NIST SP 811, 2008, Appendix B). */
const FT = 0.3048;

/** Limits of the stated ranges (SI; the source's US figures in the comments). */
export const BASIN_LIMITS = {
  /** Below this the jump is undular and no basin family applies. */
  frMin: 1.7,
  /** Oscillating range of Basin IV. */
  oscillatingMin: 2.5,
  oscillatingMax: 4.5,
  /** Basin III inflow velocity limit, 60 ft/s (the source's figure, converted exactly). */
  usbr3Velocity: 60 * FT,
  /** Basin III unit discharge limit, 200 ft²/s. */
  usbr3UnitDischarge: 200 * FT * FT,
  /** Basin II unit discharge limit, 500 ft²/s. */
  usbr2UnitDischarge: 500 * FT * FT,
  /** SAF upper Froude number. */
  safFrMax: 17,
} as const;

const L = BASIN_LIMITS;
const none = { chuteBlockHeight: null, chuteBlockWidth: null, chuteBlockSpacing: null, baffleHeight: null, baffleWidth: null, baffleSpacing: null, baffleDistance: null, endSillHeight: null, sillToothWidth: null, sillToothSpacing: null } as const;

// Four figures, so that a Froude number just past a limit never reads as the limit itself.
const below = (f: ToeFlow, min: number) => (f.fr1 < min ? `Fr1 = ${fmt(f.fr1, 4)} is below ${min}` : null);
const above = (f: ToeFlow, max: number) => (f.fr1 > max ? `Fr1 = ${fmt(f.fr1, 4)} is above ${max}` : null);

/** Natural-jump length on a horizontal apron, Peterka 1958, Basin I: L ≈ 6.1·y2. */
const NATURAL_LENGTH = 6.1;

/** The families, keyed by id. */
export const FAMILIES: Readonly<Record<BasinFamilyId, BasinFamily>> = {
  natural: {
    id: 'natural',
    label: 'Natural jump (USBR I)',
    range: () => `Fr1 ≥ ${L.frMin}`,
    relations: `L = ${NATURAL_LENGTH}·y2; TW = 1.0·y2; no blocks or sill`,
    outside: (f) => below(f, L.frMin),
    length: (f) => NATURAL_LENGTH * f.y2,
    tailwaterFactor: () => 1,
    elements: () => none,
    baffled: false,
  },
  usbr2: {
    id: 'usbr2',
    label: 'USBR II',
    range: (say) => `Fr1 ≥ ${L.oscillatingMax}, q ≤ ${say.limit(L.usbr2UnitDischarge, 'unitDischarge', '500 ft²/s')}; for V1 above ${say.limit(L.usbr3Velocity, 'velocity', '60 ft/s')}`,
    relations: 'L = 4.3·y2; TW = 1.05·y2; chute blocks h = w = s = y1; dentated sill h = 0.2·y2, teeth w = s = 0.15·y2',
    outside: (f, say) => below(f, L.oscillatingMax) ?? (f.q > L.usbr2UnitDischarge ? `q = ${say(f.q, 'unitDischarge', 4)} is above ${say.limit(L.usbr2UnitDischarge, 'unitDischarge', '500 ft²/s')}` : null),
    length: (f) => 4.3 * f.y2,
    tailwaterFactor: () => 1.05,
    elements: (f) => ({ ...none, chuteBlockHeight: f.y1, chuteBlockWidth: f.y1, chuteBlockSpacing: f.y1, endSillHeight: 0.2 * f.y2, sillToothWidth: 0.15 * f.y2, sillToothSpacing: 0.15 * f.y2 }),
    baffled: false,
  },
  usbr3: {
    id: 'usbr3',
    label: 'USBR III',
    range: (say) => `Fr1 ≥ ${L.oscillatingMax}, V1 ≤ ${say.limit(L.usbr3Velocity, 'velocity', '60 ft/s')}, q ≤ ${say.limit(L.usbr3UnitDischarge, 'unitDischarge', '200 ft²/s')}`,
    relations: 'L = 2.7·y2; TW = 1.0·y2; chute blocks h = w = s = y1; baffle piers h3 = y1(0.168·Fr1 + 0.63), w = s = 0.75·h3, at 0.8·y2; end sill h4 = y1(1 + Fr1/18)',
    outside: (f, say) =>
      below(f, L.oscillatingMax) ??
      (f.v1 > L.usbr3Velocity ? `V1 = ${say(f.v1, 'velocity', 4)} is above ${say.limit(L.usbr3Velocity, 'velocity', '60 ft/s')} (baffle piers would cavitate)` : null) ??
      (f.q > L.usbr3UnitDischarge ? `q = ${say(f.q, 'unitDischarge', 4)} is above ${say.limit(L.usbr3UnitDischarge, 'unitDischarge', '200 ft²/s')}` : null),
    length: (f) => 2.7 * f.y2,
    tailwaterFactor: () => 1,
    elements: (f) => {
      const h3 = f.y1 * (0.168 * f.fr1 + 0.63);
      return { ...none, chuteBlockHeight: f.y1, chuteBlockWidth: f.y1, chuteBlockSpacing: f.y1, baffleHeight: h3, baffleWidth: 0.75 * h3, baffleSpacing: 0.75 * h3, baffleDistance: 0.8 * f.y2, endSillHeight: f.y1 * (1 + f.fr1 / 18) };
    },
    baffled: true,
  },
  usbr4: {
    id: 'usbr4',
    label: 'USBR IV',
    range: () => `${L.oscillatingMin} ≤ Fr1 ≤ ${L.oscillatingMax}`,
    relations: `L = ${NATURAL_LENGTH}·y2; TW = 1.1·y2; chute blocks h = 2·y1, w = y1, s = 2.5·y1; end sill h = 1.25·y1`,
    outside: (f) => below(f, L.oscillatingMin) ?? above(f, L.oscillatingMax),
    length: (f) => NATURAL_LENGTH * f.y2,
    tailwaterFactor: () => 1.1,
    elements: (f) => ({ ...none, chuteBlockHeight: 2 * f.y1, chuteBlockWidth: f.y1, chuteBlockSpacing: 2.5 * f.y1, endSillHeight: 1.25 * f.y1 }),
    baffled: false,
  },
  saf: {
    id: 'saf',
    label: 'SAF',
    range: () => `${L.frMin} ≤ Fr1 ≤ ${L.safFrMax}; small structures`,
    relations: 'L = 4.5·y2/Fr1^0.76; TW = (1.10 − Fr1²/120)·y2 to Fr1 5.5, 0.85·y2 to 11, (1.00 − Fr1²/800)·y2 to 17; chute and floor blocks h = y1, w = s = 0.75·y1, floor blocks at L/3; end sill h = 0.07·y2',
    outside: (f) => below(f, L.frMin) ?? above(f, L.safFrMax),
    length: (f) => (4.5 * f.y2) / f.fr1 ** 0.76,
    tailwaterFactor: (f) => safTailwaterFactor(f.fr1),
    elements: (f, length) => ({ ...none, chuteBlockHeight: f.y1, chuteBlockWidth: 0.75 * f.y1, chuteBlockSpacing: 0.75 * f.y1, baffleHeight: f.y1, baffleWidth: 0.75 * f.y1, baffleSpacing: 0.75 * f.y1, baffleDistance: length / 3, endSillHeight: 0.07 * f.y2 }),
    baffled: true,
  },
};

/** SAF tailwater factor TW/y2 (Blaisdell 1948), by Froude range; held at the range's ends outside 1.7–17. */
export function safTailwaterFactor(froude: number): number {
  const fr1 = Math.min(Math.max(froude, L.frMin), L.safFrMax);
  if (fr1 <= 5.5) return 1.1 - (fr1 * fr1) / 120;
  if (fr1 <= 11) return 0.85;
  return 1 - (fr1 * fr1) / 800;
}

/** The USBR monograph's own selection: the first family every flow fits. SAF (small structures) only when asked for. */
export const SELECTION_ORDER: readonly BasinFamilyId[] = ['usbr3', 'usbr2', 'usbr4', 'natural'];
