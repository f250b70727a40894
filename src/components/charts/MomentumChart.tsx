/**
 * Momentum function M(y) — and beside it specific energy E(y) — against depth for a `jump`
 * block's section and discharge, with the conjugate depths y1, y2 (equal M) and the
 * critical depth yc marked. SVG from d3 scales, rendered by React: works in SSR and print.
 */
import { line } from 'd3-shape';
import { useId } from 'react';
import type { BlockResult } from '../../lib/calc';
import { Axes } from './Axes';
import { axisTitle, CHART_FONT, chartUnit, formatShort, niceScale, PALETTE } from './chartMath';
import { jumpCurves, type CurvePoint, type JumpCurves } from './momentumCurve';

/** Props of {@link MomentumChart}. */
export interface MomentumChartProps {
  /** A solved `jump` block; the chart renders nothing for other blocks. */
  readonly block: BlockResult;
  /** Draw the specific-energy panel beside the momentum panel (default true). */
  readonly showEnergy?: boolean;
}

const WIDTH = 640;
const HEIGHT = 300;
const TOP = 14;
const BOTTOM = 252;
const label = { fontFamily: CHART_FONT, fontSize: 11 } as const;

type Scale = ReturnType<typeof niceScale>;

interface PanelProps {
  readonly points: readonly CurvePoint[];
  readonly x: Scale;
  readonly y: Scale;
  /** Divide SI values by these for display. */
  readonly xFactor: number;
  readonly yFactor: number;
  readonly colour: string;
}

function Curve({ points, x, y, xFactor, yFactor, colour }: PanelProps) {
  const path = line<CurvePoint>()
    .x((p) => x(p.value / xFactor))
    .y((p) => y(p.y / yFactor))(points as CurvePoint[]);
  return path ? <path d={path} fill="none" stroke={colour} strokeWidth={1.75} /> : null;
}

function Dot({ cx, cy, colour }: { cx: number; cy: number; colour: string }) {
  return <circle cx={cx} cy={cy} r={3.5} fill={colour} stroke="white" strokeWidth={1} />;
}

/** A depth marked across a panel: dashed line, and its label at the left when asked. */
function DepthLine({ x, y, depth, to, text, below, dash }: { x: Scale; y: Scale; depth: number; to: number; text?: string; below?: boolean; dash: string }) {
  const [left] = x.range() as [number, number];
  return (
    <g>
      <line x1={left} x2={to} y1={y(depth)} y2={y(depth)} stroke={PALETTE.inkSoft} strokeWidth={0.9} strokeDasharray={dash} />
      {text && (
        <text x={left + 4} y={y(depth) + (below ? 12 : -4)} {...label} fill={PALETTE.ink}>
          {text}
        </text>
      )}
    </g>
  );
}

function description(c: JumpCurves, len: ReturnType<typeof chartUnit>, vol: ReturnType<typeof chartUnit>, q: ReturnType<typeof chartUnit>, energy: boolean): string {
  const l = (v: number) => `${formatShort(v / len.factor)} ${len.label}`;
  return (
    `Depth against momentum function M for Q = ${formatShort(c.discharge / q.factor)} ${q.label} in a ${c.section.shape} section. ` +
    `The conjugate depths y1 = ${l(c.y1)} and y2 = ${l(c.y2)} share M = ${formatShort(c.m1 / vol.factor)} ${vol.label}; ` +
    `the critical depth yc = ${l(c.yc)} is where M is least.` +
    (energy ? ` Specific energy falls from E1 = ${l(c.e1)} to E2 = ${l(c.e2)}.` : '')
  );
}

