/**
 * BlockResults, BlockChart and the charts rendered to static HTML, as the server does.
 */
import { createElement as h } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { BlockChart, chartKindOf } from '@/components/blocks/BlockChart';
import { BlockResults } from '@/components/blocks/BlockResults';
import { BasinOutlineChart } from '@/components/charts/BasinOutlineChart';
import { JumpProfileSketch } from '@/components/charts/JumpProfileSketch';
import { MomentumChart } from '@/components/charts/MomentumChart';
import { TailwaterChart } from '@/components/charts/TailwaterChart';
import { evaluateCase, type BlockResult } from '@/lib/calc';
import { BROKEN, JUMP, PIPE, SURGE, TAILWATER, TOE, US_JUMP } from './fixtures';

const render = (block: BlockResult, props: Record<string, unknown> = {}) => renderToStaticMarkup(h(BlockResults, { block, ...props }));

/** The cells of the row of the results table whose output is `name`. */
function row(html: string, name: string): string {
  const m = new RegExp(`<tr data-output="${name}">([\\s\\S]*?)</tr>`).exec(html);
  if (!m) throw new Error(`no row ${name}`);
  return m[1]!;
}

describe('BlockResults', () => {
  const html = render(JUMP);

  it('has a header with the title, block name, calculation word, unit system and lines', () => {
    expect(html).toMatch(/<h3 id="[^"]+"[^>]*>Stationary hydraulic jump<span[^>]*>basin<\/span><\/h3>/);
    expect(html).toContain('<span class="font-mono">jump</span> · SI units · lines 7–11');
    expect(html).toMatch(/<section aria-labelledby="([^"]+)h"[\s\S]*id="\1h"/);
  });

  it('renders the results table with a caption, column and row headers and a unit column', () => {
    expect(html).toContain('<caption');
    expect(html).toContain('<th scope="col">Result</th><th scope="col">Symbol</th><th scope="col" class="num">Value</th><th scope="col">Unit</th>');
    expect(row(html, 'y2')).toMatch(/^<th scope="row"[^>]*>Sequent depth<\/th><td>.*<i>y<\/i><sub><span>2<\/span><\/sub>.*<\/td><td class="num">4\.118<\/td><td>m<\/td>$/);
    expect(row(html, 'discharge')).toContain('<td class="num">85.00</td><td>m³/s</td>');
    expect(row(html, 'power')).toContain('<td>kW</td>');
  });

  it('right-aligns every number and gives every number a unit (a dash read as dimensionless for ratios)', () => {
    for (const o of JUMP.outputs) {
      const cells = row(html, o.name);
      if (typeof o.si === 'number') {
        expect(cells).toContain(`<td class="num">${o.text}</td>`);
        expect(cells).toMatch(o.unit ? new RegExp(`<td>${o.unit}</td>$`) : /<span class="sr-only">dimensionless<\/span><\/td>$/);
      }
    }
    expect(row(html, 'jumpType')).toContain('<td class="text-right">steady</td><td></td>');
  });

  it('typesets the table in tabular figures', () => {
    expect(html).toMatch(/<table class="sheet-table tabular-nums">/);
  });

  it('summarises the inputs with their units, references resolved', () => {
    expect(html).toContain('<dd>= 12.00 m</dd>');
    expect(html).toContain('<dd>= 85.00 m³/s</dd>');
    expect(html).toContain('<dd>= 0.5342 m</dd>');
    expect(render(JUMP, { showInputs: false })).not.toContain('<dd>');
  });

  it('shows results in US customary units for a US block', () => {
    const us = render(US_JUMP);
    expect(us).toContain('US customary units');
    expect(row(us, 'discharge')).toContain('<td class="num">1200</td><td>ft³/s</td>');
    expect(row(us, 'power')).toContain('<td>hp</td>');
  });

  it('lists warnings in the caution style, with line numbers when known', () => {
    const us = render(US_JUMP);
    expect(us).toMatch(/<div class="notice notice-caution"><p class="font-semibold">Warnings<\/p>/);
    expect(us).toContain('data-code="jump-length-out-of-range"');
    const withLine = render({ ...JUMP, warnings: [{ code: 'x', message: 'Check the toe depth.', line: 10 }] });
    expect(withLine).toContain('<li data-code="x"><span class="font-semibold">line 10: </span>Check the toe depth.</li>');
  });

  it('shows errors as "line N: message — hint" in the fault style, and no results table', () => {
    const bad = render(BROKEN);
    expect(bad).toContain('data-status="error"');
    expect(bad).toContain('notice notice-fault');
    expect(bad).toMatch(/<li><span class="font-semibold">line 37:<\/span> A stationary hydraulic jump block has no input &quot;flux&quot;\.[^<]*(<span class="text-ink-soft"> — [^<]+<\/span>)?<\/li>/);
    expect(bad).not.toContain('<caption');
    const hinted = render({ ...BROKEN, errors: [{ line: 36, message: 'Q needs a unit.', hint: 'Write Q = 85 m3/s' }] });
    expect(hinted).toContain('<li><span class="font-semibold">line 36:</span> Q needs a unit.<span class="text-ink-soft"> — Write Q = 85 m3/s</span></li>');
  });

  it('renders the rows of a tailwater sweep with a unit in every column header', () => {
    const tw = render(TAILWATER);
    expect(tw).toContain('Flows (9)</caption>');
    const head = /<thead>([\s\S]*?)<\/thead>/g;
    const headers = [...tw.matchAll(head)][1]![1]!;
    for (const c of TAILWATER.table!.columns) {
      if (c.quantity === 'text') continue;
      expect(headers).toContain(c.unit ? `(${c.unit})` : '(–)');
    }
    expect(headers.match(/<th scope="col" class="align-bottom num">/g)).toHaveLength(8);
    expect(tw).toMatch(/<tr class="bg-fault-wash\/60"><th scope="row" class="num font-normal text-ink">20\.00<\/th>/);
    expect(tw).toContain('<td class="text-fault font-semibold">swept out</td>');
    expect(tw).toContain('<td class="text-sound">at the toe</td>');
    expect(tw).toContain('−0.1264');
  });

  it('caps very long sweeps and says how many flows are shown', () => {
    expect(render(TAILWATER, { maxRows: 3 })).toContain('The first 3 of 9 flows are shown.');
  });

  it('puts children (the chart) inside the panel and links the method note', () => {
    const withChart = renderToStaticMarkup(h(BlockResults, { block: JUMP }, h('figure', { id: 'chart' })));
    expect(withChart).toMatch(/<figure id="chart"><\/figure><p class="text-xs text-ink-faint">Solver [\d.]+ · <a href="\/methods\/hydraulic-jump">method note<\/a><\/p><\/div><\/div><\/section>$/);
  });
});

