import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '../../src/db/client';
import { auditEvent } from '../../src/db/schema';
import { changeMemberRole } from '../../src/lib/firms';
import { call, sessionOf, signIn } from '../helpers/app';
import { makeFirm, TEST_PASSWORD } from '../helpers/firms';

const roleOf = async (cookie: string, memberId: string) =>
  (await (await call(`/api/v1/members/${memberId}`, { cookie })).json()).member.role as string;

describe('changing roles', () => {
  it('refuses an engineer (403) through the API and the page, and changes nothing', async () => {
    const f = await makeFirm({ admin: 'admin', eng: 'engineer', other: 'engineer' });
    const cookie = await sessionOf(f.people.eng!.email, TEST_PASSWORD);
    const api = await call(`/api/v1/members/${f.people.other!.memberId}`, { cookie, method: 'PATCH', json: { role: 'reviewer' } });
    expect(api.status).toBe(403);
    expect((await api.json()).error.code).toBe('forbidden');
    const page = await call('/firm/members', {
      cookie,
      form: { intent: 'change-role', memberId: f.people.other!.memberId, role: 'admin' },
    });
    expect(page.status).toBe(403);
    expect(await roleOf(cookie, f.people.other!.memberId)).toBe('engineer');
  });

  it('refuses a reviewer (403)', async () => {
    const f = await makeFirm({ admin: 'admin', rev: 'reviewer', eng: 'engineer' });
    const cookie = await sessionOf(f.people.rev!.email, TEST_PASSWORD);
    const api = await call(`/api/v1/members/${f.people.eng!.memberId}`, { cookie, method: 'PATCH', json: { role: 'admin' } });
    expect(api.status).toBe(403);
  });

  it('lets an admin change a role, and records it in the audit trail', async () => {
    const f = await makeFirm({ admin: 'admin', eng: 'engineer' });
    const cookie = await sessionOf(f.people.admin!.email, TEST_PASSWORD);
    const response = await call(`/api/v1/members/${f.people.eng!.memberId}`, { cookie, method: 'PATCH', json: { role: 'reviewer' } });
    expect(response.status).toBe(200);
    expect((await response.json()).member.role).toBe('reviewer');
    const events = await db()
      .select()
      .from(auditEvent)
      .where(and(eq(auditEvent.firmId, f.firm.id), eq(auditEvent.action, 'member.role_changed')));
    expect(events).toHaveLength(1);
    expect(events[0]!.actorUserId).toBe(f.people.admin!.userId);
    expect(events[0]!.details).toMatchObject({ from: 'engineer', to: 'reviewer' });
  });

  it('lets an admin change a role through the members page form', async () => {
    const f = await makeFirm({ admin: 'admin', eng: 'engineer' });
    const cookie = await sessionOf(f.people.admin!.email, TEST_PASSWORD);
    const page = await call('/firm/members', { cookie, form: { intent: 'change-role', memberId: f.people.eng!.memberId, role: 'admin' } });
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('is now firm admin');
    expect(await roleOf(cookie, f.people.eng!.memberId)).toBe('admin');
  });

  it('answers an unknown role with 422 and the field that is wrong', async () => {
    const f = await makeFirm({ admin: 'admin', eng: 'engineer' });
    const cookie = await sessionOf(f.people.admin!.email, TEST_PASSWORD);
    const response = await call(`/api/v1/members/${f.people.eng!.memberId}`, { cookie, method: 'PATCH', json: { role: 'owner' } });
    expect(response.status).toBe(422);
    const body = await response.json();
    expect(body.error.issues[0]).toEqual({ path: 'role', message: 'role must be one of engineer, reviewer, admin' });
  });

  it('answers a body that is not JSON with 400', async () => {
    const f = await makeFirm({ admin: 'admin', eng: 'engineer' });
    const cookie = await sessionOf(f.people.admin!.email, TEST_PASSWORD);
    const response = await call(`/api/v1/members/${f.people.eng!.memberId}`, {
      cookie,
      method: 'PATCH',
      headers: { 'content-type': 'application/json' },
    });
    expect(response.status).toBe(400);
  });

  it('never demotes the last admin (409), not even themselves', async () => {
    const f = await makeFirm({ admin: 'admin', eng: 'engineer' });
    const cookie = await sessionOf(f.people.admin!.email, TEST_PASSWORD);
    const response = await call(`/api/v1/members/${f.people.admin!.memberId}`, { cookie, method: 'PATCH', json: { role: 'engineer' } });
    expect(response.status).toBe(409);
    expect((await response.json()).error.code).toBe('last_admin');
    expect(await roleOf(cookie, f.people.admin!.memberId)).toBe('admin');
  });

  it('lets one of two admins be demoted', async () => {
    const f = await makeFirm({ admin: 'admin', second: 'admin' });
    const cookie = await sessionOf(f.people.admin!.email, TEST_PASSWORD);
    const response = await call(`/api/v1/members/${f.people.second!.memberId}`, { cookie, method: 'PATCH', json: { role: 'reviewer' } });
    expect(response.status).toBe(200);
  });

  it('keeps one admin when two admins demote each other at the same moment', async () => {
    const f = await makeFirm({ one: 'admin', two: 'admin' });
    const results = await Promise.all([
      changeMemberRole(db(), { firmId: f.firm.id, memberId: f.people.one!.memberId, role: 'engineer', actorUserId: f.people.two!.userId }),
      changeMemberRole(db(), { firmId: f.firm.id, memberId: f.people.two!.memberId, role: 'engineer', actorUserId: f.people.one!.userId }),
    ]);
    expect(results.filter((r) => r.ok)).toHaveLength(1);
    expect(results.filter((r) => !r.ok && r.reason === 'last_admin')).toHaveLength(1);
  });
});

