/**
 * Tailwater blocks reading an attached rating CSV (`rating = file "…"`): bad rows give a
 * row-numbered block error, a good rating drives the results, and a file change the draft's
 * blocks read writes a recalculated revision. Checked values: the depths the solver gets
 * are the CSV's (stage less the apron level), compared with the same rating written in the block.
 */
import { describe, expect, it, beforeAll } from 'vitest';
import { appUrl, call, sessionOf } from '../helpers/app';
import { makeFirm, TEST_PASSWORD, type TestFirm } from '../helpers/firms';

const metadata = { title: 'Orrin Beck weir tailwater', structureType: 'spillway-basin', sectionShape: 'rectangular' } as const;
const block = (rating: string) => `Tailwater over the range.\n\n\`\`\`tailwater tw\nb = 8 m\nQ = 20 to 60 m3/s step 20\ntoe = depth\ny1 = 0.45 m\n${rating}\n\`\`\`\n`;
const FILE_BODY = block('rating = file "orrin-rating.csv"\napron = 50.0 m');
const INLINE_BODY = block('rating:\n  Q m3/s | TW m\n  10 | 1.10\n  40 | 2.20\n  80 | 3.05');
const GOOD = '# Orrin Beck gauge (invented)\nQ (m3/s),stage (m AOD)\n10,51.10\n40,52.20\n80,53.05\n';
const BAD = 'Q (m3/s),stage (m AOD)\n10,51.10\n40,abc\n5,52.5\n80,53.05\n';

let f: TestFirm;
let author: string;
let outsider: string;

beforeAll(async () => {
  f = await makeFirm({ author: 'engineer' });
  author = await sessionOf(f.people.author!.email, TEST_PASSWORD);
  const other = await makeFirm({ eng: 'engineer' });
  outsider = await sessionOf(other.people.eng!.email, TEST_PASSWORD);
});

async function newCase(body: string): Promise<string> {
  const response = await call('/api/v1/cases', { cookie: author, json: { ...metadata, body } });
  expect(response.status).toBe(201);
  return (await response.json()).case.id;
}

function upload(caseId: string, name: string, text: string): Promise<Response> {
  const form = new FormData();
  form.append('file', new Blob([text], { type: 'text/csv' }), name);
  return fetch(new URL(`/api/v1/cases/${caseId}/attachments`, appUrl()), { method: 'POST', headers: { cookie: author, origin: appUrl() }, body: form });
}

async function latest(caseId: string) {
  const response = await call(`/api/v1/cases/${caseId}`, { cookie: author });
  expect(response.status).toBe(200);
  return (await response.json()).case;
}

describe('rating = file "…" in a tailwater block', () => {
  it('says the file is not attached, then is recalculated as a new revision when it is', async () => {
    const id = await newCase(FILE_BODY);
    const before = await latest(id);
    expect(before.latestRevision).toBe(1);
    expect(before.revision.results.blocks[0].errors[0].message).toContain('No file named "orrin-rating.csv" is attached');

    const added = await upload(id, 'orrin-rating.csv', GOOD);
    expect(added.status).toBe(201);
    expect(await added.json()).toMatchObject({ revision: 2, recalculated: true });
    const after = await latest(id);
    expect(after.latestRevision).toBe(2);
    const tw = after.revision.results.blocks[0];
    expect(tw.errors).toEqual([]);
    expect(tw.tables[0]).toMatchObject({ source: 'orrin-rating.csv', rowNumbers: [3, 4, 5] });

    // The same rating written in the block as depths gives the same table of results.
    const inline = await call('/api/v1/evaluate', { cookie: author, json: { markdown: INLINE_BODY } });
    const expected = (await inline.json()).blocks[0].table.rows;
    const rows = tw.table.rows as (number | string | null)[][];
    rows.forEach((row, r) => row.forEach((cell, c) => (typeof cell === 'number' ? expect(cell).toBeCloseTo(expected[r][c], 9) : expect(cell).toBe(expected[r][c]))));

    // The editor saving from revision 1 is no conflict: revision 2 has the same text.
    const saved = await call(`/api/v1/cases/${id}`, { method: 'PATCH', cookie: author, json: { baseRevision: 1, body: `${FILE_BODY}\nChecked.\n` } });
    expect(saved.status).toBe(200);
    expect((await latest(id)).revision.results.blocks[0].errors).toEqual([]);
  });

  it('reports bad rows of the CSV with their row numbers', async () => {
    const id = await newCase(FILE_BODY);
    expect((await upload(id, 'orrin-rating.csv', BAD)).status).toBe(201);
    const errors = (await latest(id)).revision.results.blocks[0].errors;
    expect(errors).toHaveLength(1);
    expect(errors[0].line).toBe(8);
    expect(errors[0].message).toMatch(/orrin-rating\.csv/);
    expect(errors[0].message).toMatch(/row 3: "abc"/);
    expect(errors[0].message).toMatch(/row 4: discharge 5/);
  });

  it('a stage not above the apron level is refused with its row', async () => {
    const id = await newCase(block('rating = file "orrin-rating.csv"\napron = 51.5 m'));
    await upload(id, 'orrin-rating.csv', GOOD);
    const errors = (await latest(id)).revision.results.blocks[0].errors;
    expect(errors[0].message).toContain('orrin-rating.csv row 3: stage 51.1 m is not above the apron level 51.5 m');
  });

  it('removing the file the block reads recalculates again; the revision before keeps it', async () => {
    const id = await newCase(FILE_BODY);
    const added = await (await upload(id, 'orrin-rating.csv', GOOD)).json();
    const removed = await call(`/api/v1/cases/${id}/attachments/${added.attachments[0].id}`, { method: 'DELETE', cookie: author, headers: { origin: appUrl() } });
    expect(removed.status).toBe(200);
    expect(await removed.json()).toMatchObject({ removedInRevision: 3, recalculated: true });
    expect((await latest(id)).revision.results.blocks[0].errors[0].message).toContain('No file named');
    const listed = await (await call(`/api/v1/cases/${id}/attachments?revision=2`, { cookie: author })).json();
    expect(listed.attachments.map((a: { fileName: string }) => a.fileName)).toEqual(['orrin-rating.csv']);
  });

  it('the evaluate API and the editor file list read a case of the caller firm only', async () => {
    const id = await newCase(FILE_BODY);
    await upload(id, 'orrin-rating.csv', GOOD);
    const evaluated = await call('/api/v1/evaluate', { cookie: author, json: { markdown: FILE_BODY, caseId: id } });
    expect(evaluated.status).toBe(200);
    expect((await evaluated.json()).blocks[0].errors).toEqual([]);
    expect((await call('/api/v1/evaluate', { cookie: outsider, json: { markdown: FILE_BODY, caseId: id } })).status).toBe(404);
    expect((await call('/api/v1/evaluate', { cookie: author, json: { markdown: FILE_BODY, caseId: 'nope' } })).status).toBe(422);

    const files = await call(`/api/v1/cases/${id}/block-files`, { cookie: author });
    expect(files.status).toBe(200);
    expect((await files.json()).texts['orrin-rating.csv']).toBe(GOOD);
    expect((await call(`/api/v1/cases/${id}/block-files`, { cookie: outsider })).status).toBe(404);
    expect((await call(`/api/v1/cases/${id}/block-files`)).status).toBe(401);
  });
});