describe('BlockChart', () => {
  it('picks momentum chart and sketch for a jump, the Q chart for a tailwater check, nothing otherwise', () => {
    expect(chartKindOf(JUMP)).toBe('jump');
    expect(chartKindOf(TAILWATER)).toBe('tailwater');
    expect(chartKindOf(TOE)).toBeNull();
    expect(chartKindOf(SURGE)).toBeNull();
    expect(chartKindOf(BROKEN)).toBeNull();
    expect(renderToStaticMarkup(h(BlockChart, { block: JUMP })).match(/<svg /g)).toHaveLength(2);
    expect(renderToStaticMarkup(h(BlockChart, { block: TAILWATER })).match(/<svg /g)).toHaveLength(1);
    expect(renderToStaticMarkup(h(BlockChart, { block: TOE }))).toBe('');
  });
});

describe('charts', () => {
  const charts = [
    ['MomentumChart', h(MomentumChart, { block: JUMP })],
    ['MomentumChart (circular)', h(MomentumChart, { block: PIPE })],
    ['JumpProfileSketch', h(JumpProfileSketch, { block: JUMP })],
    ['TailwaterChart', h(TailwaterChart, { block: TAILWATER })],
  ] as const;

  it.each(charts)('%s is an accessible image with a title and description, a fixed viewBox and no NaN', (_name, element) => {
    const svg = renderToStaticMarkup(element);
    const labelled = /^<svg viewBox="0 [\d.]+ 640 [\d.]+" width="100%" role="img" aria-labelledby="(\S+) (\S+)"/.exec(svg);
    expect(labelled).not.toBeNull();
    expect(svg).toContain(`<title id="${labelled![1]}">`);
    expect(svg).toContain(`<desc id="${labelled![2]}">`);
    expect(svg).not.toMatch(/NaN|Infinity|undefined/);
  });

  it('labels the momentum chart axes with units of the block system', () => {
    expect(renderToStaticMarkup(h(MomentumChart, { block: JUMP }))).toMatch(/Momentum function M \(m³\)[\s\S]*Depth y \(m\)[\s\S]*Specific energy E \(m\)/);
    const us = renderToStaticMarkup(h(MomentumChart, { block: US_JUMP }));
    expect(us).toMatch(/Momentum function M \(ft³\)[\s\S]*Depth y \(ft\)/);
    expect(us).toContain('y2 = 14.8 ft');
    expect(renderToStaticMarkup(h(MomentumChart, { block: JUMP, showEnergy: false }))).not.toContain('Specific energy');
  });

  it('marks both conjugate depths and the critical depth', () => {
    const svg = renderToStaticMarkup(h(MomentumChart, { block: JUMP }));
    expect(svg).toContain('y1 = 0.534 m');
    expect(svg).toContain('y2 = 4.12 m');
    expect(svg).toContain('yc = 1.72 m');
    expect(svg).toContain('ΔE = 5.23 m');
  });

  it('dimensions the jump sketch and states its scale', () => {
    const svg = renderToStaticMarkup(h(JumpProfileSketch, { block: JUMP }));
    expect(svg).toContain('Lj = 25.1 m');
    expect(svg).toContain('Lr = 18.3 m');
    expect(svg).toContain('To scale');
  });

  it('marks swept-out flows in the tailwater chart and says which', () => {
    const svg = renderToStaticMarkup(h(TailwaterChart, { block: TAILWATER }));
    expect(svg).toContain('swept out (TW &lt; y2)');
    expect(svg).toMatch(/The jump is swept out at \d of 9 flows \(20\.0 m³\/s, /);
    expect(svg).toContain('Discharge Q (m³/s)');
  });

  it('renders nothing for blocks they cannot draw', () => {
    expect(renderToStaticMarkup(h(MomentumChart, { block: BROKEN }))).toBe('');
    expect(renderToStaticMarkup(h(JumpProfileSketch, { block: TOE }))).toBe('');
    expect(renderToStaticMarkup(h(TailwaterChart, { block: JUMP }))).toBe('');
  });
});

describe('stilling-basin blocks', () => {
  const basin = (lines: string[]) => evaluateCase(['```basin pick', ...lines, '```'].join('\n')).blocks[0]!;
  const SHORT = basin(['y1 = 0.3, 0.5, 0.75 m', 'V1 = 15, 14.5, 14 m/s', 'TW = 3.2, 4.1, 5.6 m', 'family = usbr3']);
  const NONE = basin(['y1 = 0.5 m', 'V1 = 3.0 m/s', 'TW = 1 m']);

  it('draws the basin outline in a captioned figure, and nothing when no family fits', () => {
    expect(chartKindOf(SHORT)).toBe('basin');
    const html = renderToStaticMarkup(h(BlockChart, { block: SHORT }));
    expect(html.match(/<svg /g)).toHaveLength(1);
    expect(html).toContain('<figcaption class="mt-1 text-sm text-ink-soft">Basin outline to scale for the design flow, with the jump and tailwater of the governing flow; the water surface is schematic.</figcaption>');
    expect(NONE.outputs.find((o) => o.name === 'family')?.si).toBe('none');
    expect(chartKindOf(NONE)).toBeNull();
    expect(renderToStaticMarkup(h(BlockChart, { block: NONE }))).toBe('');
  });

  it('is an accessible image that dimensions the basin, labels the elements and flags a short tailwater', () => {
    const svg = renderToStaticMarkup(h(BasinOutlineChart, { block: SHORT }));
    expect(svg).toMatch(/^<svg viewBox="0 [\d.]+ 640 [\d.]+" width="100%" role="img" aria-labelledby="\S+ \S+"[^>]*><title id="[^"]+">Side view of the stilling basin, block pick<\/title><desc/);
    expect(svg).not.toMatch(/NaN|Infinity|undefined/);
    for (const label of ['LB = 13.8 m', 'x3 = 4.09 m', 'chute blocks h1 = 0.750 m', 'baffle piers h3 = 1.12 m', 'end sill h4 = 0.965 m', 'TW = 3.20 m', 'TW required = 3.56 m', 'governing jump (schematic)']) {
      expect(svg).toContain(label);
    }
    expect(svg).toContain('Tailwater short by 0.363 m: the jump sweeps out');
    const sound = renderToStaticMarkup(h(BasinOutlineChart, { block: basin(['y1 = 0.5 m', 'V1 = 14 m/s', 'TW = 4.6 m']) }));
    expect(sound).not.toContain('Tailwater short');
    expect(sound).toContain('meets the 4.23 m the basin needs');
  });

  it('labels a US block in feet and a dentated sill as such', () => {
    const us = renderToStaticMarkup(h(BasinOutlineChart, { block: basin(['units = US', 'y1 = 1.5 ft', 'V1 = 45 ft/s', 'TW = 14 ft', 'family = usbr2']) }));
    expect(us).toMatch(/LB = [\d.]+ ft/);
    expect(us).toContain('dentated sill h4 = ');
    expect(us).toContain('stroke-dasharray="3 2"');
  });

  it('reads the fits column as fits/outside in the sound/caution tone, with the ranges and relations as notes under the table', () => {
    const html = render(SHORT);
    expect(html).toContain('Basin families (5)</caption>');
    expect(html).toContain('<tr class="align-top"><th scope="row"');
    expect(html).not.toContain('<span class="block">Stated range</span></th>');
    expect(html).toContain('<td class="text-sound">fits</td>');
    expect(html).toContain('<td class="text-caution">outside</td>');
    expect(html).toMatch(/<th scope="row" class="min-w-32 font-normal text-ink">USBR III<\/th>/);
    const notes = html.slice(html.indexOf('data-testid="row-notes"'));
    expect(notes).toMatch(/<dt class="font-semibold text-ink">USBR III<\/dt>/);
    expect(notes).toContain('Stated range: </span>Fr1 ≥ 4.5, V1 ≤ 18.29 m/s (60 ft/s), q ≤ 18.58 m²/s (200 ft²/s)');
    expect(notes).toMatch(/Relations: <\/span>L = 2\.7·y2; TW = 1\.0·y2;/);
  });
});
