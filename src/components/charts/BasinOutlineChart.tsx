/**
 * Side view of a `stilling-basin` block: the basin outline sized for the design flow (chute,
 * chute blocks, baffles, end sill, apron length LB dimensioned), with the schematic jump of
 * the governing flow, its tailwater and the tailwater the family needs (dashed). A tailwater
 * below the need is shaded and flagged. To scale when that reads; otherwise it says how the
 * vertical scale is exaggerated. Geometry in basinOutline.ts.
 */
import { line } from 'd3-shape';
import { useId } from 'react';
import type { BlockResult } from '../../lib/calc';
import { basinOutlineInput, basinOutlineLayout, BASIN_BOX, type BasinOutlineInput, type Point, type RowLabel } from './basinOutline';
import { CHART_FONT, chartUnit, formatShort, PALETTE, siNumber } from './chartMath';
import { scaleNote } from './jumpProfile';

/** Props of {@link BasinOutlineChart}. */
export interface BasinOutlineChartProps {
  /** A solved `stilling-basin` block; nothing renders without a family or a basin length. */
  readonly block: BlockResult;
}

const WIDTH = 640;
const text = { fontFamily: CHART_FONT, fontSize: 11 } as const;
/** Drawn on top of water and lines, the labels keep a paper-coloured halo. */
const halo = { stroke: 'white', strokeWidth: 3, strokeLinejoin: 'round', paintOrder: 'stroke' } as const;

function Dimension({ x1, x2, y }: { x1: number; x2: number; y: number }) {
  return (
    <g stroke={PALETTE.ink} strokeWidth={0.9}>
      <line x1={x1} y1={y} x2={x2} y2={y} />
      <line x1={x1} x2={x1} y1={y - 4} y2={y + 4} />
      <line x1={x2} x2={x2} y1={y - 4} y2={y + 4} />
    </g>
  );
}

/** The texts of the element labels, by key. */
function elementTexts(block: BlockResult, input: BasinOutlineInput, len: (v: number) => string): Record<RowLabel['key'], string> {
  const family = block.outputs.find((o) => o.name === 'family')?.si;
  return {
    chute: `chute blocks h1 = ${input.chuteBlockHeight !== null ? len(input.chuteBlockHeight) : ''}`,
    baffle: `${family === 'SAF' ? 'floor blocks' : 'baffle piers'} h3 = ${input.baffleHeight !== null ? len(input.baffleHeight) : ''}`,
    sill: `${input.sillToothWidth !== null ? 'dentated sill' : 'end sill'} h4 = ${input.endSillHeight !== null ? len(input.endSillHeight) : ''}`,
  };
}

/** Hatching under a floor line from (x0, y0) to (x1, y1), pixels. */
function hatch(x0: number, y0: number, x1: number, y1: number, key: string) {
  const out = [];
  const n = Math.max(1, Math.floor((x1 - x0) / 12));
  for (let i = 0; i < n; i += 1) {
    const x = x0 + 4 + i * 12;
    const y = y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
    out.push(<line key={`${key}${i}`} x1={x} y1={y} x2={x - 7} y2={y + 7} />);
  }
  return out;
}

