/**
 * The demo cases in content/cases: frontmatter keys and allowed values, and every
 * calculation block evaluates without errors on the shared solver.
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { evaluateCase, type BlockFiles } from '../../src/lib/calc';
import type { BlockResult } from '../../src/lib/calc';
import { readDemoCases } from '../../src/db/demoCases';

const DIR = join(process.cwd(), 'content', 'cases');

const KEYS = ['title', 'author', 'structureType', 'sectionShape', 'projectReference', 'region', 'tags', 'summary'];
const AUTHORS = ['tomas.ilvar@kestrelweir.example', 'priya.odunya@kestrelweir.example'];
/** Optional: where the seed leaves the case in review (see src/db/demoCases.ts). */
const REVIEW_KEYS = ['review', 'reviewer', 'reviewComment'];
/** Optional: files the seed attaches, named in content/cases/files/ (captions in its captions.json). */
const FILE_KEYS = ['attachments'];
const REVIEWERS = ['helena.brandt@kestrelweir.example', 'josef.warrick@kestrelweir.example'];
const STRUCTURE_TYPES = ['spillway-basin', 'chute-outlet', 'culvert-outlet', 'outfall', 'drop-structure', 'gate-tailwater', 'weir-tailwater', 'canal-surge', 'tidal-bore', 'dam-break', 'other'];
const SECTION_SHAPES = ['rectangular', 'trapezoidal', 'triangular', 'circular', 'mixed'];

type Scalar = string | string[];

/** Splits the leading `---` block off a markdown file. */
function splitFrontmatter(text: string): { yaml: string; body: string } {
  const match = /^---\n([\s\S]*?)\n---\n([\s\S]*)$/.exec(text.replace(/\r\n/g, '\n'));
  if (!match) throw new Error('no leading --- frontmatter block');
  return { yaml: match[1]!, body: match[2]! };
}

