/**
 * E-mail: the outbox drain against an SMTP fake started here (delivery, a stopped server,
 * retry after it is back, two concurrent drains), and, through the test app and its own
 * fake, the password-reset flow and the development mailbox page.
 *
 * The test app's delivery worker shares this database, so the direct drains work on rows
 * dated far in the future (the app's worker never finds them due) and restrict each drain
 * to their own rows.
 */
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startMailFake, type MailFake } from '../../mail-fake/server.mjs';
import { db } from '../../src/db/client';
import { mailOutbox } from '../../src/db/schema';
import { createSmtpTransport, drainOutbox, queueMail, reviewRequestedMessage } from '../../src/lib/mail';
import { startApp } from '../helpers/appProcess';
import { appUrl, call, sessionOf, signIn } from '../helpers/app';
import { makeFirm, TEST_PASSWORD, type TestFirm } from '../helpers/firms';
import { appMailboxUrl, messagesTo, waitForMail } from '../helpers/mailbox';

let firm: TestFirm;
let dir: string;
const fakes: MailFake[] = [];

beforeAll(async () => {
  firm = await makeFirm({ eng: 'engineer', rev: 'reviewer' });
  dir = await mkdtemp(path.join(tmpdir(), 'sequent-mail-test-'));
});
afterAll(async () => {
  for (const fake of fakes) await fake.stop().catch(() => {});
  await rm(dir, { recursive: true, force: true });
});

async function fake(options: { smtpPort?: number; httpPort?: number } = {}): Promise<MailFake> {
  const started = await startMailFake({ dir, ...options });
  fakes.push(started);
  return started;
}

/** A moment far ahead, different per call, so rows of one test are never due in another. */
let year = 2200;
function farFuture(): Date {
  year += 1;
  return new Date(`${year}-01-01T00:00:00Z`);
}

/** Queues one review-requested message to `to` in a transaction, due at `due`; returns the row ids. */
async function queue(to: string[], due: Date): Promise<number[]> {
  const message = reviewRequestedMessage({
    firmName: firm.firm.name,
    caseTitle: 'Outlet basin at Fenwick Mill',
    caseUrl: `${appUrl()}/cases/case-under-test`,
    revision: 3,
    authorName: 'Tomas Ilvar',
  });
  return db().transaction(async (tx) => {
    await queueMail(tx, { kind: 'review.requested', firmId: firm.firm.id, to, ...message });
    const rows = await tx
      .update(mailOutbox)
      .set({ nextAttemptAt: due })
      .where(inArray(mailOutbox.toAddress, to.map((a) => a.trim().toLowerCase())))
      .returning({ id: mailOutbox.id });
    return rows.map((r) => r.id);
  });
}

async function rowsOf(ids: number[]) {
  return db().select().from(mailOutbox).where(inArray(mailOutbox.id, ids));
}

function addresses(n: number, tag: string): string[] {
  return Array.from({ length: n }, (_, i) => `reader${i}.${tag}.${Math.random().toString(36).slice(2, 8)}@firm.example`);
}

