/** Attachments over HTTP: upload checks, storage on disk, downloads, revisions and who may do what. */
import { createHash } from 'node:crypto';
import { readdir } from 'node:fs/promises';
import path from 'node:path';
import { and, asc, eq, like } from 'drizzle-orm';
import sharp from 'sharp';
import { db } from '../../src/db/client';
import { auditEvent } from '../../src/db/schema';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { appUrl, call, sessionOf } from '../helpers/app';
import { makeFirm, TEST_PASSWORD, type TestFirm } from '../helpers/firms';

const BODY = 'Stilling basin check.\n\n```jump basin\nb = 4 m\nQ = 12 m3/s\ny1 = 0.35 m\n```\n';
const metadata = { title: 'Ferrow weir basin photos', structureType: 'spillway-basin', sectionShape: 'rectangular' } as const;
const ZIP = Buffer.from('UEsDBBQAAAAAAOg9gl2GphA2BQAAAAUAAAAFAAAAYS50eHRoZWxsb1BLAQIUAxQAAAAAAOg9gl2GphA2BQAAAAUAAAAFAAAAAAAAAAAAAACAAQAAAABhLnR4dFBLBQYAAAAAAQABADMAAAAoAAAAAAA=', 'base64');
const EXE = Buffer.concat([Buffer.from('MZ'), Buffer.alloc(58), Buffer.from([0x80, 0, 0, 0]), Buffer.alloc(64), Buffer.from('PE\0\0'), Buffer.alloc(200)]);
const PDF = Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n');
const CSV = Buffer.from('station,discharge_m3s\nKm 1+200,12.5\nKm 1+450,13.1\n');

let f: TestFirm;
let author: string;
let colleague: string;
let reviewer: string;
let outsider: string;
let png: Buffer;
let jpeg: Buffer;

const sha = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');

beforeAll(async () => {
  f = await makeFirm({ author: 'engineer', colleague: 'engineer', rev: 'reviewer' });
  author = await sessionOf(f.people.author!.email, TEST_PASSWORD);
  colleague = await sessionOf(f.people.colleague!.email, TEST_PASSWORD);
  reviewer = await sessionOf(f.people.rev!.email, TEST_PASSWORD);
  const other = await makeFirm({ eng: 'engineer' });
  outsider = await sessionOf(other.people.eng!.email, TEST_PASSWORD);
  png = await sharp({ create: { width: 800, height: 600, channels: 3, background: { r: 30, g: 90, b: 160 } } }).png().toBuffer();
  jpeg = await sharp({ create: { width: 1200, height: 900, channels: 3, background: { r: 120, g: 140, b: 90 } } }).jpeg().toBuffer();
});

async function newCase(): Promise<string> {
  const response = await call('/api/v1/cases', { cookie: author, json: { ...metadata, body: BODY } });
  expect(response.status).toBe(201);
  return (await response.json()).case.id;
}

/** Uploads files as a browser's form would (with the origin Astro's check expects). */
function upload(caseId: string, files: Array<[string, Uint8Array, string?]>, cookie = author, caption?: string): Promise<Response> {
  const form = new FormData();
  for (const [name, bytes, type] of files) form.append('file', new Blob([new Uint8Array(bytes)], { type: type ?? 'application/octet-stream' }), name);
  if (caption !== undefined) form.append('caption', caption);
  return fetch(new URL(`/api/v1/cases/${caseId}/attachments`, appUrl()), { method: 'POST', headers: { cookie, origin: appUrl() }, body: form });
}

async function storedFiles(): Promise<string[]> {
  const root = inject('filesDir');
  const entries = await readdir(root, { recursive: true, withFileTypes: true });
  return entries.filter((e) => e.isFile()).map((e) => path.relative(root, path.join(e.parentPath, e.name)));
}

