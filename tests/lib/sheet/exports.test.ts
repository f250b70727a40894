import { describe, expect, it } from 'vitest';
import { evaluateCase } from '../../../src/lib/calc/evaluateCase';
import { DESIGN_AID_CAUTION } from '../../../src/lib/caution';
import { caseCsv, caseJson, CSV_COLUMNS, exportFileName, type ExportFacts } from '../../../src/lib/sheet/exports';
import { NO_KEY_FIGURES } from '../../../src/lib/cases/keyFigures';
import type { AttachmentView } from '../../../src/lib/attachments/services';

const BODY = '```jump basin\nb = 12 m\nQ = 85 m3/s\ny1 = 0.53 m\n```\n\n```tailwater sweep\nshape = rectangular\nb = 12 m\nQ = 40 to 120 m3/s step 40\ntoe = head\nH = 12 m\nk = 0.05\nrating:\n  Q m3/s | TW m\n  20     | 1.35\n  80     | 2.55\n  160    | 3.65\n```\n';
const when = new Date('2026-03-01T10:00:00Z');

const SHA = 'ab'.repeat(32);

function file(fileName: string, contentType: string, caption: string, extra: Partial<AttachmentView> = {}): AttachmentView {
  return {
    id: `id-${fileName}`, caseId: 'c1', fileName, contentType, size: 2048, sha256: SHA, caption, hasThumbnail: contentType.startsWith('image/'),
    addedInRevision: 1, removedInRevision: null, uploaderId: 'u1', uploaderName: 'Ann Author', createdAt: when,
    url: `/api/v1/attachments/id-${fileName}`, thumbnailUrl: contentType.startsWith('image/') ? `/api/v1/attachments/id-${fileName}/thumbnail` : null, ...extra,
  };
}

function facts(title: string, body = BODY, attachments: AttachmentView[] = []): ExportFacts {
  const caseRow = {
    id: 'c1', slug: 'weir', title, structureType: 'weir', sectionShape: 'rectangular', projectReference: '+44 ref', summary: null, region: null, tags: [],
    state: 'published' as const, authorId: 'u1', authorName: 'Ann Author', latestRevision: 1, publishedRevision: 1, createdAt: when, updatedAt: when,
    keyFigures: NO_KEY_FIGURES, revision: { number: 1, body, solverVersion: '1.0.0', authorName: 'Ann Author', createdAt: when }, history: [], revisionCount: 1,
  };
  const approval = { reviewerId: 'u2', reviewerName: 'Rita Reviewer', createdAt: when, solverVersion: '1.0.0' };
  return {
    firmName: 'Firm, "Quoted"',
    sheet: { case: caseRow, revision: caseRow.revision, signoff: { checkedBy: [approval], approvedBy: approval }, attachments },
    evaluation: evaluateCase(body),
    methods: [{ slug: 'hydraulic-jump', title: 'Hydraulic jump', sources: ['Chow 1959'] }],
  };
}

describe('caseCsv', () => {
  it('starts with the caution and the case, guards formula-looking cells and quotes by RFC 4180', () => {
    const lines = caseCsv(facts('=cmd|"/c calc"!A1')).split('\r\n');
    expect(lines[0]).toBe(`"# Sequent calculation export. ${DESIGN_AID_CAUTION}"`);
    expect(lines[1]).toBe(`# case,"'=cmd|""/c calc""!A1",firm,"Firm, ""Quoted""",project,'+44 ref,revision,1,solver,${evaluateCase(BODY).solverVersion}`);
    expect(lines.at(-1)).toBe('');
  });

  it('has a row per input and result, and per cell of a table', () => {
    const f = facts('Weir');
    const lines = caseCsv(f).split('\r\n');
    const [jump, sweep] = f.evaluation.blocks;
    expect(lines.filter((l) => l.startsWith('1,') && l.includes(',output,'))).toHaveLength(jump!.outputs.length);
    expect(lines.filter((l) => l.startsWith('1,') && l.includes(',input,'))).toHaveLength(jump!.inputs.length);
    expect(sweep!.table).toBeDefined();
    expect(lines.filter((l) => l.startsWith('2,') && l.includes(',table,'))).toHaveLength(sweep!.table!.rows.length * sweep!.table!.columns.length);
    const fr1 = jump!.outputs.find((o) => o.name === 'fr1')!;
    expect(lines).toContain(`1,Stationary hydraulic jump,basin,hydraulic-jump,output,,fr1,${fr1.symbol},${fr1.text},,${fr1.si}`);
  });

  it('lists the revision\'s files after the blocks as attachment rows, guarded and under the same header', () => {
    const attachments = [file('rating.csv', 'text/csv', 'Rating, gauge 27014'), file('=evil.png', 'image/png', '@SUM(A1)', { uploaderName: '-Mallory', size: 99 })];
    const lines = caseCsv(facts('Weir', BODY, attachments)).split('\r\n');
    expect(lines[2]).toBe(CSV_COLUMNS.join(','));
    const rows = lines.filter((l) => l.includes(',attachment,'));
    expect(rows).toEqual([
      `,"Rating, gauge 27014",Ann Author,text/csv,attachment,1,rating.csv,sha256,${SHA},,2048`,
      `,'@SUM(A1),'-Mallory,image/png,attachment,2,'=evil.png,sha256,${SHA},,99`,
    ]);
    // After every block row, one row per file, and nothing else follows.
    expect(lines.slice(-3, -1)).toEqual(rows);
    expect(caseCsv(facts('Weir')).includes(',attachment,')).toBe(false);
  });
});

describe('caseJson', () => {
  it('carries the case, revision, results, sign-off, solver and caution, and survives JSON', () => {
    const f = facts('Weir');
    const data = JSON.parse(JSON.stringify(caseJson(f)));
    expect(data).toMatchObject({
      firm: 'Firm, "Quoted"',
      case: { slug: 'weir', title: 'Weir', state: 'published' },
      revision: { number: 1, body: BODY, createdAt: when.toISOString() },
      checkedBy: [{ name: 'Rita Reviewer', at: when.toISOString() }],
      approvedBy: { name: 'Rita Reviewer' },
      caution: DESIGN_AID_CAUTION,
    });
    expect(data.evaluation).toEqual(JSON.parse(JSON.stringify(f.evaluation)));
    expect(data.attachments).toEqual([]);
  });

  it('lists the revision\'s files with name, type, size, SHA-256, caption, uploader, revision and URL', () => {
    const data = JSON.parse(JSON.stringify(caseJson(facts('Weir', BODY, [file('sketch.png', 'image/png', 'Basin sketch', { addedInRevision: 2 })]))));
    expect(data.attachments).toEqual([
      { fileName: 'sketch.png', contentType: 'image/png', size: 2048, sha256: SHA, caption: 'Basin sketch', uploadedBy: 'Ann Author', addedInRevision: 2, url: '/api/v1/attachments/id-sketch.png' },
    ]);
  });
});

it('names files <slug>-rev<n>.<ext>', () => {
  expect(exportFileName('weir-basin', 3, 'pdf')).toBe('weir-basin-rev3.pdf');
});
