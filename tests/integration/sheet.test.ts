/** The calculation sheet: the print view, its PDF (text and paper size read back with pdf.js), and the CSV and JSON exports. */
import { createHash } from 'node:crypto';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { describe, expect, it, beforeAll } from 'vitest';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { db } from '../../src/db/client';
import { evaluateCase } from '../../src/lib/calc/evaluateCase';
import { DESIGN_AID_CAUTION } from '../../src/lib/caution';
import { createCase, saveCase, type CaseMetadata } from '../../src/lib/cases';
import { actOnCase } from '../../src/lib/review';
import { closePdfBrowser, renderPdf } from '../../src/lib/pdf';
import { SOLVER_VERSION } from '../../src/lib/solver';
import { appUrl, call, sessionOf } from '../helpers/app';
import { makeFirm, TEST_PASSWORD, type TestFirm } from '../helpers/firms';

const BODY = 'Basin check.\n\n```jump basin\nb = 12 m\nQ = 85 m3/s\ny1 = 0.53 m\n```\n\n```gate sluice\nb = 4 m\na = 0.5 m\nCc = 0.61\ny0 = 3.2 m\n```\n';
const metadata = (title: string): CaseMetadata => ({ title, structureType: 'spillway-basin', sectionShape: 'rectangular', projectReference: 'PR-4471', tags: [] });

/** The text of every page of a PDF (whitespace collapsed) and each page's size in points. */
async function readPdf(bytes: Uint8Array): Promise<{ pages: string[]; sizes: Array<[number, number]> }> {
  const pdf = await getDocument({ data: bytes, isEvalSupported: false, disableFontFace: true, useSystemFonts: false }).promise;
  const pages: string[] = [];
  const sizes: Array<[number, number]> = [];
  for (let i = 1; i <= pdf.numPages; i++) {
    const page = await pdf.getPage(i);
    const content = await page.getTextContent();
    pages.push(content.items.map((item) => ('str' in item ? item.str : '')).join(' ').replace(/\s+/g, ' '));
    const [x0, y0, x1, y1] = page.view as [number, number, number, number];
    sizes.push([Math.floor(x1 - x0), Math.floor(y1 - y0)]); // Chromium writes A4 as 595.92 × 842.88
  }
  await pdf.destroy();
  return { pages, sizes };
}

const flat = (text: string) => text.replace(/\s+/g, ' ');
const sha = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

/** Uploads files as a browser's form would (with the origin Astro's check expects). */
function upload(caseId: string, cookie: string, files: Array<[string, Uint8Array]>, caption: string): Promise<Response> {
  const form = new FormData();
  for (const [name, bytes] of files) form.append('file', new Blob([new Uint8Array(bytes)]), name);
  form.append('caption', caption);
  return fetch(new URL(`/api/v1/cases/${caseId}/attachments`, appUrl()), { method: 'POST', headers: { cookie, origin: appUrl() }, body: form });
}

