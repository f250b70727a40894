/**
 * Schematic side view of a `jump` block: supercritical inflow at y1, the roller, the
 * subcritical depth y2 behind it, and the jump length Lj (and roller length Lr) dimensioned.
 * Drawn to scale when that reads well; otherwise the vertical scale is exaggerated and the
 * sketch says so.
 */
import { line } from 'd3-shape';
import { useId } from 'react';
import type { BlockResult } from '../../lib/calc';
import { blockNumber, CHART_FONT, chartUnit, formatShort, PALETTE } from './chartMath';
import { jumpProfileLayout, scaleNote, type JumpProfileLayout } from './jumpProfile';

/** Props of {@link JumpProfileSketch}. */
export interface JumpProfileSketchProps {
  /** A solved `jump` block; nothing renders for blocks without y1, y2. */
  readonly block: BlockResult;
}

const WIDTH = 640;
const HEIGHT = 232;
const BOX = { left: 24, bed: 168, width: WIDTH - 48, height: 136 } as const;
const text = { fontFamily: CHART_FONT, fontSize: 11 } as const;

/** A dimension line with end ticks. */
function Dimension({ x1, y1, x2, y2 }: { x1: number; y1: number; x2: number; y2: number }) {
  const vertical = x1 === x2;
  const tick = (x: number, y: number) => (vertical ? <line x1={x - 4} x2={x + 4} y1={y} y2={y} /> : <line x1={x} x2={x} y1={y - 4} y2={y + 4} />);
  return (
    <g stroke={PALETTE.ink} strokeWidth={0.9}>
      <line x1={x1} y1={y1} x2={x2} y2={y2} />
      {tick(x1, y1)}
      {tick(x2, y2)}
    </g>
  );
}

function Bed({ layout }: { layout: JumpProfileLayout }) {
  const x0 = layout.px(0);
  const x1 = layout.px(layout.length);
  const hatches = [];
  for (let x = x0 + 4; x < x1; x += 12) hatches.push(<line key={x} x1={x} y1={BOX.bed} x2={x - 7} y2={BOX.bed + 7} />);
  return (
    <g stroke={PALETTE.inkSoft}>
      <line x1={x0} x2={x1} y1={BOX.bed} y2={BOX.bed} strokeWidth={1.5} stroke={PALETTE.ink} />
      <g strokeWidth={0.75}>{hatches}</g>
    </g>
  );
}

