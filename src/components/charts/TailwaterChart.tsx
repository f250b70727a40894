/**
 * Sequent depth y2 and tailwater TW against discharge Q for a `tailwater` block: where the
 * tailwater falls below the sequent depth the jump is swept out of the basin; those flows
 * are shaded and marked with a cross (readable in print without colour).
 */
import { area, line } from 'd3-shape';
import { useId } from 'react';
import type { BlockResult } from '../../lib/calc';
import { Axes } from './Axes';
import { axisTitle, CHART_FONT, chartUnit, formatShort, niceScale, PALETTE } from './chartMath';
import { tailwaterSeries, type TailwaterPoint } from './tailwaterSeries';

/** Props of {@link TailwaterChart}. */
export interface TailwaterChartProps {
  /** A solved `tailwater` block; nothing renders without rows. */
  readonly block: BlockResult;
}

const WIDTH = 640;
const HEIGHT = 300;
/** Above this many flows (or swept-out flows) the lines carry no point markers. */
const MARKER_LIMIT = 60;
const text = { fontFamily: CHART_FONT, fontSize: 11 } as const;

function Cross({ x, y }: { x: number; y: number }) {
  return <path d={`M${x - 4},${y - 4}L${x + 4},${y + 4}M${x - 4},${y + 4}L${x + 4},${y - 4}`} stroke={PALETTE.fault} strokeWidth={1.6} />;
}

/** An open diamond: a point of the rating the block was given. */
function Diamond({ x, y }: { x: number; y: number }) {
  return <path d={`M${x},${y - 4.5}L${x + 4.5},${y}L${x},${y + 4.5}L${x - 4.5},${y}Z`} fill="white" stroke={PALETTE.ink} strokeWidth={1.2} />;
}

function Legend({ x, y, swept, rating }: { x: number; y: number; swept: boolean; rating: string | null }) {
  return (
    <g {...text} fill={PALETTE.ink} aria-hidden="true">
      {rating !== null && (
        <g>
          <Diamond x={x + 9} y={y + 16} />
          <text x={x + 24} y={y + 20}>{rating}</text>
        </g>
      )}
      <line x1={x} x2={x + 18} y1={y} y2={y} stroke={PALETTE.slate} strokeWidth={1.75} />
      <circle cx={x + 9} cy={y} r={2.75} fill={PALETTE.slate} />
      <text x={x + 24} y={y + 4}>sequent depth y2</text>
      <line x1={x + 130} x2={x + 148} y1={y} y2={y} stroke={PALETTE.tailwater} strokeWidth={1.75} strokeDasharray="5 3" />
      <rect x={x + 136} y={y - 2.75} width={5.5} height={5.5} fill={PALETTE.tailwater} />
      <text x={x + 154} y={y + 4}>tailwater TW</text>
      {swept && (
        <g>
          <Cross x={x + 254} y={y} />
          <text x={x + 264} y={y + 4}>swept out (TW &lt; y2)</text>
        </g>
      )}
    </g>
  );
}

/** The Q–depth chart of a tailwater block; null when the block has no rows. */
export function TailwaterChart({ block }: TailwaterChartProps) {
  const id = useId();
  const s = tailwaterSeries(block);
  if (!s) return null;
  const q = chartUnit('discharge', block.unitSystem);
  const d = chartUnit('length', block.unitSystem);
  const x = niceScale(s.qMin / q.factor, s.qMax / q.factor, [64, WIDTH - 20], 6);
  // Start the depth axis at zero unless the depths sit high above it: the margins are the point.
  const floor = s.depthMin > 0.45 * s.depthMax ? s.depthMin * 0.9 : 0;
  const top = s.rating.length ? 56 : 40;
  const y = niceScale(floor / d.factor, (s.depthMax * 1.05) / d.factor, [250, top], 5);
  const px = (p: TailwaterPoint) => x(p.q / q.factor);
  const depthY = (v: number) => y(v / d.factor);
  const y2Line = line<TailwaterPoint>().defined((p) => p.y2 !== null).x(px).y((p) => depthY(p.y2!));
  const twLine = line<TailwaterPoint>().defined((p) => p.tw !== null).x(px).y((p) => depthY(p.tw!));
  const gap = area<TailwaterPoint>()
    .defined((p) => p.state === 'swept-out' && p.y2 !== null && p.tw !== null)
    .x(px)
    .y0((p) => depthY(p.tw!))
    .y1((p) => depthY(p.y2!));
  const points = s.points as TailwaterPoint[];
  const markers = points.length <= MARKER_LIMIT;
  const swept = points.filter((p) => p.state === 'swept-out' && p.y2 !== null);
  const qText = (v: number) => `${formatShort(v / q.factor)} ${q.label}`;
  const ratingLabel = s.rating.length ? `rating points${s.ratingSource ? ` (${s.ratingSource})` : ''}` : null;
  const summary =
    s.sweptOut === 0
      ? 'The tailwater holds the jump at every flow.'
      : `The jump is swept out at ${s.sweptOut} of ${points.length} flows (${swept.map((p) => qText(p.q)).join(', ')}).`;
  return (
    <svg viewBox={`0 0 ${WIDTH} ${HEIGHT}`} width="100%" role="img" aria-labelledby={`${id}t ${id}d`} className="block h-auto max-w-full">
      <title id={`${id}t`}>{`Sequent depth and tailwater against discharge${block.name ? `, block ${block.name}` : ''}`}</title>
      <desc id={`${id}d`}>{`Sequent depth y2 and tailwater depth TW for ${points.length} flows from ${qText(points[0]!.q)} to ${qText(points[points.length - 1]!.q)}. ${summary}${ratingLabel ? ` The ${s.rating.length} ${ratingLabel} are drawn as open diamonds.` : ''}`}</desc>
      <Legend x={64} y={18} swept={s.sweptOut > 0} rating={ratingLabel} />
      <Axes x={x} y={y} xTitle={axisTitle('Discharge Q', q)} yTitle={axisTitle('Depth above apron', d)} xTickCount={6} />
      <path d={gap(points) ?? ''} fill={PALETTE.fault} fillOpacity={0.12} stroke="none" />
      <path d={y2Line(points) ?? ''} fill="none" stroke={PALETTE.slate} strokeWidth={1.75} />
      <path d={twLine(points) ?? ''} fill="none" stroke={PALETTE.tailwater} strokeWidth={1.75} strokeDasharray="5 3" />
      {markers &&
        points.map((p) => (
          <g key={p.q}>
            {p.y2 !== null && <circle cx={px(p)} cy={depthY(p.y2)} r={2.75} fill={PALETTE.slate} />}
            {p.tw !== null && <rect x={px(p) - 2.75} y={depthY(p.tw) - 2.75} width={5.5} height={5.5} fill={PALETTE.tailwater} />}
          </g>
        ))}
      {s.rating.length <= MARKER_LIMIT * 4 && s.rating.map((r, i) => <Diamond key={`r${i}`} x={x(r.q / q.factor)} y={depthY(r.depth)} />)}
      {swept.length <= MARKER_LIMIT && swept.map((p) => (
        <Cross key={`x${p.q}`} x={px(p)} y={depthY(p.y2!) - 9} />
      ))}
    </svg>
  );
}