describe('POST /api/v1/cases/:id/attachments', () => {
  it('stores a photo, a PDF and a CSV; they round-trip byte for byte with safe headers', async () => {
    const id = await newCase();
    const response = await upload(id, [['basin.png', png, 'image/png'], ['report.pdf', PDF], ['levels.csv', CSV, 'text/csv']], author, 'Survey, March');
    expect(response.status).toBe(201);
    const added = await response.json();
    expect(added.revision).toBe(1);
    expect(added.attachments).toHaveLength(3);
    const [image, pdf, csv] = added.attachments;
    expect(image).toMatchObject({ fileName: 'basin.png', contentType: 'image/png', size: png.byteLength, sha256: sha(png), caption: 'Survey, March', hasThumbnail: true });
    expect(pdf).toMatchObject({ contentType: 'application/pdf', hasThumbnail: false, thumbnailUrl: null });
    expect(csv).toMatchObject({ contentType: 'text/csv' });

    const download = await call(image.url, { cookie: colleague });
    expect(download.status).toBe(200);
    const bytes = new Uint8Array(await download.arrayBuffer());
    expect(sha(bytes)).toBe(sha(png));
    expect(download.headers.get('content-type')).toBe('image/png');
    expect(download.headers.get('content-length')).toBe(String(png.byteLength));
    expect(download.headers.get('x-content-type-options')).toBe('nosniff');
    expect(download.headers.get('content-security-policy')).toBe("default-src 'none'; sandbox");
    expect(download.headers.get('cache-control')).toMatch(/^private/);
    expect(download.headers.get('content-disposition')).toMatch(/^inline; .*filename\*=UTF-8''basin\.png$/);

    const pdfDownload = await call(pdf.url, { cookie: colleague });
    expect(sha(new Uint8Array(await pdfDownload.arrayBuffer()))).toBe(sha(PDF));
    expect(pdfDownload.headers.get('content-disposition')).toMatch(/^attachment; .*filename\*=UTF-8''report\.pdf$/);
    const csvDownload = await call(csv.url, { cookie: colleague });
    expect(csvDownload.headers.get('content-type')).toBe('text/csv; charset=utf-8');
    expect(await csvDownload.text()).toBe(CSV.toString());

    const thumb = await call(image.thumbnailUrl, { cookie: colleague });
    expect(thumb.status).toBe(200);
    expect(thumb.headers.get('content-type')).toBe('image/webp');
    const meta = await sharp(Buffer.from(await thumb.arrayBuffer())).metadata();
    expect(meta).toMatchObject({ format: 'webp', width: 320, height: 240 });
    expect((await call(pdf.url + '/thumbnail', { cookie: colleague })).status).toBe(404);

    const files = await storedFiles();
    expect(files).toContain(path.join(sha(png).slice(0, 2), sha(png).slice(2)));

    const list = await (await call(`/api/v1/cases/${id}/attachments`, { cookie: colleague })).json();
    expect(list.attachments.map((a: { fileName: string }) => a.fileName)).toEqual(['basin.png', 'report.pdf', 'levels.csv']);
  });

  it('refuses a 26 MB file with 413 and says why', async () => {
    const id = await newCase();
    const big = Buffer.alloc(26 * 1024 * 1024, 0x61);
    const response = await upload(id, [['huge.csv', big]]);
    expect(response.status).toBe(413);
    const body = await response.json();
    expect(body.error.message).toMatch(/huge\.csv is 26 MB: files may be at most 25 MB/);
    expect(body.error.issues).toEqual([{ path: 'huge.csv', message: expect.stringContaining('at most 25 MB') }]);
  });

  it('refuses a body over the request limit before reading it', async () => {
    const id = await newCase();
    const response = await upload(id, [['a.csv', Buffer.alloc(26 * 1024 * 1024, 0x61)], ['b.csv', Buffer.alloc(26 * 1024 * 1024, 0x62)]]);
    expect(response.status).toBe(413);
    expect((await response.json()).error.message).toMatch(/larger than 51 MB.*one at a time/);
  });

  it('stops reading a body without a length once it passes the request limit', async () => {
    const id = await newCase();
    const boundary = 'sequent-test-boundary';
    let sent = 0;
    const chunk = new Uint8Array(1024 * 1024).fill(0x61);
    const body = new ReadableStream<Uint8Array>({
      start(controller) {
        controller.enqueue(new TextEncoder().encode(`--${boundary}\r\ncontent-disposition: form-data; name="file"; filename="endless.csv"\r\ncontent-type: text/csv\r\n\r\n`));
      },
      pull(controller) {
        // Far past the limit; the server should answer long before the end.
        if (sent >= 200) return controller.close();
        sent++;
        controller.enqueue(chunk);
      },
    });
    const response = await fetch(new URL(`/api/v1/cases/${id}/attachments`, appUrl()), {
      method: 'POST',
      headers: { cookie: author, origin: appUrl(), 'content-type': `multipart/form-data; boundary=${boundary}` },
      body,
      duplex: 'half',
    } as RequestInit);
    expect(response.status).toBe(413);
    expect((await response.json()).error.message).toMatch(/larger than 51 MB/);
    expect(sent).toBeLessThan(200);
  });

  it('decides the type from the content, not the name or the browser', async () => {
    const id = await newCase();
    const cases: Array<[string, Buffer, RegExp]> = [
      ['diagram.pdf', png, /diagram\.pdf is not a PDF document: its content is a PNG image/],
      ['setup.png', EXE, /setup\.png is not a PNG image: its content is another kind of file \(EXE/],
      ['bundle.png', ZIP, /bundle\.png is not a PNG image: its content is another kind of file \(ZIP/],
      ['sneaky.csv', ZIP, /sneaky\.csv is not a CSV file: its content is another kind of file \(ZIP/],
      ['binary.csv', Buffer.from([0x61, 0x2c, 0x62, 0x0a, 0x00, 0x01, 0x02]), /binary\.csv is not a CSV file: its content is not UTF-8 text/],
      ['latin1.csv', Buffer.from([0x73, 0x74, 0xe9, 0x2c, 0x31, 0x0a]), /not UTF-8 text/],
      ['notes.txt', CSV, /notes\.txt is not a file Sequent keeps/],
      ['photo.jpg', png, /photo\.jpg is not a JPEG image: its content is a PNG image/],
    ];
    for (const [name, bytes, message] of cases) {
      const response = await upload(id, [[name, bytes, 'image/png']]);
      expect(response.status, name).toBe(415);
      expect((await response.json()).error.message, name).toMatch(message);
    }
    expect((await (await call(`/api/v1/cases/${id}/attachments`, { cookie: author })).json()).attachments).toEqual([]);
  });

  it('refuses an empty file (422), a damaged image (422), a request without files (422), all or nothing', async () => {
    const id = await newCase();
    const empty = await upload(id, [['blank.png', new Uint8Array()]]);
    expect(empty.status).toBe(422);
    expect((await empty.json()).error.message).toMatch(/blank\.png is empty/);
    const cut = await upload(id, [['cut.png', png.subarray(0, 200)]]);
    expect(cut.status).toBe(422);
    expect((await cut.json()).error.message).toMatch(/cut\.png .*cannot be decoded/);
    const mixed = await upload(id, [['good.csv', CSV], ['bad.pdf', png]]);
    expect(mixed.status).toBe(415);
    const mixedBody = await mixed.json();
    expect(mixedBody.error.issues).toEqual([{ path: 'bad.pdf', message: expect.stringMatching(/is not a PDF/) }]);
    expect(mixedBody.error.message).toMatch(/Nothing was attached/);
    const none = await fetch(new URL(`/api/v1/cases/${id}/attachments`, appUrl()), { method: 'POST', headers: { cookie: author, origin: appUrl() }, body: new FormData() });
    expect(none.status).toBe(422);
    const notMultipart = await call(`/api/v1/cases/${id}/attachments`, { cookie: author, json: { file: 'x' } });
    expect(notMultipart.status).toBe(415);
    expect((await (await call(`/api/v1/cases/${id}/attachments`, { cookie: author })).json()).attachments).toEqual([]);
  });

  it('sanitises names and never writes outside the storage folder', async () => {
    const id = await newCase();
    const before = await storedFiles();
    const unique = Buffer.from(`a,b\n${Date.now()},${Math.random()}\n`);
    const tricky: Array<[string, string]> = [
      ['../../etc/passwd.csv', 'passwd.csv'],
      ['..\\..\\x.csv', 'x.csv'],
      ['..\\x.png', 'x.png'],
      ['re\u0000port\u0007.csv', 'report.csv'],
      ['.hidden.csv', 'hidden.csv'],
      ['evil\u202egpj.csv', 'evilgpj.csv'],
      ['Cafe\u0301 levels.csv', 'Café levels.csv'],
      [`${'x'.repeat(300)}.csv`, `${'x'.repeat(116)}.csv`],
    ];
    for (const [raw, expected] of tricky) {
      const bytes = raw.endsWith('.png') ? png : unique;
      const response = await upload(id, [[raw, bytes]]);
      expect(response.status, JSON.stringify(raw)).toBe(201);
      expect((await response.json()).attachments[0].fileName).toBe(expected);
    }
    const after = await storedFiles();
    const added = after.filter((p) => !before.includes(p));
    expect(added).toEqual([path.join(sha(unique).slice(0, 2), sha(unique).slice(2))]);
    for (const p of after) expect(p, p).toMatch(/^[0-9a-f]{2}\/[0-9a-f]{62}$/);
    const x = (await (await call(`/api/v1/cases/${id}/attachments`, { cookie: author })).json()).attachments.find((a: { fileName: string }) => a.fileName === 'Café levels.csv');
    const download = await call(x.url, { cookie: author });
    expect(download.headers.get('content-disposition')).toBe(`attachment; filename="Cafe levels.csv"; filename*=UTF-8''Caf%C3%A9%20levels.csv`);
  });
});

describe('who may see and change attachments', () => {
  it('401 without a session, 404 for another firm exactly like a missing id, 403 for a colleague', async () => {
    const id = await newCase();
    const [image] = (await (await upload(id, [['gate.jpg', jpeg]])).json()).attachments;
    expect((await call(image.url)).status).toBe(401);
    expect((await call(image.thumbnailUrl)).status).toBe(401);
    const foreign = await call(image.url, { cookie: outsider });
    const missing = await call('/api/v1/attachments/00000000-0000-4000-8000-000000000000', { cookie: outsider });
    expect(foreign.status).toBe(404);
    expect(await foreign.json()).toEqual(await missing.json());
    expect((await call(image.thumbnailUrl, { cookie: outsider })).status).toBe(404);
    expect((await call('/api/v1/attachments/not-an-id', { cookie: author })).status).toBe(404);
    expect((await call(`/api/v1/cases/${id}/attachments`, { cookie: outsider })).status).toBe(404);
    expect((await upload(id, [['x.csv', CSV]], outsider)).status).toBe(404);
    const byColleague = await upload(id, [['x.csv', CSV]], colleague);
    expect(byColleague.status).toBe(403);
    expect((await byColleague.json()).error.code).toBe('not_author');
    expect((await call(`/api/v1/cases/${id}/attachments/${image.id}`, { method: 'DELETE', cookie: colleague, headers: { origin: appUrl() } })).status).toBe(403);
    expect((await call(`/api/v1/cases/${id}/attachments/${image.id}`, { method: 'PATCH', cookie: outsider, json: { caption: 'x' } })).status).toBe(404);
    expect((await call(`/api/v1/cases/${id}/attachments/${image.id}`, { method: 'PATCH', cookie: author, json: { caption: 'x'.repeat(501) } })).status).toBe(422);
    expect((await call(`/api/v1/cases/${id}/attachments?revision=zero`, { cookie: author })).status).toBe(422);
  });
});

describe('attachments and revisions', () => {
  it('captions and removes on a draft; a published revision keeps its files after removal', async () => {
    const id = await newCase();
    const [photo, sheet] = (await (await upload(id, [['outlet.jpg', jpeg], ['levels.csv', CSV]])).json()).attachments;
    const captioned = await call(`/api/v1/cases/${id}/attachments/${photo.id}`, { method: 'PATCH', cookie: author, json: { caption: '  Outlet at low flow ' } });
    expect(captioned.status).toBe(200);
    expect((await captioned.json()).attachment).toMatchObject({ id: photo.id, caption: 'Outlet at low flow' });

    // Publish revision 1 with both files.
    expect((await call(`/api/v1/cases/${id}/review`, { cookie: author, json: { action: 'submit', reviewerIds: [f.people.rev!.userId] } })).status).toBe(200);
    expect((await upload(id, [['late.csv', CSV]])).status).toBe(409); // in review the files are fixed
    expect((await (await call(`/api/v1/cases/${id}/review`, { cookie: reviewer, json: { action: 'approve' } })).json()).state).toBe('published');

    const removed = await call(`/api/v1/cases/${id}/attachments/${sheet.id}`, { method: 'DELETE', cookie: author, headers: { origin: appUrl() } });
    expect(removed.status).toBe(200);
    expect(await removed.json()).toMatchObject({ ok: true, removedInRevision: 2 });
    expect((await call(`/api/v1/cases/${id}/attachments/${sheet.id}`, { method: 'DELETE', cookie: author, headers: { origin: appUrl() } })).status).toBe(409);

    const published = await (await call(`/api/v1/cases/${id}/attachments?revision=1`, { cookie: colleague })).json();
    expect(published.attachments.map((a: { fileName: string }) => a.fileName)).toEqual(['outlet.jpg', 'levels.csv']);
    const working = await (await call(`/api/v1/cases/${id}/attachments`, { cookie: author })).json();
    expect(working.revision).toBe(2);
    expect(working.attachments.map((a: { fileName: string }) => a.fileName)).toEqual(['outlet.jpg']);
    expect((await call(sheet.url, { cookie: colleague })).status).toBe(200); // still downloadable for revision 1

    // A caption change of a published file leaves the published caption alone.
    const recaptioned = await (await call(`/api/v1/cases/${id}/attachments/${photo.id}`, { method: 'PATCH', cookie: author, json: { caption: 'Outlet, new survey' } })).json();
    expect(recaptioned.attachment.id).not.toBe(photo.id);
    expect((await (await call(`/api/v1/cases/${id}/attachments?revision=1`, { cookie: colleague })).json()).attachments[0].caption).toBe('Outlet at low flow');
    expect((await (await call(`/api/v1/cases/${id}/attachments?revision=2`, { cookie: colleague })).json()).attachments.map((a: { caption: string }) => a.caption)).toEqual(['Outlet, new survey']);

    const events = await db().select({ action: auditEvent.action }).from(auditEvent).where(and(eq(auditEvent.targetId, id), like(auditEvent.action, 'case.attachment_%'))).orderBy(asc(auditEvent.createdAt));
    expect(events.map((e) => e.action)).toEqual(['case.attachment_added', 'case.attachment_added', 'case.attachment_captioned', 'case.attachment_removed', 'case.attachment_captioned']);
  });

  it('counts at most 50 files a case', async () => {
    const id = await newCase();
    for (let batch = 0; batch < 5; batch++) {
      const files: Array<[string, Uint8Array]> = Array.from({ length: 10 }, (_, i) => [`f${batch}-${i}.csv`, Buffer.from(`n\n${batch * 10 + i}\n`)]);
      expect((await upload(id, files)).status).toBe(201);
    }
    const over = await upload(id, [['one-more.csv', CSV]]);
    expect(over.status).toBe(409);
    expect((await over.json()).error.message).toMatch(/50/);
  });
});
