/**
 * The demo seed (run by the test setup against the test database, with the test file store):
 * demo files go onto the revision the demo case publishes, byte for byte, and a second run
 * adds nothing.
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { and, eq } from 'drizzle-orm';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { db } from '../../src/db/client';
import { attachment, caseFile, caseRevision, organization } from '../../src/db/schema';
import { DEMO_PASSWORD, seedDemo } from '../../src/db/seed';
import { attachmentsOfRevision } from '../../src/lib/attachments';
import { hashPassword } from '../../src/lib/auth';
import { LocalFileStore } from '../../src/lib/storage';
import { call, sessionOf } from '../helpers/app';

const FILES = path.join(process.cwd(), 'content', 'cases', 'files');
const TITLE = 'Harrowgate Reservoir auxiliary spillway — stilling basin and apron level';
const sha = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');
const committed = (name: string) => new Uint8Array(readFileSync(path.join(FILES, name)));
const captions = JSON.parse(readFileSync(path.join(FILES, 'captions.json'), 'utf8')) as Record<string, string>;

let firmId: string;
let caseId: string;
let published: number;

beforeAll(async () => {
  // Services called here store files where the test app does.
  process.env.SEQUENT_FILES_DIR = inject('filesDir');
  const [firm] = await db().select({ id: organization.id }).from(organization).where(eq(organization.slug, 'kestrel-weir'));
  firmId = firm!.id;
  const [found] = await db()
    .select({ id: caseFile.id, publishedRevision: caseFile.publishedRevision, state: caseFile.state })
    .from(caseFile)
    .where(and(eq(caseFile.firmId, firmId), eq(caseFile.title, TITLE)));
  // Revision 1 is the body as created; attaching the rating its blocks read wrote revision 2,
  // recalculated with it, which the review then published.
  expect(found).toMatchObject({ state: 'published', publishedRevision: 2 });
  caseId = found!.id;
  published = found!.publishedRevision!;
});

describe('demo attachments', () => {
  it('case 01 publishes its rating CSV and basin sketch, uploaded by its author with their captions', async () => {
    const files = await attachmentsOfRevision(db(), firmId, caseId, published);
    expect(files.map((f) => ({ fileName: f.fileName, contentType: f.contentType, sha256: f.sha256, size: f.size, caption: f.caption, uploaderName: f.uploaderName, addedInRevision: f.addedInRevision }))).toEqual([
      { fileName: 'harrowgate-tailwater-rating.csv', contentType: 'text/csv', sha256: sha(committed('harrowgate-tailwater-rating.csv')), size: committed('harrowgate-tailwater-rating.csv').byteLength, caption: captions['harrowgate-tailwater-rating.csv'], uploaderName: 'Tomas Ilvar', addedInRevision: 2 },
      { fileName: 'harrowgate-basin-sketch.png', contentType: 'image/png', sha256: sha(committed('harrowgate-basin-sketch.png')), size: committed('harrowgate-basin-sketch.png').byteLength, caption: captions['harrowgate-basin-sketch.png'], uploaderName: 'Tomas Ilvar', addedInRevision: 2 },
    ]);
    expect(files[1]!.thumbnailUrl).not.toBeNull();
  });

  it('publishes results computed from the attached rating (no block errors), and revision 1 keeps none of the files', async () => {
    const [row] = await db().select({ results: caseRevision.results }).from(caseRevision).where(and(eq(caseRevision.caseId, caseId), eq(caseRevision.number, published)));
    const tailwater = row!.results.blocks.filter((b) => b.kind === 'tailwater-check');
    expect(tailwater).toHaveLength(2);
    for (const block of tailwater) {
      expect(block.errors).toEqual([]);
      expect(block.tables?.[0]?.source).toBe('harrowgate-tailwater-rating.csv');
    }
    expect(await attachmentsOfRevision(db(), firmId, caseId, 1)).toEqual([]);
  });

  it('stores the committed bytes, which download unchanged from the app', async () => {
    const store = new LocalFileStore(inject('filesDir'));
    const rows = await db().select({ storageKey: attachment.storageKey, sha256: attachment.sha256 }).from(attachment).where(eq(attachment.caseId, caseId));
    for (const row of rows) {
      const bytes = await store.get(row.storageKey);
      expect(bytes && sha(bytes)).toBe(row.sha256);
    }
    const maren = await sessionOf('maren.castell@kestrelweir.example', DEMO_PASSWORD);
    const data = await (await call(`/api/v1/cases/${caseId}/export.json?rev=published`, { cookie: maren })).json();
    expect(data.attachments.map((a: { fileName: string; sha256: string }) => [a.fileName, a.sha256])).toEqual([
      ['harrowgate-tailwater-rating.csv', sha(committed('harrowgate-tailwater-rating.csv'))],
      ['harrowgate-basin-sketch.png', sha(committed('harrowgate-basin-sketch.png'))],
    ]);
    const sketch = await call(data.attachments[1].url, { cookie: maren });
    expect(sha(new Uint8Array(await sketch.arrayBuffer()))).toBe(sha(committed('harrowgate-basin-sketch.png')));
  });

  it('a second seed run adds no case and no file', async () => {
    const before = await db().select({ id: attachment.id }).from(attachment).where(eq(attachment.firmId, firmId));
    expect(await seedDemo(db(), hashPassword)).toEqual({ people: 0, cases: 0 });
    const after = await db().select({ id: attachment.id }).from(attachment).where(eq(attachment.firmId, firmId));
    expect(after.length).toBe(before.length);
    expect(after.length).toBe(3);
  });

  it('case 02 publishes its outlet sketch (a JPEG)', async () => {
    const [found] = await db()
      .select({ id: caseFile.id, publishedRevision: caseFile.publishedRevision })
      .from(caseFile)
      .where(and(eq(caseFile.firmId, firmId), eq(caseFile.title, 'Kilnbarrow Lane culvert — outlet jump into the trapezoidal Tarrowby Beck channel')));
    const files = await attachmentsOfRevision(db(), firmId, found!.id, found!.publishedRevision!);
    expect(files.map((f) => [f.fileName, f.contentType, f.sha256, f.uploaderName])).toEqual([
      ['kilnbarrow-outlet-sketch.jpg', 'image/jpeg', sha(committed('kilnbarrow-outlet-sketch.jpg')), 'Priya Odunya'],
    ]);
  });
});
