/**
 * The session cookie cache (better-auth `session.cookieCache`): it spares the session and
 * user queries, never the membership one, so roles still take effect on the next request.
 */
import { describe, expect, it } from 'vitest';
import { db } from '../../src/db/client';
import { changeMemberRole } from '../../src/lib/firms';
import { call } from '../helpers/app';
import { makeFirm, TEST_PASSWORD } from '../helpers/firms';

/** Signs in and returns every cookie set, as a browser would send them back. */
async function browserCookies(email: string): Promise<{ cookie: string; names: string[]; raw: string[] }> {
  const response = await call('/signin', { form: { email, password: TEST_PASSWORD, remember: 'on' } });
  expect(response.status).toBe(303);
  const raw = response.headers.getSetCookie();
  const pairs = raw.map((c) => c.split(';')[0]!);
  return { cookie: pairs.join('; '), names: pairs.map((p) => p.slice(0, p.indexOf('='))), raw };
}

describe('session cookie cache', () => {
  it('is set at sign-in, HttpOnly, beside the session token', async () => {
    const f = await makeFirm({ eng: 'engineer' });
    const { names, raw } = await browserCookies(f.people.eng!.email);
    expect(names).toEqual(expect.arrayContaining(['sequent.session_token', 'sequent.session_data']));
    expect(raw.find((c) => c.startsWith('sequent.session_data='))).toMatch(/HttpOnly/i);
  });

  it('serves pages and API calls with the cached session', async () => {
    const f = await makeFirm({ eng: 'engineer' });
    const { cookie } = await browserCookies(f.people.eng!.email);
    const me = await call('/api/v1/me', { cookie });
    expect(me.status).toBe(200);
    expect((await me.json()).user.email).toBe(f.people.eng!.email);
    expect((await call('/', { cookie })).status).toBe(200);
  });

  it('does not cache the role: a demoted admin loses admin rights on the next request', async () => {
    const f = await makeFirm({ admin: 'admin', second: 'admin', eng: 'engineer' });
    const { cookie } = await browserCookies(f.people.second!.email);
    const path = `/api/v1/members/${f.people.eng!.memberId}`;
    expect((await call(path, { cookie, method: 'PATCH', json: { role: 'reviewer' } })).status).toBe(200);
    const demoted = await changeMemberRole(db(), { firmId: f.firm.id, memberId: f.people.second!.memberId, role: 'engineer', actorUserId: f.people.admin!.userId });
    expect(demoted.ok).toBe(true);
    expect((await call(path, { cookie, method: 'PATCH', json: { role: 'engineer' } })).status).toBe(403);
  });

  it('is cleared by sign-out', async () => {
    const f = await makeFirm({ eng: 'engineer' });
    const { cookie } = await browserCookies(f.people.eng!.email);
    const out = await call('/signout', { cookie, form: {} });
    expect(out.status).toBe(303);
    const cleared = out.headers.getSetCookie().find((c) => c.startsWith('sequent.session_data='));
    expect(cleared).toMatch(/Max-Age=0/i);
  });
});
