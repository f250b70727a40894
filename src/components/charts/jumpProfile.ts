/**
 * Geometry of the jump profile sketch: how a jump of depths y1 → y2 and length Lj fits a
 * drawing box, true to scale when it reads well, otherwise with the vertical scale
 * exaggerated (and said so). The surface rises over the roller and is level behind it — a
 * schematic, not a measured profile. Pure; SI metres in, pixels out.
 */

/** What the sketch needs of a jump, SI metres. */
export interface JumpProfileInput {
  readonly y1: number;
  readonly y2: number;
  /** Jump length Lj; when missing the sketch uses 6.1·y2 and says it is not to scale. */
  readonly jumpLength?: number;
  /** Roller length Lr; 0.75·Lj when missing. */
  readonly rollerLength?: number;
}

/** The drawing area, pixels. */
export interface Box {
  readonly left: number;
  readonly bed: number;
  readonly width: number;
  readonly height: number;
}

/** The laid-out sketch. */
export interface JumpProfileLayout {
  /** Pixels per metre along the channel and in depth. */
  readonly sx: number;
  readonly sy: number;
  /** sy / sx: 1 is true to scale. */
  readonly exaggeration: number;
  /** True when Lj came from the block (not the 6.1·y2 stand-in). */
  readonly lengthKnown: boolean;
  readonly jumpLength: number;
  readonly rollerLength: number;
  /** Channel distance of the toe from the left edge, m. */
  readonly toe: number;
  /** Channel length drawn, m. */
  readonly length: number;
  /** Water surface as [x, depth] in metres, from the left edge. */
  readonly surface: readonly (readonly [number, number])[];
  /** Maps metres to pixels. */
  readonly px: (x: number) => number;
  readonly py: (depth: number) => number;
}

/** Share of the box height the downstream depth should fill at least, and when exaggerated. */
const MIN_FILL = 0.35;
const EXAGGERATED_FILL = 0.62;

/** Lays out the sketch in `box`; null when the depths cannot make a jump (y2 ≤ y1, non-finite). */
export function jumpProfileLayout(input: JumpProfileInput, box: Box, samples = 48): JumpProfileLayout | null {
  const { y1, y2 } = input;
  if (!(Number.isFinite(y1) && Number.isFinite(y2) && y1 > 0 && y2 > y1)) return null;
  const lengthKnown = typeof input.jumpLength === 'number' && Number.isFinite(input.jumpLength) && input.jumpLength > 0;
  const jumpLength = lengthKnown ? input.jumpLength! : 6.1 * y2;
  const roller = input.rollerLength;
  const rollerLength = typeof roller === 'number' && Number.isFinite(roller) && roller > 0 ? Math.min(roller, jumpLength) : 0.75 * jumpLength;
  const toe = 0.3 * jumpLength;
  const length = toe + jumpLength * 1.35;
  const sx = box.width / length;
  const trueHeight = y2 * sx;
  let sy = sx;
  if (trueHeight > box.height * 0.9) sy = (box.height * 0.9) / y2;
  else if (trueHeight < box.height * MIN_FILL) sy = (box.height * EXAGGERATED_FILL) / y2;
  const surface: [number, number][] = [[0, y1], [toe, y1]];
  for (let i = 1; i <= samples; i += 1) {
    const u = i / samples;
    surface.push([toe + u * rollerLength, y1 + (y2 - y1) * (1 - (1 - u) ** 2)]);
  }
  surface.push([length, y2]);
  return {
    sx,
    sy,
    exaggeration: sy / sx,
    lengthKnown,
    jumpLength,
    rollerLength,
    toe,
    length,
    surface,
    px: (x) => box.left + x * sx,
    py: (depth) => box.bed - depth * sy,
  };
}

/** The scale note of a layout: `To scale`, `Vertical scale exaggerated ×2.4` … */
export function scaleNote(layout: Pick<JumpProfileLayout, 'exaggeration' | 'lengthKnown'>): string {
  if (!layout.lengthKnown) return 'Schematic: jump length not known, not to scale';
  const e = layout.exaggeration;
  if (Math.abs(e - 1) < 0.02) return 'To scale';
  const factor = e >= 10 ? e.toFixed(0) : e.toFixed(1);
  return e > 1 ? `Vertical scale exaggerated ×${factor}` : `Vertical scale reduced ×${factor}`;
}