describe('queueMail and drainOutbox', () => {
  it('delivers each row to its recipient with the subject, the firm and the case link, and marks it sent', async () => {
    const smtp = await fake();
    const at = farFuture();
    const to = addresses(2, 'deliver');
    const ids = await queue([to[0]!, ` ${to[1]!.toUpperCase()} `, to[0]!], at);
    expect(ids).toHaveLength(2);

    const result = await drainOutbox(db(), createSmtpTransport(smtp.smtpUrl), at, { ids });
    expect(result).toEqual({ sent: 2, failed: 0 });

    for (const address of to) {
      const [message, ...more] = await messagesTo(smtp.apiUrl, address);
      expect(more).toHaveLength(0);
      expect(message!.to).toEqual([address]);
      expect(message!.subject).toBe('Review requested: Outlet basin at Fenwick Mill (rev. 3)');
      expect(message!.from).toContain('casebook@sequent.example');
      expect(message!.text).toContain(`${appUrl()}/cases/case-under-test`);
      expect(message!.html).toContain(`href="${appUrl()}/cases/case-under-test"`);
      expect(message!.text).toContain(firm.firm.name);
    }
    const rows = await rowsOf(ids);
    expect(rows.every((r) => r.sentAt?.getTime() === at.getTime() && r.attempts === 0 && r.lastError === null)).toBe(true);
    await smtp.stop();
  });

  it('with the SMTP server stopped, keeps rows unsent and postpones them; once it is back they go out exactly once', async () => {
    const first = await fake();
    const { smtpPort, httpPort } = first;
    await first.stop();

    const at = farFuture();
    const to = addresses(3, 'down');
    const ids = await queue(to, at);
    const transport = createSmtpTransport(`smtp://127.0.0.1:${smtpPort}`);

    expect(await drainOutbox(db(), transport, at, { ids })).toEqual({ sent: 0, failed: 3 });
    let rows = await rowsOf(ids);
    for (const row of rows) {
      expect(row.sentAt).toBeNull();
      expect(row.attempts).toBe(1);
      expect(row.lastError).toMatch(/ECONNECTION|ECONNREFUSED/);
      expect(row.nextAttemptAt.getTime()).toBe(at.getTime() + 1_000);
    }
    // Not due again at the same moment: nothing is tried.
    expect(await drainOutbox(db(), transport, at, { ids })).toEqual({ sent: 0, failed: 0 });
    // A second failure doubles the wait.
    const later = new Date(at.getTime() + 1_000);
    expect(await drainOutbox(db(), transport, later, { ids })).toEqual({ sent: 0, failed: 3 });
    rows = await rowsOf(ids);
    expect(rows.every((r) => r.attempts === 2 && r.nextAttemptAt.getTime() === later.getTime() + 2_000)).toBe(true);

    const back = await fake({ smtpPort, httpPort });
    const afterBackoff = new Date(later.getTime() + 2_000);
    expect(await drainOutbox(db(), transport, afterBackoff, { ids })).toEqual({ sent: 3, failed: 0 });
    expect(await drainOutbox(db(), transport, new Date(afterBackoff.getTime() + 3_600_000), { ids })).toEqual({ sent: 0, failed: 0 });
    for (const address of to) expect(await messagesTo(back.apiUrl, address)).toHaveLength(1);
    rows = await rowsOf(ids);
    expect(rows.every((r) => r.sentAt !== null && r.lastError === null)).toBe(true);
    await back.stop();
  });

  it('two drains at once never send one row twice', async () => {
    const smtp = await fake();
    const at = farFuture();
    const to = addresses(45, 'race');
    const ids = await queue(to, at);
    const [a, b] = await Promise.all([
      drainOutbox(db(), createSmtpTransport(smtp.smtpUrl), at, { ids }),
      drainOutbox(db(), createSmtpTransport(smtp.smtpUrl), at, { ids }),
    ]);
    expect(a.sent + b.sent).toBe(45);
    expect(a.failed + b.failed).toBe(0);
    const received = (await Promise.all(to.map((address) => messagesTo(smtp.apiUrl, address)))).map((m) => m.length);
    expect(received).toEqual(to.map(() => 1));
    await smtp.stop();
  });
});

