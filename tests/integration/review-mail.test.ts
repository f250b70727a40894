/**
 * E-mail of the review workflow through the test app and its SMTP fake: who is told of
 * each transition, with the firm's name and a link to the case; and with the SMTP server
 * down, transitions still succeed and the mail goes out once it is back.
 */
import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '../../src/db/client';
import { firmReviewSetting, mailOutbox } from '../../src/db/schema';
import { appUrl, call, sessionOf } from '../helpers/app';
import { makeFirm, TEST_PASSWORD, type TestFirm } from '../helpers/firms';
import { appMailboxUrl, messagesTo } from '../helpers/mailbox';

const BODY = 'Culvert check.\n\n```jump outlet\nb = 3 m\nQ = 9 m3/s\ny1 = 0.3 m\n```\n';

let f: TestFirm;
const cookies: Record<string, string> = {};

beforeAll(async () => {
  f = await makeFirm({ author: 'engineer', rev: 'reviewer', rev2: 'reviewer', admin: 'admin' });
  for (const key of Object.keys(f.people)) cookies[key] = await sessionOf(f.people[key]!.email, TEST_PASSWORD);
});

async function newCase(title: string): Promise<string> {
  const response = await call('/api/v1/cases', { cookie: cookies.author, json: { title, structureType: 'culvert-outlet', sectionShape: 'rectangular', body: BODY } });
  expect(response.status).toBe(201);
  return (await response.json()).case.id;
}
const act = async (id: string, who: string, json: Record<string, unknown>) => {
  const response = await call(`/api/v1/cases/${id}/review`, { cookie: cookies[who], json });
  expect(response.status).toBe(200);
};
const email = (who: string) => f.people[who]!.email;
/** Waits until a message to `who` whose subject or text matches `pattern` arrives; returns it. */
async function mailMatching(who: string, pattern: RegExp, timeoutMs = 30_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await messagesTo(appMailboxUrl(), email(who))).find((m) => pattern.test(m.subject) || pattern.test(m.text));
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`no message to ${who} matching ${pattern}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}
const control = (what: 'stop' | 'start') => fetch(new URL(`/smtp/${what}`, appMailboxUrl()), { method: 'POST' });

describe('review e-mail', () => {
  it('tells the asked reviewer, then the author, with the firm and a link to the case', async () => {
    const id = await newCase('Brindle Lane culvert outlet');
    const link = `${appUrl()}/cases/${id}`;
    await act(id, 'author', { action: 'submit', reviewerIds: [f.people.rev!.userId] });
    const requested = await mailMatching('rev', /Review requested/);
    expect(requested!.subject).toContain('Brindle Lane culvert outlet');
    expect(requested!.text).toContain(link);
    expect(requested!.html).toContain(link);
    expect(requested!.text).toContain(f.firm.name);
    // Asked by name: the other reviewer is not told, nor the author of their own act.
    expect(await messagesTo(appMailboxUrl(), email('rev2'))).toHaveLength(0);

    await act(id, 'rev', { action: 'return', reason: 'State the outlet invert level.' });
    const returned = await mailMatching('author', /Returned with comments/);
    expect(returned!.text).toContain('State the outlet invert level.');
    expect(returned!.text).toContain(link);

    // The return's comments are a thread the reviewer must see resolved before approving.
    const threads = (await (await call(`/api/v1/cases/${id}/comments`, { cookie: cookies.author })).json()).threads as Array<{ id: string }>;
    for (const t of threads) await call(`/api/v1/cases/${id}/comments/${t.id}`, { method: 'PATCH', cookie: cookies.author, json: { resolved: true } });
    await act(id, 'author', { action: 'submit', reviewerIds: [f.people.rev!.userId] });
    await act(id, 'rev', { action: 'approve' });
    expect((await mailMatching('author', /Published/)).text).toContain(link);

    await act(id, 'admin', { action: 'withdraw', reason: 'Outlet moved 30 m downstream.' });
    // The reviewer who checked it is told, with the reason.
    await mailMatching('rev', /Outlet moved 30 m downstream\./);
  });

  it('tells reviewers when an edit cancels their approval, and colleagues when mentioned', async () => {
    await db().insert(firmReviewSetting).values({ firmId: f.firm.id, requiredApprovals: 2 }).onConflictDoNothing();
    const id = await newCase('Hollin Gill culvert outlet');
    await act(id, 'author', { action: 'submit' });
    await act(id, 'rev2', { action: 'approve' });
    const saved = await call(`/api/v1/cases/${id}`, { method: 'PATCH', cookie: cookies.author, json: { baseRevision: 1, body: `${BODY}\nApron extended.\n` } });
    expect(saved.status).toBe(200);
    const cancelled = await mailMatching('rev2', /Approvals cancelled by an edit/);
    expect(cancelled.subject).toContain('Hollin Gill');

    const handle = email('rev').split('@')[0];
    const comment = await call(`/api/v1/cases/${id}/comments`, { cookie: cookies.rev2, json: { body: `@${handle} can you check the apron length?`, blockIndex: 0 } });
    expect((await comment.json()).mentioned).toBe(1);
    expect((await mailMatching('rev', /mentioned you/)).text).toContain('can you check the apron length?');
  });

  it('with the SMTP server down, transitions succeed and the mail goes out once it is back', async () => {
    const id = await newCase('Sedge Moss culvert outlet');
    expect((await control('stop')).ok).toBe(true);
    try {
      const response = await call(`/api/v1/cases/${id}/review`, { cookie: cookies.author, json: { action: 'submit', reviewerIds: [f.people.rev2!.userId] } });
      expect(response.status).toBe(200);
      // The worker tries, fails and postpones; the message stays queued.
      const deadline = Date.now() + 15_000;
      let row: typeof mailOutbox.$inferSelect | undefined;
      while (Date.now() < deadline) {
        [row] = (await db().select().from(mailOutbox).where(eq(mailOutbox.toAddress, email('rev2')))).filter((r) => r.subject.includes('Sedge Moss'));
        if (row && row.attempts > 0) break;
        await new Promise((r) => setTimeout(r, 250));
      }
      expect(row).toMatchObject({ sentAt: null });
      expect(row!.attempts).toBeGreaterThan(0);
      expect(row!.lastError).toBeTruthy();
    } finally {
      expect((await control('start')).ok).toBe(true);
    }
    await mailMatching('rev2', /Sedge Moss/, 60_000);
    expect((await messagesTo(appMailboxUrl(), email('rev2'))).filter((m) => m.subject.includes('Sedge Moss'))).toHaveLength(1);
  });
});
