/**
 * Axes of a chart panel: light grid, tick labels and axis titles with units, drawn inside
 * an `<svg>` from two d3 linear scales (x left→right, y bottom→top).
 */
import type { ScaleLinear } from 'd3-scale';
import { axisTicks, CHART_FONT, PALETTE } from './chartMath';

/** Props of {@link Axes}. */
export interface AxesProps {
  readonly x: ScaleLinear<number, number>;
  readonly y: ScaleLinear<number, number>;
  /** Axis titles with their units, e.g. `Depth y (m)`. */
  readonly xTitle: string;
  readonly yTitle: string;
  readonly xTickCount?: number;
  readonly yTickCount?: number;
  /** False to leave out the y labels and title (a panel sharing the axis of its neighbour). */
  readonly yLabels?: boolean;
}

/** Grid, ticks and titles of one panel. */
export function Axes({ x, y, xTitle, yTitle, xTickCount = 5, yTickCount = 5, yLabels = true }: AxesProps) {
  const [left, right] = x.range() as [number, number];
  const [bottom, top] = y.range() as [number, number];
  // Text styles are set once on the group (SVG inherits them), coordinates to 0.01 px: the
  // markup of a chart is a good part of a reading page's weight.
  const at = (v: number) => Math.round(v * 100) / 100;
  return (
    <g aria-hidden="true" fontFamily={CHART_FONT} fontSize={11} fill={PALETTE.inkSoft}>
      {axisTicks(x, xTickCount).map((t) => (
        <g key={`x${t.value}`}>
          <line x1={at(x(t.value))} x2={at(x(t.value))} y1={top} y2={bottom} stroke={PALETTE.rule} strokeWidth={0.75} />
          <text x={at(x(t.value))} y={bottom + 14} textAnchor="middle">
            {t.label}
          </text>
        </g>
      ))}
      {axisTicks(y, yTickCount).map((t) => (
        <g key={`y${t.value}`}>
          <line x1={left} x2={right} y1={at(y(t.value))} y2={at(y(t.value))} stroke={PALETTE.rule} strokeWidth={0.75} />
          {yLabels && (
            <text x={left - 6} y={at(y(t.value) + 3.5)} textAnchor="end">
              {t.label}
            </text>
          )}
        </g>
      ))}
      <line x1={left} x2={right} y1={bottom} y2={bottom} stroke={PALETTE.inkSoft} strokeWidth={1} />
      <line x1={left} x2={left} y1={top} y2={bottom} stroke={PALETTE.inkSoft} strokeWidth={1} />
      <text x={(left + right) / 2} y={bottom + 32} textAnchor="middle" fill={PALETTE.ink}>
        {xTitle}
      </text>
      {yLabels && (
        <text transform={`translate(${left - 40} ${(top + bottom) / 2}) rotate(-90)`} textAnchor="middle" fill={PALETTE.ink}>
          {yTitle}
        </text>
      )}
    </g>
  );
}