describe('password reset by e-mail (through the test app)', () => {
  const NEUTRAL = 'If an account uses that address, a message with a link to choose a new password is on its way.';

  it('answers a known and an unknown address the same way, and mails only the known one', async () => {
    const known = await call('/forgot-password', { form: { email: firm.people.rev!.email } });
    const unknown = await call('/forgot-password', { form: { email: 'nobody.at.all@firm.example' } });
    expect(known.status).toBe(200);
    expect(unknown.status).toBe(200);
    expect(await known.text()).toContain(NEUTRAL);
    expect(await unknown.text()).toContain(NEUTRAL);
    const queued = await db().select().from(mailOutbox).where(inArray(mailOutbox.toAddress, ['nobody.at.all@firm.example']));
    expect(queued).toHaveLength(0);
    await waitForMail(appMailboxUrl(), firm.people.rev!.email);
  });

  it('answers a malformed address with a field message (422)', async () => {
    const response = await call('/forgot-password', { form: { email: 'not-an-address' } });
    expect(response.status).toBe(422);
    expect(await response.text()).toContain('Enter the e-mail address of your account.');
  });

  it('request → message with the link → new password → sign in with it; the link then no longer works', async () => {
    const email = firm.people.eng!.email;
    expect((await call('/forgot-password', { form: { email } })).status).toBe(200);
    const [message] = await waitForMail(appMailboxUrl(), email);
    expect(message!.subject).toBe('Reset your Sequent password');
    const link = /(http:\/\/\S+\/reset-password\?token=[A-Za-z0-9_-]+)/.exec(message!.text)?.[1];
    expect(link, message!.text).toBeTruthy();
    expect(link!.startsWith(`${appUrl()}/reset-password?token=`)).toBe(true);
    expect(message!.html).toContain(`href="${link}"`);
    const token = new URL(link!).searchParams.get('token')!;
    const path = `/reset-password?token=${token}`;

    const page = await call(path);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('Set the new password');

    const mismatch = await call(path, { form: { token, password: 'a-new-password-2031', confirm: 'something-else-2031' } });
    expect(mismatch.status).toBe(422);
    expect(await mismatch.text()).toContain('The two passwords differ.');
    const short = await call(path, { form: { token, password: 'short', confirm: 'short' } });
    expect(short.status).toBe(422);

    const done = await call(path, { form: { token, password: 'a-new-password-2031', confirm: 'a-new-password-2031' } });
    expect(done.status).toBe(303);
    expect(done.headers.get('location')).toBe('/signin?reset=done');
    expect(await (await call('/signin?reset=done')).text()).toContain('Your password is changed.');

    expect((await signIn(email, 'a-new-password-2031')).response.status).toBe(303);
    expect((await signIn(email, TEST_PASSWORD)).response.status).toBe(401);

    const again = await call(path, { form: { token, password: 'another-password-2031', confirm: 'another-password-2031' } });
    expect(again.status).toBe(410);
    expect(await again.text()).toContain('This reset link has expired or has already been used.');
    const reopened = await call(path);
    expect(reopened.status).toBe(410);
    expect(await reopened.text()).toContain('Ask for a new link');
    expect((await call('/reset-password')).status).toBe(400);
  });

  it('limits reset requests per client address (3 a minute) with a clear message', async () => {
    const app = await startApp(inject('databaseUrl'), 'on');
    try {
      const ask = () =>
        fetch(`${app.url}/forgot-password`, {
          method: 'POST',
          redirect: 'manual',
          headers: { 'content-type': 'application/x-www-form-urlencoded', origin: app.url },
          body: new URLSearchParams({ email: 'limit.test@firm.example' }).toString(),
        });
      for (let i = 0; i < 3; i++) expect((await ask()).status).toBe(200);
      const limited = await ask();
      expect(limited.status).toBe(429);
      expect(await limited.text()).toContain('Too many requests from this computer.');
    } finally {
      await app.stop();
    }
  });

  it('keeps better-auth reset endpoints open and the rest of better-auth closed', async () => {
    const open = await call('/api/auth/request-password-reset', { json: { email: 'nobody.else@firm.example' }, headers: { origin: appUrl() } });
    expect(open.status).toBe(200);
    expect((await call('/api/auth/sign-up/email', { json: { email: 'x@firm.example', password: 'x', name: 'x' } })).status).toBe(404);
  });
});

describe('the development mailbox page', () => {
  it('lists and opens messages for a signed-in user of the test app', async () => {
    const cookie = await sessionOf(firm.people.rev!.email, TEST_PASSWORD);
    const [message] = await waitForMail(appMailboxUrl(), firm.people.rev!.email);
    const list = await call('/dev/mailbox', { cookie });
    expect(list.status).toBe(200);
    const html = await list.text();
    expect(html).toContain('Reset your Sequent password');
    expect(html).toContain(`/dev/mailbox?id=${message!.id}`);
    const one = await call(`/dev/mailbox?id=${message!.id}`, { cookie });
    expect(one.status).toBe(200);
    const body = await one.text();
    expect(body).toContain('sandbox=""');
    expect(body).toContain('srcdoc=');
    expect(body).toContain(firm.people.rev!.email);
  });

  it('sends signed-out visitors to sign in', async () => {
    const response = await call('/dev/mailbox');
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toContain('/signin');
  });

  it('is not found on an app without SEQUENT_DEV_MAILBOX (as in production)', async () => {
    const app = await startApp(inject('databaseUrl'), 'off');
    try {
      const signin = await fetch(`${app.url}/signin`, {
        method: 'POST',
        redirect: 'manual',
        headers: { 'content-type': 'application/x-www-form-urlencoded', origin: app.url },
        body: new URLSearchParams({ email: firm.people.rev!.email, password: TEST_PASSWORD }).toString(),
      });
      const cookie = signin.headers.getSetCookie().find((c) => c.startsWith('sequent.session_token='))!.split(';')[0]!;
      const page = await fetch(`${app.url}/dev/mailbox`, { headers: { cookie }, redirect: 'manual' });
      expect(page.status).toBe(404);
      const home = await (await fetch(`${app.url}/`, { headers: { cookie }, redirect: 'manual' })).text();
      expect(home).not.toContain('/dev/mailbox');
    } finally {
      await app.stop();
    }
  });
});
