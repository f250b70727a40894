/** Invitations over HTTP: admin invites, the mail in the outbox, joining once, and refusals. */
import { randomUUID } from 'node:crypto';
import { and, desc, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '../../src/db/client';
import { auditEvent, invitation, mailOutbox, member, user } from '../../src/db/schema';
import { hashInvitationToken } from '../../src/lib/firms';
import { appUrl, call, sessionOf, signIn } from '../helpers/app';
import { makeFirm, TEST_PASSWORD } from '../helpers/firms';

const NEW_PASSWORD = 'stilling-basin-42';

/** The newest invitation mail to `address`, and the token in its link. */
async function mailTo(address: string) {
  const [row] = await db().select().from(mailOutbox).where(eq(mailOutbox.toAddress, address)).orderBy(desc(mailOutbox.id)).limit(1);
  if (!row) throw new Error(`no mail to ${address}`);
  const token = /\/join\?token=([A-Za-z0-9_-]{43})/.exec(row.textBody)?.[1];
  if (!token) throw new Error(`no join link in the mail to ${address}`);
  return { row, token };
}

/** A firm with an admin signed in, and a fresh address to invite. */
async function setUp(people: Record<string, 'admin' | 'engineer' | 'reviewer'> = { admin: 'admin' }) {
  const f = await makeFirm(people);
  const cookie = await sessionOf(f.people.admin!.email, TEST_PASSWORD);
  const email = `invitee.${randomUUID().slice(0, 8)}@firm.example`;
  const invite = (body: unknown = { email, role: 'reviewer' }, as = cookie) =>
    call('/api/v1/invitations', { cookie: as, json: body });
  return { f, cookie, email, invite };
}

const join = (token: string, form: Record<string, string> = { name: 'Ilse Moravec', password: NEW_PASSWORD, passwordRepeat: NEW_PASSWORD }) =>
  call(`/join?token=${token}`, { form });

/** DELETE as a browser's fetch sends it (with Origin: Astro refuses a bodiless cross-site DELETE). */
const revoke = (id: string, cookie?: string) => call(`/api/v1/invitations/${id}`, { cookie, method: 'DELETE', headers: { origin: appUrl() } });

const actions = async (firmId: string) =>
  (await db().select({ action: auditEvent.action }).from(auditEvent).where(eq(auditEvent.firmId, firmId))).map((r) => r.action);

describe('inviting a colleague', () => {
  it('queues one mail to the address whose text and HTML carry the join link, and stores only the token hash', async () => {
    const { f, email, invite, cookie } = await setUp();
    const response = await invite({ email: `  ${email.toUpperCase()} `, role: 'reviewer' });
    expect(response.status).toBe(201);
    const body = await response.json();
    expect(body.invitation).toMatchObject({ email, role: 'reviewer', expired: false });
    expect(JSON.stringify(body)).not.toContain('token');

    const { row, token } = await mailTo(email);
    const link = `${appUrl()}/join?token=${token}`;
    expect(row).toMatchObject({ kind: 'firm.invitation', firmId: f.firm.id, sentAt: null });
    expect(row.textBody).toContain(link);
    expect(row.htmlBody).toContain(`href="${link}"`);
    expect(row.textBody).toContain(f.firm.name);
    expect(row.subject).toContain(f.firm.name);

    const [stored] = await db().select().from(invitation).where(eq(invitation.id, body.invitation.invitationId));
    expect(stored).toMatchObject({ status: 'pending', tokenHash: hashInvitationToken(token), organizationId: f.firm.id });
    expect(JSON.stringify(stored)).not.toContain(token);
    const days = (stored!.expiresAt.getTime() - stored!.createdAt.getTime()) / 86_400_000;
    expect(days).toBeCloseTo(7, 2);

    const listed = await (await call('/api/v1/invitations', { cookie })).json();
    expect(listed.invitations).toEqual([expect.objectContaining({ email, role: 'reviewer', inviterName: expect.stringContaining('admin') })]);
    expect(await actions(f.firm.id)).toContain('member.invited');
  });

  it('refuses engineers and reviewers (403) and signed-out callers (401)', async () => {
    const { f, email } = await setUp({ admin: 'admin', eng: 'engineer', rev: 'reviewer' });
    for (const who of ['eng', 'rev'] as const) {
      const cookie = await sessionOf(f.people[who]!.email, TEST_PASSWORD);
      expect((await call('/api/v1/invitations', { cookie, json: { email, role: 'engineer' } })).status).toBe(403);
      expect((await call('/api/v1/invitations', { cookie })).status).toBe(403);
      const page = await call('/firm/members', { cookie, form: { intent: 'invite', email, role: 'engineer' } });
      expect(page.status).toBe(403);
    }
    expect((await call('/api/v1/invitations', { json: { email, role: 'engineer' } })).status).toBe(401);
    expect((await call('/api/v1/invitations')).status).toBe(401);
    expect((await revoke(randomUUID())).status).toBe(401);
    expect(await db().select().from(mailOutbox).where(eq(mailOutbox.toAddress, email))).toHaveLength(0);
  });

  it('answers 422 with the field for a bad e-mail or role, and 409 for a current member', async () => {
    const { f, invite, cookie } = await setUp({ admin: 'admin', eng: 'engineer' });
    const badEmail = await invite({ email: 'not-an-address', role: 'engineer' });
    expect(badEmail.status).toBe(422);
    expect((await badEmail.json()).error.issues).toEqual([expect.objectContaining({ path: 'email' })]);
    const badRole = await invite({ email: 'someone@firm.example', role: 'owner' });
    expect(badRole.status).toBe(422);
    expect((await badRole.json()).error.issues).toEqual([expect.objectContaining({ path: 'role' })]);
    const member409 = await invite({ email: f.people.eng!.email, role: 'reviewer' });
    expect(member409.status).toBe(409);
    expect((await member409.json()).error.code).toBe('already_member');
    // The page shows the same refusals beside the field.
    const page = await call('/firm/members', { cookie, form: { intent: 'invite', email: 'nope', role: 'engineer' } });
    expect(page.status).toBe(422);
    expect(await page.text()).toContain('Enter a valid e-mail address.');
  });

  it('says on the page that the invitation was sent to the address, and lists it as pending', async () => {
    const { cookie, email } = await setUp();
    const page = await call('/firm/members', { cookie, form: { intent: 'invite', email, role: 'engineer' } });
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain(`Invitation sent to ${email}`);
    expect(html).toContain('data-testid="invitations-table"');
  });
});

describe('joining with the link', () => {
  it('creates the account with the invited role, signs in, and works only once', async () => {
    const { f, email, invite } = await setUp();
    await invite({ email, role: 'reviewer' });
    const { token } = await mailTo(email);

    const shown = await call(`/join?token=${token}`);
    expect(shown.status).toBe(200);
    const html = await shown.text();
    expect(html).toContain(f.firm.name);
    expect(html).toContain(email);
    expect(html).toContain('reviewer');

    const joined = await join(token);
    expect(joined.status).toBe(303);
    expect(joined.headers.get('location')).toBe('/');
    const sessionCookie = joined.headers.getSetCookie().find((c) => c.startsWith('sequent.session_token='));
    expect(sessionCookie).toBeTruthy();
    const me = await (await call('/api/v1/me', { cookie: sessionCookie!.split(';')[0]! })).json();
    expect(me).toMatchObject({ user: { email, name: 'Ilse Moravec' }, firm: { id: f.firm.id }, role: 'reviewer' });

    const again = await signIn(email, NEW_PASSWORD);
    expect(again.response.status).toBe(303);
    const home = await call('/', { cookie: again.cookie! });
    expect(home.status).toBe(200);
    expect(await home.text()).toContain(f.firm.name);

    const [account] = await db().select().from(user).where(eq(user.email, email));
    expect(account!.emailVerified).toBe(true);
    const [stored] = await db().select().from(invitation).where(eq(invitation.tokenHash, hashInvitationToken(token)));
    expect(stored!.status).toBe('accepted');
    expect(stored!.acceptedAt).toBeInstanceOf(Date);
    expect(await actions(f.firm.id)).toEqual(expect.arrayContaining(['member.invited', 'member.joined']));

    const second = await join(token, { name: 'Somebody Else', password: 'another-pass-77', passwordRepeat: 'another-pass-77' });
    expect(second.status).toBe(410);
    expect(await second.text()).toContain('already been used');
    expect((await call(`/join?token=${token}`)).status).toBe(410);
    expect((await signIn(email, 'another-pass-77')).response.status).toBe(401);
  });

  it('lets only one of two simultaneous joins win', async () => {
    const { f, email, invite } = await setUp();
    await invite({ email, role: 'engineer' });
    const { token } = await mailTo(email);
    const results = await Promise.all([join(token), join(token)]);
    expect(results.map((r) => r.status).sort()).toEqual([303, 410]);
    const memberships = await db().select().from(member).innerJoin(user, eq(user.id, member.userId)).where(and(eq(member.organizationId, f.firm.id), eq(user.email, email)));
    expect(memberships).toHaveLength(1);
  });

  it('shows field errors for a short password, differing passwords and a missing name, and keeps the link usable', async () => {
    const { email, invite } = await setUp();
    await invite({ email, role: 'engineer' });
    const { token } = await mailTo(email);
    const short = await join(token, { name: 'Ilse Moravec', password: 'short', passwordRepeat: 'short' });
    expect(short.status).toBe(422);
    expect(await short.text()).toContain('at least 10 characters');
    const differ = await join(token, { name: 'Ilse Moravec', password: NEW_PASSWORD, passwordRepeat: `${NEW_PASSWORD}x` });
    expect(differ.status).toBe(422);
    expect(await differ.text()).toContain('The two passwords differ');
    const noName = await join(token, { name: ' ', password: NEW_PASSWORD, passwordRepeat: NEW_PASSWORD });
    expect(noName.status).toBe(422);
    expect(await noName.text()).toContain('Enter your full name.');
    expect((await join(token)).status).toBe(303);
  });

  it('refuses an expired link (410), an unknown one (404) and says nothing about the firm', async () => {
    const { f, email, invite } = await setUp();
    await invite({ email, role: 'engineer' });
    const { token } = await mailTo(email);
    await db().update(invitation).set({ expiresAt: new Date(Date.now() - 60_000) }).where(eq(invitation.tokenHash, hashInvitationToken(token)));
    const page = await call(`/join?token=${token}`);
    expect(page.status).toBe(410);
    const html = await page.text();
    expect(html).toContain('has expired');
    expect(html).not.toContain(f.firm.name);
    expect(html).not.toContain(email);
    expect((await join(token)).status).toBe(410);
    expect(await db().select().from(user).where(eq(user.email, email))).toHaveLength(0);

    const unknown = await call(`/join?token=${'A'.repeat(43)}`);
    expect(unknown.status).toBe(404);
    expect(await unknown.text()).toContain('does not work');
    expect((await call('/join')).status).toBe(404);
    expect((await call('/join?token=%3Cscript%3E')).status).toBe(404);
  });

  it('refuses a link for an address that already has an account, with what to do instead', async () => {
    const other = await makeFirm({ someone: 'engineer' });
    const { invite } = await setUp();
    const email = other.people.someone!.email;
    expect((await invite({ email, role: 'engineer' })).status).toBe(201);
    const { token } = await mailTo(email);
    const page = await call(`/join?token=${token}`);
    expect(page.status).toBe(409);
    expect(await page.text()).toContain('already has a Sequent account');
    expect((await join(token)).status).toBe(409);
    expect((await signIn(email, TEST_PASSWORD)).response.status).toBe(303);
  });
});

describe('revoking an invitation', () => {
  it('makes the link stop working (410) and records it', async () => {
    const { f, email, invite, cookie } = await setUp();
    const created = await (await invite({ email, role: 'engineer' })).json();
    const { token } = await mailTo(email);
    const revoked = await revoke(created.invitation.invitationId, cookie);
    expect(revoked.status).toBe(200);
    expect((await call(`/join?token=${token}`)).status).toBe(410);
    expect((await join(token)).status).toBe(410);
    expect((await (await call('/api/v1/invitations', { cookie })).json()).invitations).toEqual([]);
    expect((await revoke(created.invitation.invitationId, cookie)).status).toBe(409);
    expect(await actions(f.firm.id)).toContain('member.invitation_revoked');
  });

  it('replaces an earlier pending invitation to the same address: only the newest link works', async () => {
    const { email, invite, cookie } = await setUp();
    await invite({ email, role: 'engineer' });
    const first = (await mailTo(email)).token;
    const again = await invite({ email, role: 'admin' });
    expect((await again.json()).replaced).toBe(1);
    const second = (await mailTo(email)).token;
    expect(second).not.toBe(first);
    expect((await call(`/join?token=${first}`)).status).toBe(410);
    const listed = (await (await call('/api/v1/invitations', { cookie })).json()).invitations;
    expect(listed).toEqual([expect.objectContaining({ email, role: 'admin' })]);
    expect((await join(second)).status).toBe(303);
  });

  it('revokes from the members page, and another firm’s admin cannot revoke it (404)', async () => {
    const { email, invite, cookie } = await setUp();
    const created = await (await invite({ email, role: 'engineer' })).json();
    const id = created.invitation.invitationId as string;
    const other = await makeFirm({ admin: 'admin' });
    const otherCookie = await sessionOf(other.people.admin!.email, TEST_PASSWORD);
    expect((await revoke(id, otherCookie)).status).toBe(404);
    const otherPage = await call('/firm/members', { cookie: otherCookie, form: { intent: 'revoke-invitation', invitationId: id } });
    expect(otherPage.status).toBe(404);
    expect((await (await call('/api/v1/invitations', { cookie: otherCookie })).json()).invitations).toEqual([]);

    const page = await call('/firm/members', { cookie, form: { intent: 'revoke-invitation', invitationId: id } });
    expect(page.status).toBe(200);
    expect(await page.text()).toContain(`The invitation to ${email} was revoked`);
    const [stored] = await db().select().from(invitation).where(eq(invitation.id, id));
    expect(stored!.status).toBe('revoked');
  });
});