describe('calculation sheet and exports', () => {
  let f: TestFirm;
  let other: TestFirm;
  let author: string;
  let rev: string;
  let stranger: string;
  let publishedId: string;
  let publishedSlug: string;
  let draftId: string;
  let reviewerName: string;

  beforeAll(async () => {
    f = await makeFirm({ author: 'engineer', rev: 'reviewer' });
    other = await makeFirm({ someone: 'admin' });
    const published = await createCase(db(), { firmId: f.firm.id, authorId: f.people.author!.userId, metadata: metadata('Weir basin apron level'), body: BODY });
    const as = (who: string) => ({ userId: f.people[who]!.userId, role: f.people[who]!.role });
    expect(await actOnCase(db(), { firmId: f.firm.id, caseId: published.id, actor: as('author'), action: 'submit' })).toMatchObject({ ok: true });
    expect(await actOnCase(db(), { firmId: f.firm.id, caseId: published.id, actor: as('rev'), action: 'approve' })).toMatchObject({ ok: true, state: 'published' });
    publishedId = published.id;
    publishedSlug = published.slug;
    const draft = await createCase(db(), { firmId: f.firm.id, authorId: f.people.author!.userId, metadata: metadata('=HYPERLINK("http://evil.example","x")'), body: BODY });
    draftId = draft.id;
    [author, rev, stranger] = await Promise.all([
      sessionOf(f.people.author!.email, TEST_PASSWORD),
      sessionOf(f.people.rev!.email, TEST_PASSWORD),
      sessionOf(other.people.someone!.email, TEST_PASSWORD),
    ]);
    reviewerName = `rev ${f.people.rev!.email.split('.')[1]!.split('@')[0]}`;
  });

  it('prints the sheet to a PDF with the title block, the caution and page numbers', async () => {
    const response = await call(`/api/v1/cases/${publishedId}/sheet.pdf`, { cookie: rev });
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('application/pdf');
    expect(response.headers.get('content-disposition')).toBe(`attachment; filename="${publishedSlug}-rev1.pdf"`);
    expect(response.headers.get('cache-control')).toMatch(/^private/);
    const bytes = new Uint8Array(await response.arrayBuffer());
    expect(new TextDecoder().decode(bytes.slice(0, 5))).toBe('%PDF-');
    // Kept to look at, like the e2e screenshots.
    mkdirSync(path.resolve('test-results', 'integration'), { recursive: true });
    writeFileSync(path.resolve('test-results', 'integration', 'calculation-sheet.pdf'), bytes);
    const { pages, sizes } = await readPdf(bytes);
    const text = flat(pages.join(' '));
    expect(text).toContain(f.firm.name);
    expect(text).toContain('Weir basin apron level');
    expect(text).toContain('PR-4471');
    expect(text).toMatch(/Revision 1 \(published\)/i);
    expect(text).toMatch(/Checked by/i);
    expect(text).toContain(reviewerName);
    expect(text).toMatch(/Approved by/i);
    expect(text).toContain(SOLVER_VERSION);
    expect(text).toContain('Method notes used');
    expect(text).toContain(DESIGN_AID_CAUTION.slice(0, 60));
    expect(pages[0]).toContain(`Page 1 of ${pages.length}`);
    expect(pages.at(-1)).toContain(`Page ${pages.length} of ${pages.length}`);
    expect(sizes[0]).toEqual([595, 842]);
  }, 90_000);

  it('prints on Letter when asked', async () => {
    const response = await call(`/api/v1/cases/${publishedId}/sheet.pdf?paper=letter`, { cookie: author });
    expect(response.status).toBe(200);
    const { sizes } = await readPdf(new Uint8Array(await response.arrayBuffer()));
    expect(sizes.every(([w, h]) => w === 612 && h === 792)).toBe(true);
  }, 90_000);

  it('marks a draft and says it is not approved', async () => {
    const page = await call(`/cases/${draftId}/sheet`, { cookie: author });
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('data-testid="sheet-status"');
    expect(html).toMatch(/data-testid="sheet-status"[^>]*>\s*DRAFT/);
    expect(html).toMatch(/data-testid="approved-by"[^>]*>not approved/);
    expect(html).toMatch(/data-testid="checked-by"[^>]*>\s*not checked/);
    expect(html).not.toContain('astro-island');
    expect(html).toContain('Sequent method note');
  });

  it('is not found for another firm, or a revision that does not exist; 401 without a session', async () => {
    for (const path of ['sheet.pdf', 'export.csv', 'export.json']) {
      expect((await call(`/api/v1/cases/${publishedId}/${path}`, { cookie: stranger })).status).toBe(404);
      expect((await call(`/api/v1/cases/${publishedId}/${path}?rev=7`, { cookie: author })).status).toBe(404);
      expect((await call(`/api/v1/cases/${publishedId}/${path}`)).status).toBe(401);
    }
    expect((await call(`/cases/${publishedId}/sheet`, { cookie: stranger })).status).toBe(404);
  });

  it('exports every input and result as CSV, guarding a formula-looking title', async () => {
    const response = await call(`/api/v1/cases/${draftId}/export.csv`, { cookie: author });
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('text/csv; charset=utf-8');
    expect(response.headers.get('content-disposition')).toMatch(/^attachment; filename="[a-z0-9-]+-rev1\.csv"$/);
    const text = await response.text();
    const lines = text.split('\r\n');
    expect(lines[0]).toContain(DESIGN_AID_CAUTION);
    expect(lines[1]).toContain(`"'=HYPERLINK(""http://evil.example"",""x"")"`);
    expect(lines[2]).toBe('block,block title,block name,kind,section,row,name,symbol,value,unit,SI value');
    const evaluation = evaluateCase(BODY);
    const outputs = lines.filter((l) => l.includes(',output,'));
    expect(outputs).toHaveLength(evaluation.blocks.reduce((n, b) => n + b.outputs.length, 0));
    const y2 = evaluation.blocks[0]!.outputs.find((o) => o.name === 'y2')!;
    expect(lines).toContain(`1,Stationary hydraulic jump,basin,hydraulic-jump,output,,y2,y2,${y2.text},m,${y2.si}`);
    expect(lines.some((l) => l.startsWith('2,') && l.includes(',input,'))).toBe(true);
  });

  it('exports the whole case as JSON that reads back', async () => {
    const response = await call(`/api/v1/cases/${publishedId}/export.json?rev=1`, { cookie: rev });
    expect(response.status).toBe(200);
    expect(response.headers.get('content-disposition')).toBe(`attachment; filename="${publishedSlug}-rev1.json"`);
    const data = await response.json();
    expect(data).toMatchObject({
      firm: f.firm.name,
      case: { id: publishedId, title: 'Weir basin apron level', projectReference: 'PR-4471', state: 'published', publishedRevision: 1 },
      revision: { number: 1, body: BODY },
      checkedBy: [{ name: reviewerName }],
      approvedBy: { name: reviewerName },
      solverVersion: SOLVER_VERSION,
      caution: DESIGN_AID_CAUTION,
    });
    expect(data.evaluation).toEqual(JSON.parse(JSON.stringify(evaluateCase(BODY))));
    expect(data.methods.map((m: { slug: string }) => m.slug)).toEqual(['hydraulic-jump', expect.any(String)]);
    expect(data.methods[0].sources.length).toBeGreaterThan(0);
  });

  describe('attached files', () => {
    const CSV = new TextEncoder().encode('Q (m3/s),stage (m AOD)\n20,97.85\n40,98.30\n');
    let png: Buffer;
    let caseId: string;

    // Published at revision 1 without files; the files go to revision 2, which a save then writes.
    beforeAll(async () => {
      png = await sharp({ create: { width: 640, height: 400, channels: 3, background: { r: 40, g: 110, b: 170 } } }).png().toBuffer();
      const as = (who: string) => ({ userId: f.people[who]!.userId, role: f.people[who]!.role });
      const created = await createCase(db(), { firmId: f.firm.id, authorId: f.people.author!.userId, metadata: metadata('Tarn weir basin with files'), body: BODY });
      caseId = created.id;
      expect(await actOnCase(db(), { firmId: f.firm.id, caseId, actor: as('author'), action: 'submit' })).toMatchObject({ ok: true });
      expect(await actOnCase(db(), { firmId: f.firm.id, caseId, actor: as('rev'), action: 'approve' })).toMatchObject({ ok: true, state: 'published' });
      const uploaded = await upload(caseId, author, [['tarn-rating.csv', CSV], ['=basin photo.png', png]], 'Survey, May');
      expect(uploaded.status).toBe(201);
      expect((await uploaded.json()).revision).toBe(2);
      const saved = await saveCase(db(), { firmId: f.firm.id, caseId, userId: f.people.author!.userId, baseRevision: 1, body: `${BODY}\nRating attached.\n` });
      expect(saved).toMatchObject({ ok: true });
    });

    it('the JSON export of the revision lists them with their SHA-256; the published revision before has none', async () => {
      const response = await call(`/api/v1/cases/${caseId}/export.json?rev=2`, { cookie: author });
      expect(response.status).toBe(200);
      const data = await response.json();
      expect(data.attachments).toEqual([
        { fileName: 'tarn-rating.csv', contentType: 'text/csv', size: CSV.byteLength, sha256: sha(CSV), caption: 'Survey, May', uploadedBy: expect.stringMatching(/^author /), addedInRevision: 2, url: expect.stringMatching(/^\/api\/v1\/attachments\/[0-9a-f-]{36}$/) },
        { fileName: '=basin photo.png', contentType: 'image/png', size: png.byteLength, sha256: sha(png), caption: 'Survey, May', uploadedBy: expect.any(String), addedInRevision: 2, url: expect.any(String) },
      ]);
      const download = await call(data.attachments[1].url, { cookie: rev });
      expect(sha(new Uint8Array(await download.arrayBuffer()))).toBe(sha(png));
      const before = await (await call(`/api/v1/cases/${caseId}/export.json?rev=1`, { cookie: author })).json();
      expect(before.attachments).toEqual([]);
    });

    it('the CSV export gets one guarded attachment row per file, under the same header', async () => {
      const lines = (await (await call(`/api/v1/cases/${caseId}/export.csv?rev=2`, { cookie: author })).text()).split('\r\n');
      expect(lines[2]).toBe('block,block title,block name,kind,section,row,name,symbol,value,unit,SI value');
      const rows = lines.filter((l) => l.includes(',attachment,'));
      expect(rows).toHaveLength(2);
      expect(rows[0]).toMatch(new RegExp(`^,"Survey, May",author [^,]+,text/csv,attachment,1,tarn-rating.csv,sha256,${sha(CSV)},,${CSV.byteLength}$`));
      expect(rows[1]).toContain(`,image/png,attachment,2,'=basin photo.png,sha256,${sha(png)},,${png.byteLength}`);
      const before = await (await call(`/api/v1/cases/${caseId}/export.csv?rev=1`, { cookie: author })).text();
      expect(before).not.toContain(',attachment,');
    });

    it('the sheet lists them (images with a thumbnail that loads); revision 1 does not', async () => {
      const html = await (await call(`/cases/${caseId}/sheet?rev=2`, { cookie: rev })).text();
      expect(html).toContain('data-testid="sheet-attachments"');
      expect(html).toContain('Attached files');
      expect(html.match(/data-testid="sheet-attachment"/g)).toHaveLength(2);
      expect(html).toContain('tarn-rating.csv');
      expect(html).toContain('=basin photo.png');
      expect(html).toContain(sha(png).slice(0, 12));
      expect(html).toContain(`title="SHA-256 ${sha(CSV)}"`);
      expect(html).toContain('CSV file');
      expect(html).toContain('PNG image');
      const thumb = /<img src="(\/api\/v1\/attachments\/[0-9a-f-]{36}\/thumbnail)"/.exec(html);
      expect(thumb).not.toBeNull();
      const thumbnail = await call(thumb![1]!, { cookie: rev });
      expect(thumbnail.status).toBe(200);
      expect(thumbnail.headers.get('content-type')).toBe('image/webp');
      const before = await (await call(`/cases/${caseId}/sheet?rev=1`, { cookie: rev })).text();
      expect(before).not.toContain('data-testid="sheet-attachments"');
      expect(before).not.toContain('tarn-rating.csv');
    });

    it('the PDF of the revision carries the list', async () => {
      const response = await call(`/api/v1/cases/${caseId}/sheet.pdf?rev=2`, { cookie: author });
      expect(response.status).toBe(200);
      const bytes = new Uint8Array(await response.arrayBuffer());
      mkdirSync(path.resolve('test-results', 'integration'), { recursive: true });
      writeFileSync(path.resolve('test-results', 'integration', 'calculation-sheet-files.pdf'), bytes);
      const text = flat((await readPdf(bytes)).pages.join(' '));
      expect(text).toContain('Attached files');
      expect(text).toContain('tarn-rating.csv');
      expect(text).toContain(sha(CSV).slice(0, 12));
    }, 90_000);
  });

  it('says Chromium is unavailable, rather than throwing, when it cannot be started', async () => {
    const before = process.env.CHROMIUM_PATH;
    process.env.CHROMIUM_PATH = '/nonexistent/chromium';
    try {
      await closePdfBrowser();
      const result = await renderPdf({ url: 'http://127.0.0.1:9/', cookie: '', format: 'A4', footerText: 'x' });
      expect(result).toMatchObject({ ok: false, reason: 'unavailable' });
    } finally {
      if (before === undefined) delete process.env.CHROMIUM_PATH;
      else process.env.CHROMIUM_PATH = before;
    }
  });
});
