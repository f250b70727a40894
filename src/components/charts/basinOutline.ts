/**
 * Geometry of the basin outline of a `stilling-basin` block: the chute coming down to the
 * toe, the apron of length LB with its chute blocks, baffles and end sill (sized for the
 * design flow), the downstream bed, the schematic jump of the governing flow and its
 * tailwater. True to scale when it reads, otherwise with the vertical scale exaggerated
 * (and said so by `scaleNote`). Pure; SI metres in (x from the toe, z above the apron),
 * pixels out.
 *
 * Drawing conventions (the block does not give these): the chute's last stretch slopes
 * 1V:2H; a chute block is drawn 2·h1 long along the flow, a baffle as long as it is wide;
 * the end sill has a 1V:2H upstream face and a top 0.4·h4 long, its downstream face at LB;
 * the slots of a dentated sill are a dashed line at half its height; the downstream bed is
 * drawn at apron level (depths are measured above the apron).
 */
import type { BlockResult } from '../../lib/calc';
import { siNumber } from './chartMath';
import type { Box } from './jumpProfile';

/** What the outline needs of a solved basin block, SI metres; null sizes where the family has none. */
export interface BasinOutlineInput {
  readonly basinLength: number;
  readonly governingY1: number;
  readonly governingY2: number;
  readonly tailwater: number;
  readonly requiredTailwater: number | null;
  readonly margin: number | null;
  readonly chuteBlockHeight: number | null;
  readonly baffleHeight: number | null;
  readonly baffleWidth: number | null;
  readonly baffleDistance: number | null;
  readonly endSillHeight: number | null;
  /** Not null for a dentated sill. */
  readonly sillToothWidth: number | null;
}

/** A point [x, z] in metres. */
export type Point = readonly [number, number];

/** A label under the bed, centred (or anchored) at `x` metres, in row `row` from the bed down. */
export interface RowLabel {
  readonly key: 'chute' | 'baffle' | 'sill';
  readonly x: number;
  readonly anchor: 'start' | 'middle' | 'end';
  readonly row: number;
}

/** The laid-out outline. */
export interface BasinOutlineLayout {
  readonly sx: number;
  readonly sy: number;
  /** sy / sx: 1 is true to scale. */
  readonly exaggeration: number;
  /** Always true here (the basin length is known); for `scaleNote`. */
  readonly lengthKnown: true;
  /** Channel drawn, metres from the toe (xMin < 0 is the chute). */
  readonly xMin: number;
  readonly xMax: number;
  /** Highest level drawn, m above the apron. */
  readonly zMax: number;
  /** Chute floor, from the left edge to the toe. */
  readonly chute: readonly [Point, Point];
  /** Outlines of the elements (closed polygons), absent where the family has none. */
  readonly chuteBlock: readonly Point[] | null;
  readonly baffle: readonly Point[] | null;
  readonly sill: readonly Point[] | null;
  /** Level of the slots between the teeth of a dentated sill (a dashed hidden line), else null. */
  readonly sillSlotLevel: number | null;
  /** Water surface of the governing flow: on the chute at y1, then rising to y2 at the sill. */
  readonly surface: readonly Point[];
  /** Labels of the element heights, stacked in rows so they never overlap. */
  readonly labels: readonly RowLabel[];
  readonly px: (x: number) => number;
  readonly py: (z: number) => number;
}

/** Drawing box of the chart (pixels): the left edge, bed line, and the most width and height. */
export const BASIN_BOX: Box = { left: 24, bed: 256, width: 592, height: 200 };
/** Below this height (px) of the highest level the vertical scale is exaggerated to reach it. */
const MIN_HEIGHT = 64;
/** A smaller exaggeration than this is not worth a drawing off scale. */
const MIN_EXAGGERATION = 1.25;
/** Room (px) downstream of the sill for the tailwater labels. */
const LABEL_ROOM = 150;
/** Estimated width (px) of one character of an 11 px label (Source Sans 3 runs about 5.5). */
export const CHAR_WIDTH = 6;

const finite = (x: number | null): x is number => x !== null && Number.isFinite(x) && x > 0;

/** The outline input of a solved stilling-basin block; null without a family, length or depths. */
export function basinOutlineInput(block: BlockResult): BasinOutlineInput | null {
  if (block.status !== 'ok' || block.kind !== 'stilling-basin') return null;
  const family = block.outputs.find((o) => o.name === 'family')?.si;
  if (typeof family !== 'string' || family === 'none') return null;
  const n = (name: string) => siNumber(block.outputs, name) ?? null;
  const [basinLength, governingY1, governingY2, tailwater] = [n('basinLength'), n('governingY1'), n('governingY2'), n('tailwater')];
  if (basinLength === null || governingY1 === null || governingY2 === null || tailwater === null) return null;
  return {
    basinLength, governingY1, governingY2, tailwater,
    requiredTailwater: n('requiredTailwater'), margin: n('margin'),
    chuteBlockHeight: n('chuteBlockHeight'), baffleHeight: n('baffleHeight'), baffleWidth: n('baffleWidth'), baffleDistance: n('baffleDistance'),
    endSillHeight: n('endSillHeight'), sillToothWidth: n('sillToothWidth'),
  };
}

const rect = (x0: number, x1: number, h: number): Point[] => [[x0, 0], [x0, h], [x1, h], [x1, 0]];