/** The M–y (and E–y) chart of a jump block; null when the block cannot be drawn. */
export function MomentumChart({ block, showEnergy = true }: MomentumChartProps) {
  const id = useId();
  const c = jumpCurves(block);
  if (!c) return null;
  const len = chartUnit('length', block.unitSystem);
  const vol = chartUnit('volume', block.unitSystem);
  const q = chartUnit('discharge', block.unitSystem);
  const mRange: [number, number] = showEnergy ? [62, 336] : [62, WIDTH - 16];
  const eRange: [number, number] = [388, WIDTH - 16];
  const y = niceScale(0, c.yTop / len.factor, [BOTTOM, TOP]);
  const xm = niceScale(0, c.mMax / vol.factor, mRange, 4);
  const xe = niceScale(0, c.eMax / len.factor, eRange, 4);
  const mAt = xm(c.m1 / vol.factor);
  const mc = c.momentum.reduce((a, p) => (p.value < a.value ? p : a), c.momentum[0]!);
  const name = block.name ? `, block ${block.name}` : '';
  const depth = (v: number) => `${formatShort(v / len.factor)} ${len.label}`;
  return (
    <svg viewBox={`0 0 ${WIDTH} ${HEIGHT}`} width="100%" role="img" aria-labelledby={`${id}t ${id}d`} className="block h-auto max-w-full" preserveAspectRatio="xMidYMid meet">
      <title id={`${id}t`}>{`Momentum function${showEnergy ? ' and specific energy' : ''} against depth${name}`}</title>
      <desc id={`${id}d`}>{description(c, len, vol, q, showEnergy)}</desc>
      <Axes x={xm} y={y} xTitle={axisTitle('Momentum function M', vol)} yTitle={axisTitle('Depth y', len)} xTickCount={4} />
      <Curve points={c.momentum} x={xm} y={y} xFactor={vol.factor} yFactor={len.factor} colour={PALETTE.tailwater} />
      <DepthLine x={xm} y={y} depth={c.y2 / len.factor} to={mAt} text={`y2 = ${depth(c.y2)}`} dash="4 3" />
      <DepthLine x={xm} y={y} depth={c.y1 / len.factor} to={mAt} text={`y1 = ${depth(c.y1)}`} below dash="4 3" />
      <DepthLine x={xm} y={y} depth={c.yc / len.factor} to={xm(mc.value / vol.factor)} text={`yc = ${depth(c.yc)}`} dash="1.5 2.5" />
      {/* The jump: both conjugate depths at the same M. */}
      <line x1={mAt} x2={mAt} y1={y(c.y1 / len.factor)} y2={y(c.y2 / len.factor)} stroke={PALETTE.slate} strokeWidth={1} strokeDasharray="2 2" />
      <text x={mAt + 5} y={(y(c.y1 / len.factor) + y(c.y2 / len.factor)) / 2} {...label} fill={PALETTE.slate}>
        M1 = M2
      </text>
      <Dot cx={mAt} cy={y(c.y1 / len.factor)} colour={PALETTE.slate} />
      <Dot cx={mAt} cy={y(c.y2 / len.factor)} colour={PALETTE.slate} />
      <Dot cx={xm(mc.value / vol.factor)} cy={y(c.yc / len.factor)} colour={PALETTE.inkSoft} />
      {showEnergy && <EnergyPanel c={c} y={y} x={xe} unit={len} />}
    </svg>
  );
}

function EnergyPanel({ c, x, y, unit }: { c: JumpCurves; x: Scale; y: Scale; unit: ReturnType<typeof chartUnit> }) {
  const f = unit.factor;
  const [, right] = x.range() as [number, number];
  const [bottom] = y.range() as [number, number];
  const diagonalEnd = Math.min(x.domain()[1]!, y.domain()[1]!);
  const e1 = x(c.e1 / f);
  const e2 = x(c.e2 / f);
  const lossY = bottom - 10;
  return (
    <g>
      <Axes x={x} y={y} xTitle={axisTitle('Specific energy E', unit)} yTitle="" xTickCount={4} yLabels={false} />
      {/* E = y: the asymptote of the subcritical branch. */}
      <line x1={x(0)} y1={y(0)} x2={x(diagonalEnd)} y2={y(diagonalEnd)} stroke={PALETTE.inkFaint} strokeWidth={0.9} strokeDasharray="5 4" />
      <text x={Math.min(x(diagonalEnd), right) - 4} y={y(diagonalEnd) + 12} textAnchor="end" {...label} fill={PALETTE.inkFaint}>
        E = y
      </text>
      <Curve points={c.energy} x={x} y={y} xFactor={f} yFactor={f} colour={PALETTE.tailwater} />
      <line x1={e1} x2={e1} y1={y(c.y1 / f)} y2={lossY} stroke={PALETTE.inkSoft} strokeWidth={0.9} strokeDasharray="4 3" />
      <line x1={e2} x2={e2} y1={y(c.y2 / f)} y2={lossY} stroke={PALETTE.inkSoft} strokeWidth={0.9} strokeDasharray="4 3" />
      <line x1={e2} x2={e1} y1={lossY} y2={lossY} stroke={PALETTE.caution} strokeWidth={1.25} />
      <text x={(e1 + e2) / 2} y={lossY - 4} textAnchor="middle" {...label} fill={PALETTE.caution}>
        {`ΔE = ${formatShort((c.e1 - c.e2) / f)} ${unit.label}`}
      </text>
      <Dot cx={e1} cy={y(c.y1 / f)} colour={PALETTE.slate} />
      <Dot cx={e2} cy={y(c.y2 / f)} colour={PALETTE.slate} />
      <text x={e1 + 5} y={y(c.y1 / f) - 5} {...label} fill={PALETTE.slate}>
        E1
      </text>
      <text x={e2 + 5} y={y(c.y2 / f) - 5} {...label} fill={PALETTE.slate}>
        E2
      </text>
    </g>
  );
}