/** The side-view sketch of a jump block; null when the block has no drawable jump. */
export function JumpProfileSketch({ block }: JumpProfileSketchProps) {
  const id = useId();
  const y1 = blockNumber(block, 'y1');
  const y2 = blockNumber(block, 'y2');
  if (block.status !== 'ok' || y1 === undefined || y2 === undefined) return null;
  const jumpLength = blockNumber(block, 'jumpLength');
  const rollerLength = blockNumber(block, 'rollerLength');
  const layout = jumpProfileLayout({ y1, y2, ...(jumpLength !== undefined ? { jumpLength } : {}), ...(rollerLength !== undefined ? { rollerLength } : {}) }, BOX);
  if (!layout) return null;
  const { px, py } = layout;
  const unit = chartUnit('length', block.unitSystem);
  const len = (v: number) => `${formatShort(v / unit.factor)} ${unit.label}`;
  const surface = line()(layout.surface.map(([x, d]) => [px(x), py(d)] as [number, number])) ?? '';
  const water = `${surface}L${px(layout.length)},${BOX.bed}L${px(0)},${BOX.bed}Z`;
  const toeX = px(layout.toe);
  const jumpEnd = px(layout.toe + layout.jumpLength);
  const rollerEnd = px(layout.toe + layout.rollerLength);
  // The roller sits in the front of the jump, under the rising surface.
  const rollerDepth = y1 + (y2 - y1) * 0.55;
  const rx = Math.max(6, ((rollerEnd - toeX) * 0.42));
  const ry = Math.max(3, (py(y1) - py(rollerDepth)) * 0.45);
  const rcx = toeX + rx * 1.1;
  const rcy = py(rollerDepth) + ry * 0.9;
  const y2x = px(layout.length) - 28;
  const note = scaleNote(layout);
  // Trim the empty sky above a shallow (true-scale) jump: room for the Lr line and the notes only.
  const top = Math.max(0, Math.floor(py(y2) - (rollerLength !== undefined ? 50 : 34)));
  return (
    <svg viewBox={`0 ${top} ${WIDTH} ${HEIGHT - top}`} width="100%" role="img" aria-labelledby={`${id}t ${id}d`} className="block h-auto max-w-full">
      <title id={`${id}t`}>{`Side view of the jump${block.name ? `, block ${block.name}` : ''}`}</title>
      <desc id={`${id}d`}>
        {`Flow from left to right at depth y1 = ${len(y1)} rises through the roller to y2 = ${len(y2)} over the jump length ` +
          `Lj = ${len(layout.jumpLength)}${layout.lengthKnown ? '' : ' (estimated)'}. ${note}.`}
      </desc>
      <path d={water} fill={PALETTE.tailwaterWash} stroke="none" />
      <path d={surface} fill="none" stroke={PALETTE.tailwater} strokeWidth={1.75} />
      <ellipse cx={rcx} cy={rcy} rx={rx} ry={ry} fill="none" stroke={PALETTE.slate} strokeWidth={0.9} strokeDasharray="3 2.5" />
      <path d={`M${rcx + rx * 0.2},${rcy - ry} l-6,-3.5 l0,7 z`} fill={PALETTE.slate} transform={`rotate(180 ${rcx + rx * 0.2} ${rcy - ry})`} />
      <text x={rcx} y={rcy + 4} textAnchor="middle" {...text} fill={PALETTE.slate}>
        roller
      </text>
      <Bed layout={layout} />
      <line x1={toeX} x2={toeX} y1={BOX.bed} y2={py(y2) - 4} stroke={PALETTE.inkFaint} strokeWidth={0.75} strokeDasharray="2 2" />
      <Dimension x1={px(layout.toe * 0.45)} y1={BOX.bed} x2={px(layout.toe * 0.45)} y2={py(y1)} />
      <text x={px(layout.toe * 0.45)} y={py(y1) - 7} textAnchor="middle" {...text} fill={PALETTE.ink}>
        {`y1 = ${len(y1)}`}
      </text>
      <Dimension x1={y2x} y1={BOX.bed} x2={y2x} y2={py(y2)} />
      <text x={y2x - 6} y={(BOX.bed + py(y2)) / 2 + 4} textAnchor="end" {...text} fill={PALETTE.ink}>
        {`y2 = ${len(y2)}`}
      </text>
      <Dimension x1={toeX} y1={BOX.bed + 20} x2={jumpEnd} y2={BOX.bed + 20} />
      <text x={(toeX + jumpEnd) / 2} y={BOX.bed + 34} textAnchor="middle" {...text} fill={PALETTE.ink}>
        {`Lj = ${len(layout.jumpLength)}${layout.lengthKnown ? '' : ' (estimate 6.1·y2)'}`}
      </text>
      {rollerLength !== undefined && (
        <g>
          <Dimension x1={toeX} y1={py(y2) - 14} x2={rollerEnd} y2={py(y2) - 14} />
          <text x={(toeX + rollerEnd) / 2} y={py(y2) - 19} textAnchor="middle" {...text} fill={PALETTE.ink}>
            {/* The drawing stops the roller at Lj; the label keeps the block's value. */}
            {`Lr = ${len(rollerLength)}${rollerLength > layout.jumpLength ? ' (longer than Lj, drawn to Lj)' : ''}`}
          </text>
        </g>
      )}
      <text x={px(0) + 2} y={top + 16} {...text} fill={PALETTE.inkSoft}>
        Flow →
      </text>
      <text x={WIDTH - 24} y={top + 16} textAnchor="end" {...text} fontStyle="italic" fill={PALETTE.inkFaint}>
        {note}
      </text>
    </svg>
  );
}
