import { describe, expect, it } from 'vitest';
import { evaluateCase } from '../../../src/lib/calc';
import { keyFigures } from '../../../src/lib/cases/keyFigures';
import { readDemoCases } from '../../../src/db/demoCases';
import { plainText } from '../../../src/lib/markdown/plainText';
import { buildSearchDocument, MAX_INDEXED_BODY, type PublishedCaseRow } from '../../../src/lib/search/document';

const fence = (info: string, ...lines: string[]) => ['```' + info, ...lines, '```'].join('\n');
const g = 9.80665;

const row = (body: string, change: Partial<PublishedCaseRow> = {}): PublishedCaseRow => ({
  id: 'case-1',
  firmId: 'firm-1',
  title: 'Outlet jump',
  summary: null,
  structureType: 'culvert-outlet',
  sectionShape: 'trapezoidal',
  region: 'Tarrowby Beck',
  projectReference: null,
  tags: ['culvert'],
  authorName: 'Priya Odunya',
  reviewerNames: ['Josef Warrick', 'Josef Warrick'],
  publishedAt: new Date('2026-11-03T10:00:00Z'),
  revision: 3,
  body,
  results: evaluateCase(body),
  ...change,
});

describe('plainText(markdown)', () => {
  it('keeps the prose and drops markup, calculation blocks and math', () => {
    const body = ['## Context', '', 'The **apron** is _depressed_ by $0.6$ m, see [the note](https://x.example).', '', fence('jump', 'b = 3 m', 'Q = 10 m3/s', 'y1 = 0.3 m'), '', '| a | b |', '|---|---|', '| c | d |', '', '$$E = y + V^2/2g$$'].join('\n');
    expect(plainText(body)).toBe('Context\nThe apron is depressed by m, see the note.\na b\nc d');
  });

  it('keeps the words of lists, quotes, code spans and emphasis; drops images, HTML, display math and rules', () => {
    const body = ['- item `code` ~~old~~ ![sketch](u.png) <b>bold</b> costs \\$5', '> quoted', '1. first', '---', '$$', 'E = y + V^2/2g', '$$', '~~~~', '~~~ not closed by a shorter fence', '~~~~', 'after'].join('\n');
    expect(plainText(body)).toBe('item code old bold costs $5\nquoted\nfirst\nafter');
  });

  it('reads every demo case into prose without block inputs or markup', () => {
    for (const demo of readDemoCases()) {
      const text = plainText(demo.body);
      expect(text.length, demo.file).toBeGreaterThan(500);
      expect(text, demo.file).not.toMatch(/```|\$\$|^#|\]\(|^\s*y1 = /m);
    }
  });
});

describe('buildSearchDocument(row)', () => {
  it('carries the key figures of the published revision and the labels people search for', () => {
    const body = `Why this case.\n\n${fence('jump', 'b = 12 m', 'Q = 85 m3/s', 'y1 = 0.62 m')}`;
    const doc = buildSearchDocument(row(body));
    const figures = keyFigures(evaluateCase(body));
    expect(doc).toMatchObject({
      id: 'case-1',
      firmId: 'firm-1',
      body: 'Why this case.',
      structureLabel: 'Culvert outlet',
      sectionShapes: ['rectangular', 'trapezoidal'],
      sectionLabels: ['Rectangular', 'Trapezoidal'],
      calcKinds: ['hydraulic-jump'],
      reviewerNames: ['Josef Warrick'],
      publishedAt: Date.parse('2026-11-03T10:00:00Z'),
      fr1Min: figures.fr1Min,
      fr1Max: figures.fr1Max,
      dischargeMin: 85,
      surgeCelerity: null,
      summary: '',
    });
    expect(doc.calcLabels[0]).toMatch(/hydraulic jump/i);
    expect(doc.blockTitles.length).toBe(1);
  });

  it('gives the surge front speed over the bed, checked against the bore equations', () => {
    // Positive surge running upstream into flow u at depth h: relative celerity
    // c = √(g·h2·(h + h2)/(2h)) and absolute speed w = u − c (Henderson 1966, Open Channel
    // Flow, §9.4, moving hydraulic jump; from memory). The depth behind comes from the block.
    const body = fence('surge', 'h = 1.80 m', 'u = 0.90 m/s', 'direction = upstream', 'dq = -1.00 m2/s');
    const evaluation = evaluateCase(body);
    const h2 = evaluation.blocks[0]!.outputs.find((o) => o.name === 'depthBehind')!.si as number;
    const c = Math.sqrt((g * h2 * (1.8 + h2)) / (2 * 1.8));
    const doc = buildSearchDocument(row(body));
    expect(doc.surgeCelerity).toBeCloseTo(Math.abs(0.9 - c), 6);
  });

  it('caps the indexed body text', () => {
    const doc = buildSearchDocument(row('word '.repeat(10_000)));
    expect(doc.body.length).toBe(MAX_INDEXED_BODY);
  });
});
