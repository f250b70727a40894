/**
 * Pure helpers shared by the block charts: the palette (CSS tokens with print-safe
 * fallbacks), display units, linear scales with nice ticks, and reading SI values from a
 * block result. No DOM: the charts render the same on the server, in the browser and in print.
 */
import { scaleLinear, type ScaleLinear } from 'd3-scale';
import type { BlockResult, ShownValue } from '../../lib/calc';
import { displayUnit, formatNumber, type Quantity, type UnitSystem } from '../../lib/solver';

/** Chart colours: the palette tokens of `global.css`, with their values as fallbacks. */
export const PALETTE = {
  ink: 'var(--color-ink, #1c2630)',
  inkSoft: 'var(--color-ink-soft, #4a5661)',
  inkFaint: 'var(--color-ink-faint, #77818a)',
  rule: 'var(--color-rule, #d8d2c2)',
  paperDeep: 'var(--color-paper-deep, #f2efe6)',
  slate: 'var(--color-slate, #2f4656)',
  tailwater: 'var(--color-tailwater, #1d5c66)',
  tailwaterWash: 'var(--color-tailwater-wash, #e3eeee)',
  caution: 'var(--color-caution, #8a5b12)',
  fault: 'var(--color-fault, #9a3026)',
  sound: 'var(--color-sound, #2e6b3c)',
} as const;

/** Interface face for chart labels. */
export const CHART_FONT = "var(--font-sans, 'Source Sans 3', 'Helvetica Neue', Arial, sans-serif)";

/** A display unit: divide an SI value by `factor`; `label` is empty for dimensionless values. */
export interface ChartUnit {
  readonly factor: number;
  readonly label: string;
}

/** The display unit of `quantity` in `system` (`m`, `ft`, `m³`, `ft³/s` …). */
export function chartUnit(quantity: Quantity, system: UnitSystem): ChartUnit {
  const unit = displayUnit(quantity, system);
  return unit && unit.symbol !== '-' ? { factor: unit.factor, label: unit.display } : { factor: 1, label: '' };
}

/** An axis title with its unit: `Depth y (m)`. */
export function axisTitle(label: string, unit: ChartUnit): string {
  return unit.label ? `${label} (${unit.label})` : label;
}

/** A number for a chart label, 3 significant figures, with a true minus sign. */
export function formatShort(x: number): string {
  return formatNumber(x, 3).replace(/^-/, '−');
}

/** A linear scale over [lo, hi] (or [0, 1] when not finite or empty), niced to round ticks. */
export function niceScale(lo: number, hi: number, range: readonly [number, number], ticks = 5): ScaleLinear<number, number> {
  let a = Number.isFinite(lo) ? lo : 0;
  let b = Number.isFinite(hi) ? hi : 1;
  if (b < a) [a, b] = [b, a];
  if (b - a <= 0) [a, b] = a === 0 ? [0, 1] : [a - Math.abs(a) * 0.1, a + Math.abs(a) * 0.1];
  return scaleLinear().domain([a, b]).range([range[0], range[1]]).nice(ticks);
}

/** Tick values and their labels for an axis (d3's tick rules, minus signs typeset). */
export function axisTicks(scale: ScaleLinear<number, number>, count = 5): { value: number; label: string }[] {
  const format = scale.tickFormat(count);
  return scale.ticks(count).map((value) => ({ value, label: format(value).replace(/^-/, '−') }));
}

/** SI number of a value in a block's inputs or outputs, by name; undefined when absent. */
export function siNumber(values: readonly ShownValue[], name: string): number | undefined {
  const v = values.find((x) => x.name === name)?.si;
  return typeof v === 'number' && Number.isFinite(v) ? v : undefined;
}

/** SI number of a block's output first, else its input. */
export function blockNumber(block: BlockResult, name: string): number | undefined {
  return siNumber(block.outputs, name) ?? siNumber(block.inputs, name);
}

/** Text value (a choice such as `trapezoidal`) of a block input. */
export function blockText(block: BlockResult, name: string): string | undefined {
  const v = block.inputs.find((x) => x.name === name)?.si;
  return typeof v === 'string' ? v : undefined;
}