/** The outline, jump and tailwater of a stilling-basin block; null when there is nothing to draw. */
export function BasinOutlineChart({ block }: BasinOutlineChartProps) {
  const id = useId();
  const input = basinOutlineInput(block);
  if (!input) return null;
  const unit = chartUnit('length', block.unitSystem);
  const q = chartUnit('discharge', block.unitSystem);
  const len = (v: number) => `${formatShort(v / unit.factor)} ${unit.label}`;
  const texts = elementTexts(block, input, len);
  const layout = basinOutlineLayout(input, BASIN_BOX, { chute: texts.chute.length, baffle: texts.baffle.length, sill: texts.sill.length });
  if (!layout) return null;
  // Coordinates to 0.01 px: the markup of a chart is a good part of a reading page's weight.
  const at = (v: number) => Math.round(v * 100) / 100;
  const px = (x: number) => at(layout.px(x));
  const py = (z: number) => at(layout.py(z));
  const bed = py(0);
  const LB = input.basinLength;
  const path = (pts: readonly Point[], close = false) => `${line()(pts.map(([x, z]) => [px(x), py(z)] as [number, number])) ?? ''}${close ? 'Z' : ''}`;
  const rows = Math.max(0, ...layout.labels.map((l) => l.row + 1));
  const rowY = (r: number) => bed + 24 + r * 15;
  const x3y = rowY(rows) + 4;
  const lbY = layout.baffle ? x3y + 32 : x3y;
  const height = lbY + 34;
  const required = input.requiredTailwater;
  const short = input.margin !== null && input.margin < 0;
  // Room above the highest level for the notes: one line, or two with the shortfall flag.
  const top = Math.max(0, Math.floor(py(layout.zMax) - (short ? 56 : 40)));
  const note = scaleNote(layout);
  const qg = siNumber(block.outputs, 'governingDischarge');
  const flowName = qg !== undefined ? ` at Q = ${formatShort(qg / q.factor)} ${q.label}` : '';
  const water = `${path(layout.surface)}L${px(LB)},${bed}L${px(0)},${bed}L${px(layout.xMin)},${py(layout.chute[0][1])}Z`;
  const downstream = (z: number) => `M${px(LB)},${py(z)}L${px(layout.xMax)},${py(z)}`;
  // The upper of the two tailwater lines takes its label above, the lower below: they never overlap.
  const twAbove = required === null || input.tailwater >= required;
  const mid = Math.round(layout.surface.length * 0.55);
  const [jx, jz] = layout.surface[mid]!;
  const summary = short
    ? `The tailwater TW = ${len(input.tailwater)} is short of the ${len(required!)} the basin needs by ${len(-input.margin!)}${flowName}: the jump sweeps out.`
    : required !== null
      ? `The tailwater TW = ${len(input.tailwater)} meets the ${len(required)} the basin needs${flowName}.`
      : `The tailwater is TW = ${len(input.tailwater)}.`;
  return (
    <svg viewBox={`0 ${top} ${WIDTH} ${height - top}`} width="100%" role="img" aria-labelledby={`${id}t ${id}d`} className="block h-auto max-w-full">
      <title id={`${id}t`}>{`Side view of the stilling basin${block.name ? `, block ${block.name}` : ''}`}</title>
      <desc id={`${id}d`}>
        {`Basin floor LB = ${len(LB)} from the toe to the end of the sill, ${[
          input.chuteBlockHeight !== null ? texts.chute : null,
          layout.baffle ? `${texts.baffle} at ${len(input.baffleDistance!)} from the toe` : null,
          input.endSillHeight !== null ? texts.sill : null,
        ].filter(Boolean).join(', ') || 'no blocks or sill'}. Schematic jump of the governing flow from y1 = ${len(input.governingY1)} to y2 = ${len(input.governingY2)}. ${summary} ${note}.`}
      </desc>
      <path d={water} fill={PALETTE.tailwaterWash} stroke="none" />
      <path d={`${downstream(input.tailwater)}L${px(layout.xMax)},${bed}L${px(LB)},${bed}Z`} fill={PALETTE.tailwaterWash} stroke="none" />
      {short && <path d={`M${px(LB)},${py(input.tailwater)}L${px(layout.xMax)},${py(input.tailwater)}L${px(layout.xMax)},${py(required!)}L${px(LB)},${py(required!)}Z`} fill={PALETTE.fault} fillOpacity={0.16} stroke="none" />}
      <path d={path(layout.surface)} fill="none" stroke={PALETTE.tailwater} strokeWidth={1.75} />
      <g stroke={PALETTE.inkSoft} strokeWidth={0.75}>
        {hatch(px(layout.xMin), py(layout.chute[0][1]), px(0), bed, 'c')}
        {hatch(px(0), bed, px(layout.xMax), bed, 'b')}
      </g>
      <path d={`${path(layout.chute)}L${px(layout.xMax)},${bed}`} fill="none" stroke={PALETTE.ink} strokeWidth={1.5} />
      <g fill={PALETTE.paperDeep} stroke={PALETTE.ink} strokeWidth={1.1}>
        {layout.chuteBlock && <path d={path(layout.chuteBlock, true)} />}
        {layout.baffle && <path d={path(layout.baffle, true)} />}
        {layout.sill && <path d={path(layout.sill, true)} />}
      </g>
      {layout.sillSlotLevel !== null && layout.sill && (
        <line x1={px(layout.sill[0]![0] + 2 * layout.sillSlotLevel)} x2={px(LB)} y1={py(layout.sillSlotLevel)} y2={py(layout.sillSlotLevel)} stroke={PALETTE.ink} strokeWidth={0.9} strokeDasharray="3 2" />
      )}
      <path d={downstream(input.tailwater)} stroke={PALETTE.tailwater} strokeWidth={1.75} />
      {required !== null && <path d={downstream(required)} stroke={short ? PALETTE.fault : PALETTE.slate} strokeWidth={1.25} strokeDasharray="5 3" />}
      <g {...text} textAnchor="end" {...halo}>
        <text x={px(layout.xMax) - 2} y={py(input.tailwater) + (twAbove ? -5 : 13)} fill={PALETTE.tailwater}>{`TW = ${len(input.tailwater)}`}</text>
        {required !== null && (
          <text x={px(layout.xMax) - 2} y={py(required) + (twAbove ? 13 : -5)} fill={short ? PALETTE.fault : PALETTE.slate}>{`TW required = ${len(required)}`}</text>
        )}
      </g>
      <text x={px(jx)} y={py(jz) - 8} textAnchor="middle" {...text} {...halo} fontStyle="italic" fill={PALETTE.tailwater}>
        governing jump (schematic)
      </text>
      <g {...text} fill={PALETTE.ink}>
        {/* Leaders first: a lower row's leader passes behind the haloed labels above it. */}
        {layout.labels.map((l) => (
          <line key={`${l.key}-leader`} x1={px(l.x)} x2={px(l.x)} y1={bed + 2} y2={rowY(l.row) - 10} stroke={PALETTE.inkFaint} strokeWidth={0.75} />
        ))}
        {layout.labels.map((l) => (
          <text key={l.key} x={px(l.x)} y={rowY(l.row)} textAnchor={l.anchor} {...halo}>{texts[l.key]}</text>
        ))}
      </g>
      {layout.baffle && (
        <g>
          <Dimension x1={px(0)} x2={px(input.baffleDistance!)} y={x3y} />
          <text x={(px(0) + px(input.baffleDistance!)) / 2} y={x3y + 14} textAnchor="middle" {...text} fill={PALETTE.ink}>{`x3 = ${len(input.baffleDistance!)}`}</text>
        </g>
      )}
      <Dimension x1={px(0)} x2={px(LB)} y={lbY} />
      <text x={(px(0) + px(LB)) / 2} y={lbY + 14} textAnchor="middle" {...text} fill={PALETTE.ink}>{`LB = ${len(LB)}`}</text>
      <text x={px(layout.xMin) + 2} y={top + 14} {...text} fill={PALETTE.inkSoft}>Flow →</text>
      <text x={WIDTH - 24} y={top + 14} textAnchor="end" {...text} fontStyle="italic" fill={PALETTE.inkFaint}>{note}</text>
      {short && (
        <text x={WIDTH - 24} y={top + 29} textAnchor="end" {...text} fontWeight={600} fill={PALETTE.fault}>
          {`Tailwater short by ${len(-input.margin!)}${flowName}: the jump sweeps out`}
        </text>
      )}
    </svg>
  );
}

/**
 * The caption of a block's outline: its scale, and the design and governing discharges when
 * the block has them; null when the block draws no outline.
 */
export function basinOutlineCaption(block: BlockResult): string | null {
  const input = basinOutlineInput(block);
  const layout = input ? basinOutlineLayout(input) : null;
  if (!layout) return null;
  const q = chartUnit('discharge', block.unitSystem);
  const at = (name: string) => {
    const v = siNumber(block.outputs, name);
    return v !== undefined ? ` (Q = ${formatShort(v / q.factor)} ${q.label})` : '';
  };
  const note = scaleNote(layout);
  const scale = note === 'To scale' ? ' to scale' : ` (${note.toLowerCase()})`;
  return `Basin outline${scale} for the design flow${at('designDischarge')}, with the jump and tailwater of the governing flow${at('governingDischarge')}; the water surface is schematic.`;
}