describe('adding members', () => {
  it('lets an admin add a colleague who can then sign in with the temporary password', async () => {
    const f = await makeFirm({ admin: 'admin' });
    const cookie = await sessionOf(f.people.admin!.email, TEST_PASSWORD);
    const email = `new.${f.firm.slug}@firm.example`;
    const response = await call('/api/v1/members', {
      cookie,
      json: { name: 'Nadia Kerr', email, role: 'reviewer', temporaryPassword: 'temporary-pass-1' },
    });
    expect(response.status).toBe(201);
    expect((await response.json()).member).toMatchObject({ email, role: 'reviewer', name: 'Nadia Kerr' });
    expect((await signIn(email, 'temporary-pass-1')).response.status).toBe(303);
  });

  it('refuses an engineer adding people (403)', async () => {
    const f = await makeFirm({ admin: 'admin', eng: 'engineer' });
    const cookie = await sessionOf(f.people.eng!.email, TEST_PASSWORD);
    const response = await call('/api/v1/members', {
      cookie,
      json: { name: 'Someone Else', email: `x.${f.firm.slug}@firm.example`, role: 'admin', temporaryPassword: 'temporary-pass-1' },
    });
    expect(response.status).toBe(403);
  });

  it('explains every invalid field at once (422)', async () => {
    const f = await makeFirm({ admin: 'admin' });
    const cookie = await sessionOf(f.people.admin!.email, TEST_PASSWORD);
    const response = await call('/api/v1/members', { cookie, json: { name: 'A', email: 'nope', role: 'boss', temporaryPassword: 'short' } });
    expect(response.status).toBe(422);
    const paths = (await response.json()).error.issues.map((i: { path: string }) => i.path);
    expect(paths.sort()).toEqual(['email', 'name', 'role', 'temporaryPassword']);
  });

  it('refuses adding someone who is already a member (409)', async () => {
    const f = await makeFirm({ admin: 'admin', eng: 'engineer' });
    const cookie = await sessionOf(f.people.admin!.email, TEST_PASSWORD);
    const response = await call('/api/v1/members', {
      cookie,
      json: { name: 'Again', email: f.people.eng!.email, role: 'engineer', temporaryPassword: 'temporary-pass-1' },
    });
    expect(response.status).toBe(409);
  });
});