/**
 * Puts each label in the first row (from the bed down) where its estimated extent clears
 * the labels already there by `gap` px.
 */
export function stackLabels(items: readonly { key: RowLabel['key']; x: number; anchor: RowLabel['anchor']; width: number }[], px: (x: number) => number, gap = 10): RowLabel[] {
  const placed: { row: number; lo: number; hi: number }[] = [];
  return items.map((it) => {
    const c = px(it.x);
    const lo = it.anchor === 'start' ? c : it.anchor === 'end' ? c - it.width : c - it.width / 2;
    const hi = lo + it.width;
    let row = 0;
    while (placed.some((p) => p.row === row && lo < p.hi + gap && hi > p.lo - gap)) row += 1;
    placed.push({ row, lo, hi });
    return { key: it.key, x: it.x, anchor: it.anchor, row };
  });
}

/**
 * Lays out the outline in `box`; null when the length or depths are missing, not finite
 * or not positive, or the governing jump does not rise (y2 ≤ y1). `labelChars` are the
 * lengths of the element labels (the component's texts), for stacking them.
 */
export function basinOutlineLayout(input: BasinOutlineInput, box: Box = BASIN_BOX, labelChars: Partial<Record<RowLabel['key'], number>> = {}): BasinOutlineLayout | null {
  const { basinLength: LB, governingY1: y1, governingY2: y2, tailwater: tw } = input;
  if (![LB, y1, y2, tw].every((v) => finite(v)) || !(y2 > y1)) return null;
  const h1 = finite(input.chuteBlockHeight) ? input.chuteBlockHeight : null;
  const h4 = finite(input.endSillHeight) ? input.endSillHeight : null;
  // The sill's sloping face starts 2.4·h4 before the basin end, never before the toe.
  const sillFoot = h4 === null ? LB : Math.max(0, LB - 2.4 * h4);
  const baffle = finite(input.baffleHeight) && finite(input.baffleWidth) && finite(input.baffleDistance) && input.baffleDistance + input.baffleWidth <= sillFoot ? { h: input.baffleHeight, w: input.baffleWidth, x: input.baffleDistance } : null;
  const required = finite(input.requiredTailwater) ? input.requiredTailwater : null;
  const zMax = 1.08 * Math.max(y2, tw, required ?? 0, h1 ?? 0, h4 ?? 0, baffle?.h ?? 0);

  // Horizontal extent: the chute (at most its full height at 1V:2H) and a downstream reach
  // long enough for the tailwater labels.
  let upstream = Math.min(Math.max(0.18 * LB, 0.8 * zMax), 2 * zMax);
  let downstream = Math.max(0.3 * LB, 1.2 * zMax);
  let sx = box.width / (upstream + LB + downstream);
  if (downstream * sx < LABEL_ROOM) {
    downstream = (LABEL_ROOM * (upstream + LB)) / (box.width - LABEL_ROOM);
    sx = box.width / (upstream + LB + downstream);
  }
  let sy = sx;
  if (zMax * sx > box.height) {
    // Deep and short: keep the scale true and give the spare width to the chute, then downstream.
    sx = sy = box.height / zMax;
    const spare = box.width / sx - (upstream + LB + downstream);
    const more = Math.min(spare, 2 * zMax - upstream);
    upstream += more;
    downstream += spare - more;
  } else if (MIN_HEIGHT / (zMax * sx) > MIN_EXAGGERATION) {
    sy = MIN_HEIGHT / zMax;
  }
  const xMin = -upstream;
  const xMax = LB + downstream;
  const chuteTop = upstream / 2;

  const surface: Point[] = [[xMin, chuteTop + y1], [0, y1]];
  const samples = 40;
  for (let i = 1; i <= samples; i += 1) {
    const u = i / samples;
    surface.push([u * LB, y1 + (y2 - y1) * (1 - (1 - u) ** 2)]);
  }

  const sill: Point[] | null = h4 === null ? null : [[sillFoot, 0], [Math.max(sillFoot, LB - 0.4 * h4), h4], [LB, h4], [LB, 0]];
  const px = (x: number) => box.left + (x - xMin) * sx;
  const items = [
    ...(h1 !== null ? [{ key: 'chute' as const, x: 0, anchor: 'start' as const }] : []),
    ...(baffle ? [{ key: 'baffle' as const, x: baffle.x + baffle.w / 2, anchor: 'middle' as const }] : []),
    ...(h4 !== null ? [{ key: 'sill' as const, x: LB, anchor: 'end' as const }] : []),
  ].map((it) => ({ ...it, width: (labelChars[it.key] ?? 16) * CHAR_WIDTH }));
  return {
    sx,
    sy,
    exaggeration: sy / sx,
    lengthKnown: true,
    xMin,
    xMax,
    zMax,
    chute: [[xMin, chuteTop], [0, 0]],
    chuteBlock: h1 === null ? null : rect(0, 2 * h1, h1),
    baffle: baffle ? rect(baffle.x, baffle.x + baffle.w, baffle.h) : null,
    sill,
    sillSlotLevel: h4 !== null && input.sillToothWidth !== null && Number.isFinite(input.sillToothWidth) ? h4 / 2 : null,
    surface,
    labels: stackLabels(items, px),
    px,
    py: (z) => box.bed - z * sy,
  };
}
