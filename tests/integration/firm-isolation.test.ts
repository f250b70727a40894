import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '../../src/db/client';
import { inviteMember } from '../../src/lib/firms';
import { appUrl, call, sessionOf } from '../helpers/app';
import { makeFirm, TEST_PASSWORD, type TestFirm } from '../helpers/firms';

// A member of firm A must learn nothing of firm B: every firm-B resource answers 404,
// exactly as a resource that does not exist, never 403 and never data.
let a: TestFirm;
let b: TestFirm;
let adminOfA: string;
let invitationOfB: string;
let caseOfB: string;
let attachmentOfB: string;

beforeAll(async () => {
  a = await makeFirm({ admin: 'admin', eng: 'engineer' });
  b = await makeFirm({ admin: 'admin', eng: 'engineer' });
  adminOfA = await sessionOf(a.people.admin!.email, TEST_PASSWORD);
  const invited = await inviteMember(db(), { firmId: b.firm.id, inviterUserId: b.people.admin!.userId, email: 'newcomer@firm-b.example', role: 'engineer', baseUrl: appUrl() });
  if (!invited.ok) throw new Error('could not invite into firm B');
  invitationOfB = invited.invitation.invitationId;
  // A case of firm B with a file, to probe the attachment routes from firm A.
  const engOfB = await sessionOf(b.people.eng!.email, TEST_PASSWORD);
  const created = await call('/api/v1/cases', { cookie: engOfB, json: { title: 'Firm B culvert', structureType: 'culvert-outlet', sectionShape: 'rectangular' } });
  caseOfB = (await created.json()).case.id;
  const form = new FormData();
  form.append('file', new Blob(['a,b\n1,2\n']), 'levels.csv');
  const uploaded = await fetch(new URL(`/api/v1/cases/${caseOfB}/attachments`, appUrl()), { method: 'POST', headers: { cookie: engOfB, origin: appUrl() }, body: form });
  attachmentOfB = (await uploaded.json()).attachments[0].id;
});

describe('firm isolation', () => {
  const resources: Array<[string, () => { path: string; method?: string; json?: unknown }]> = [
    ['the firm profile', () => ({ path: `/api/v1/firms/${b.firm.id}` })],
    ['a member record', () => ({ path: `/api/v1/members/${b.people.eng!.memberId}` })],
    ['a role change of a member', () => ({ path: `/api/v1/members/${b.people.eng!.memberId}`, method: 'PATCH', json: { role: 'admin' } })],
    ['the revocation of an invitation', () => ({ path: `/api/v1/invitations/${invitationOfB}`, method: 'DELETE', json: {} })],
    ['the files of a case', () => ({ path: `/api/v1/cases/${caseOfB}/attachments` })],
    ['a file download', () => ({ path: `/api/v1/attachments/${attachmentOfB}` })],
    ['a caption change of a file', () => ({ path: `/api/v1/cases/${caseOfB}/attachments/${attachmentOfB}`, method: 'PATCH', json: { caption: 'x' } })],
    ['the removal of a file', () => ({ path: `/api/v1/cases/${caseOfB}/attachments/${attachmentOfB}`, method: 'DELETE', json: {} })],
  ];

  it.each(resources)('answers 404 for firm B %s', async (_label, request) => {
    const { path, method, json } = request();
    const response = await call(path, { cookie: adminOfA, method, json });
    expect(response.status).toBe(404);
    const body = await response.json();
    expect(body.error.code).toBe('not_found');
    expect(JSON.stringify(body)).not.toContain(b.firm.name);
  });

  it('answers the same 404 for a firm B id as for an id that never existed', async () => {
    const real = await call(`/api/v1/members/${b.people.eng!.memberId}`, { cookie: adminOfA });
    const missing = await call('/api/v1/members/00000000-0000-0000-0000-000000000000', { cookie: adminOfA });
    expect(real.status).toBe(missing.status);
    expect(await real.json()).toEqual(await missing.json());
  });

  it('leaves firm B untouched after a refused role change', async () => {
    const cookieB = await sessionOf(b.people.admin!.email, TEST_PASSWORD);
    const response = await call(`/api/v1/members/${b.people.eng!.memberId}`, { cookie: cookieB });
    expect((await response.json()).member.role).toBe('engineer');
  });

  it('lists only the members of the caller’s own firm', async () => {
    const response = await call('/api/v1/members', { cookie: adminOfA });
    const emails = ((await response.json()).members as Array<{ email: string }>).map((m) => m.email);
    expect(emails.sort()).toEqual([a.people.admin!.email, a.people.eng!.email].sort());
  });

  it('shows firm A its own firm only on the members page', async () => {
    const html = await (await call('/firm/members', { cookie: adminOfA })).text();
    expect(html).toContain(a.firm.name);
    expect(html).not.toContain(b.firm.name);
    expect(html).not.toContain(b.people.eng!.email);
  });

  it('cannot change a firm B role through the members page form either', async () => {
    const response = await call('/firm/members', {
      cookie: adminOfA,
      form: { intent: 'change-role', memberId: b.people.eng!.memberId, role: 'admin' },
    });
    expect(response.status).toBe(404);
  });

  it('cannot reach firm B through better-auth’s organization endpoints', async () => {
    const listing = await call(`/api/auth/organization/list-members?organizationId=${b.firm.id}`, { cookie: adminOfA });
    expect(listing.status).toBe(404);
    const switching = await call('/api/auth/organization/set-active', {
      cookie: adminOfA,
      json: { organizationId: b.firm.id },
      headers: { origin: new URL(listing.url).origin },
    });
    expect(switching.status).toBe(404);
  });
});
