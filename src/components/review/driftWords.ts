/**
 * Drift findings in words, shared by the case notice and the admin drift page. Pure.
 */
import type { BlockDrift, FigureDrift, FigureSide } from '../../lib/review/drift';

/** "Block 2 “basin” (Stationary hydraulic jump)". */
export function blockHeading(block: Pick<BlockDrift, 'index' | 'name' | 'title'>): string {
  return `Block ${block.index + 1}${block.name ? ` “${block.name}”` : ''} (${block.title})`;
}

/** What happened to a block that did not simply change figures, or null when it did. */
export function blockChangeSentence(block: BlockDrift): string | null {
  switch (block.change) {
    case 'appeared':
      return 'This block was not in the approved results.';
    case 'disappeared':
      return 'This block was in the approved results and no longer evaluates.';
    case 'status':
      return block.currentStatus === 'error'
        ? 'It had results when approved and now stops with an error: open the case to see the message.'
        : 'It stopped with an error when approved and now gives results: check them before relying on the case.';
    default:
      return null;
  }
}

/** A figure's side as printed, with its unit; "—" where it did not exist or was not defined. */
export function sideText(side: FigureSide | null, unit: string): string {
  if (!side || side.value === null || side.text === '') return '—';
  return unit ? `${side.text} ${unit}` : side.text;
}

/** "+0.52 %", or "" when there is no relative difference (text, zero, appeared). */
export function relativeText(figure: Pick<FigureDrift, 'relativeDifference'>): string {
  const r = figure.relativeDifference;
  if (r === null) return '';
  const pct = r * 100;
  const digits = Math.abs(pct) >= 10 ? 1 : Math.abs(pct) >= 1 ? 2 : 3;
  return `${pct > 0 ? '+' : pct < 0 ? '−' : ''}${Math.abs(pct).toFixed(digits)} %`;
}

/** "Sequent depth y2" or, for a sweep cell, "Tailwater depth TW at Q = 60.00 m³/s". */
export function figureName(figure: FigureDrift): string {
  // "Jump type" needs no symbol "type" after it.
  const repeats = !figure.symbol || figure.label.toLowerCase().split(/\s+/).includes(figure.symbol.toLowerCase());
  const base = repeats ? figure.label : `${figure.label} ${figure.symbol}`;
  return figure.rowLabel ? `${base} at ${figure.rowLabel}` : base;
}