/** A minimal YAML subset: `key: value` lines, values plain, quoted or `[a, b]` flow lists. */
function readYaml(yaml: string): Record<string, Scalar> {
  const out: Record<string, Scalar> = {};
  for (const [index, line] of yaml.split('\n').entries()) {
    if (line.trim() === '' || line.trimStart().startsWith('#')) continue;
    const m = /^([A-Za-z][A-Za-z0-9]*):\s*(.*)$/.exec(line);
    if (!m) throw new Error(`frontmatter line ${index + 2} is not "key: value": ${line}`);
    const [, key, raw] = m as unknown as [string, string, string];
    if (key in out) throw new Error(`frontmatter key ${key} appears twice`);
    const value = raw.trim();
    const unquote = (s: string) => (/^(['"]).*\1$/.test(s) ? s.slice(1, -1) : s);
    out[key] = value.startsWith('[') && value.endsWith(']')
      ? value.slice(1, -1).split(',').map((s) => unquote(s.trim())).filter((s) => s !== '')
      : unquote(value);
  }
  return out;
}

interface DemoCase {
  file: string;
  meta: Record<string, Scalar>;
  body: string;
  blocks: readonly BlockResult[];
}

const files = readdirSync(DIR).filter((f) => f.endsWith('.md')).sort();
const cases: DemoCase[] = files.map((file) => {
  const { yaml, body } = splitFrontmatter(readFileSync(join(DIR, file), 'utf8'));
  const meta = readYaml(yaml);
  return { file, meta, body, blocks: evaluateCase(body, demoFiles(meta['attachments'])).blocks };
});

/** The demo files a case attaches, as its blocks read them after the seed. */
function demoFiles(names: unknown): BlockFiles {
  const list = Array.isArray(names) ? names.map(String) : [];
  const texts = Object.fromEntries(list.filter((n) => n.endsWith('.csv')).map((n) => [n, readFileSync(join(DIR, 'files', n), 'utf8')]));
  return { names: list, texts };
}

const byType = (type: string) => cases.filter((c) => c.meta['structureType'] === type);
const si = (block: BlockResult, name: string) => block.outputs.find((o) => o.name === name)?.si;

describe('demo cases in content/cases', () => {
  it('there are eight of them, with distinct project references and titles', () => {
    expect(files).toHaveLength(8);
    expect(new Set(cases.map((c) => c.meta['projectReference'])).size).toBe(8);
    expect(new Set(cases.map((c) => c.meta['title'])).size).toBe(8);
  });

  it('cover the required structure types', () => {
    for (const type of ['spillway-basin', 'culvert-outlet', 'canal-surge', 'tidal-bore', 'drop-structure', 'outfall', 'gate-tailwater', 'dam-break']) {
      expect(byType(type), type).toHaveLength(1);
    }
  });

  describe.each(cases.map((c) => [c.file, c] as const))('%s', (_file, c) => {
    it('has exactly the frontmatter keys, with allowed values', () => {
      const reviewKeys = Object.keys(c.meta).filter((k) => REVIEW_KEYS.includes(k));
      expect(Object.keys(c.meta).filter((k) => !REVIEW_KEYS.includes(k) && !FILE_KEYS.includes(k)).sort()).toEqual([...KEYS].sort());
      if (reviewKeys.length) {
        expect(['in_review', 'returned', 'published']).toContain(c.meta.review);
        if (c.meta.reviewer !== undefined) expect(REVIEWERS).toContain(c.meta.reviewer);
      }
      const { title, author, structureType, sectionShape, projectReference, region, tags, summary } = c.meta;
      expect(typeof title === 'string' && title.length >= 3 && title.length <= 160).toBe(true);
      expect(AUTHORS).toContain(author);
      expect(STRUCTURE_TYPES).toContain(structureType);
      expect(SECTION_SHAPES).toContain(sectionShape);
      expect(projectReference).toMatch(/^KWC-\d{4}$/);
      expect(typeof region === 'string' && region.length > 0 && region.length <= 80).toBe(true);
      expect(Array.isArray(tags)).toBe(true);
      expect((tags as string[]).length).toBeGreaterThanOrEqual(2);
      expect((tags as string[]).length).toBeLessThanOrEqual(5);
      for (const tag of tags as string[]) expect(tag).toMatch(/^[a-z]+$/);
      expect(new Set(tags as string[]).size).toBe((tags as string[]).length);
      // One sentence: text ending in a full stop, with no sentence break inside.
      expect(typeof summary === 'string' && summary.endsWith('.')).toBe(true);
      expect(summary as string).not.toMatch(/[.!?]\s+[A-Z]/);
    });

    it('has calculation blocks that all evaluate without errors', () => {
      expect(c.blocks.length).toBeGreaterThan(0);
      for (const block of c.blocks) {
        expect(block.errors, `${c.file} block ${block.name ?? block.index} (line ${block.line})`).toEqual([]);
        expect(block.status).toBe('ok');
      }
    });

    it('names every block, and its velocities are physically plausible (≤ 25 m/s)', () => {
      for (const block of c.blocks) {
        expect(block.name).toMatch(/^[A-Za-z][A-Za-z0-9_-]*$/);
        for (const output of block.outputs) {
          if (output.quantity === 'velocity' && typeof output.si === 'number') expect(Math.abs(output.si)).toBeLessThanOrEqual(25);
        }
      }
    });

    it('closes with the design-aid caution', () => {
      expect(c.body).toMatch(/design aids/);
      expect(c.body).toMatch(/licensed engineer/);
      expect(c.body).toMatch(/physical model stud/);
    });
  });

  it('name only files that exist in content/cases/files, each with a caption, and the seed reads them the same way', () => {
    const captions = JSON.parse(readFileSync(join(DIR, 'files', 'captions.json'), 'utf8')) as Record<string, string>;
    const seeded = readDemoCases();
    for (const c of cases) {
      const named = (c.meta['attachments'] ?? []) as string[];
      expect(Array.isArray(named)).toBe(true);
      for (const name of named) {
        expect(existsSync(join(DIR, 'files', name)), name).toBe(true);
        expect(captions[name], name).toMatch(/\w/);
      }
      expect(seeded.find((s) => s.file === c.file)!.attachments).toEqual(named.map((fileName) => ({ fileName, caption: captions[fileName] })));
    }
    expect(byType('spillway-basin')[0]!.meta['attachments']).toEqual(['harrowgate-tailwater-rating.csv', 'harrowgate-basin-sketch.png']);
  });

  it('case 1\'s tailwater blocks read the attached rating CSV, as stage less each block\'s apron level', () => {
    const [c] = byType('spillway-basin');
    const [comment, header] = readFileSync(join(DIR, 'files', 'harrowgate-tailwater-rating.csv'), 'utf8').split('\n');
    expect(comment).toMatch(/^# .*invented demo data/);
    expect(header).toBe('Q (m3/s),stage (m AOD)');
    const tailwater = c!.blocks.filter((b) => b.kind === 'tailwater-check');
    expect(tailwater.map((b) => b.tables?.[0]?.source)).toEqual(['harrowgate-tailwater-rating.csv', 'harrowgate-tailwater-rating.csv']);
    // The prose's figures: swept out at every flow at 96.50 m AOD (lowering ≈ 0.62 m), none at 95.50 m AOD.
    const [existing, lowered] = tailwater;
    expect(si(existing!, 'requiredApronLowering') as number).toBeCloseTo(0.62, 2);
    expect(si(lowered!, 'sweptOutCount')).toBe(0);
  });

  it('case 1 (spillway basin) chains toe → jump → tailwater with a steady design jump', () => {
    const [c] = byType('spillway-basin');
    const words = c!.blocks.map((b) => b.word);
    expect(words).toEqual(expect.arrayContaining(['toe', 'jump', 'tailwater']));
    const jump = c!.blocks.find((b) => b.word === 'jump')!;
    expect(si(jump, 'fr1') as number).toBeGreaterThan(5);
    expect(si(jump, 'fr1') as number).toBeLessThan(8);
    expect(si(jump, 'jumpType')).toBe('steady');
  });

  it('case 2 (culvert outlet) has a trapezoidal jump with 4 < Fr1 < 6', () => {
    const [c] = byType('culvert-outlet');
    expect(c!.meta['sectionShape']).toBe('trapezoidal');
    const jumps = c!.blocks.filter((b) => b.kind === 'hydraulic-jump');
    expect(jumps.length).toBeGreaterThan(0);
    for (const jump of jumps) {
      expect(jump.inputs.find((i) => i.name === 'shape')?.si).toBe('trapezoidal');
      expect(si(jump, 'fr1') as number).toBeGreaterThan(4);
      expect(si(jump, 'fr1') as number).toBeLessThan(6);
    }
  });

  it('case 3 (canal surge) runs upstream from a change of discharge with an undular front', () => {
    const [c] = byType('canal-surge');
    const surges = c!.blocks.filter((b) => b.kind === 'surge');
    expect(surges.length).toBeGreaterThan(0);
    for (const s of surges) {
      expect(s.inputs.find((i) => i.name === 'dischargeChange')).toBeDefined();
      expect(si(s, 'surgeSpeed') as number).toBeLessThan(0);
      expect(s.warnings.map((w) => w.code)).toContain('undular-bore');
    }
  });

  it('case 4 (tidal bore) runs into the ebb and shows both a breaking and an undular front', () => {
    const [c] = byType('tidal-bore');
    const surges = c!.blocks.filter((b) => b.kind === 'surge');
    for (const s of surges) expect(s.inputs.find((i) => i.name === 'velocity')?.si as number).toBeGreaterThan(0);
    expect(surges.map((s) => si(s, 'frontType'))).toEqual(expect.arrayContaining(['breaking', 'undular']));
  });

  it('case 5 (drop structure) is written in US customary units', () => {
    const [c] = byType('drop-structure');
    for (const block of c!.blocks) expect(block.unitSystem).toBe('US');
  });

  it('case 6 (outfall) has a jump in a circular section with a near-crown warning', () => {
    const [c] = byType('outfall');
    const jumps = c!.blocks.filter((b) => b.kind === 'hydraulic-jump');
    for (const jump of jumps) expect(jump.inputs.find((i) => i.name === 'shape')?.si).toBe('circular');
    expect(jumps.flatMap((j) => j.warnings.map((w) => w.code))).toContain('near-crown');
  });

  it('case 7 (gate tailwater) chains gate → jump and the solver warns of an undular jump', () => {
    const [c] = byType('gate-tailwater');
    expect(c!.blocks.map((b) => b.word)).toEqual(expect.arrayContaining(['gate', 'jump']));
    const jumps = c!.blocks.filter((b) => b.kind === 'hydraulic-jump');
    expect(jumps.length).toBeGreaterThan(0);
    for (const jump of jumps) {
      expect(si(jump, 'fr1') as number).toBeGreaterThan(1.3);
      expect(si(jump, 'fr1') as number).toBeLessThan(1.7);
      expect(jump.warnings.map((w) => w.code)).toContain('undular-jump');
    }
  });

  it('case 8 (dam break) uses the wet-bed dambreak block', () => {
    const [c] = byType('dam-break');
    const breaks = c!.blocks.filter((b) => b.kind === 'dam-break');
    expect(breaks.length).toBeGreaterThan(0);
    for (const b of breaks) expect(b.warnings.map((w) => w.code)).not.toContain('nearly-dry-bed');
  });
});
