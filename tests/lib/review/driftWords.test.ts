import { describe, expect, it } from 'vitest';
import { blockHeading, figureName, relativeText, sideText } from '../../../src/components/review/driftWords';
import type { FigureDrift } from '../../../src/lib/review/drift';

const figure = (over: Partial<FigureDrift>): FigureDrift => ({ name: 'y2', label: 'Sequent depth', symbol: 'y2', unit: 'm', approved: null, current: null, relativeDifference: null, ...over });

describe('drift findings in words', () => {
  it('names blocks from 1 with their name and title', () => {
    expect(blockHeading({ index: 0, name: 'basin', title: 'Stationary hydraulic jump' })).toBe('Block 1 “basin” (Stationary hydraulic jump)');
    expect(blockHeading({ index: 2, name: null, title: 'Sluice gate' })).toBe('Block 3 (Sluice gate)');
  });

  it('names figures with their symbol unless the label already says it, and sweep cells with their row', () => {
    expect(figureName(figure({}))).toBe('Sequent depth y2');
    expect(figureName(figure({ label: 'Jump type', symbol: 'type' }))).toBe('Jump type');
    expect(figureName(figure({ label: 'Tailwater depth', symbol: 'TW', rowLabel: 'Q = 60.00 m³/s' }))).toBe('Tailwater depth TW at Q = 60.00 m³/s');
  });

  it('prints values with units, a dash for missing ones, and signed percentages', () => {
    expect(sideText({ value: 4.137, text: '4.137' }, 'm')).toBe('4.137 m');
    expect(sideText({ value: 'steady', text: 'steady' }, '')).toBe('steady');
    expect(sideText(null, 'm')).toBe('—');
    expect(sideText({ value: null, text: '' }, 'm')).toBe('—');
    expect(relativeText({ relativeDifference: -0.0266 })).toBe('−2.66 %');
    expect(relativeText({ relativeDifference: 0.0012 })).toBe('+0.120 %');
    expect(relativeText({ relativeDifference: 0.5 })).toBe('+50.0 %');
    expect(relativeText({ relativeDifference: null })).toBe('');
  });
});
