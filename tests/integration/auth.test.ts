import { beforeAll, describe, expect, it } from 'vitest';
import { call, sessionOf, signIn } from '../helpers/app';
import { makeFirm, TEST_PASSWORD, type TestFirm } from '../helpers/firms';

let firm: TestFirm;
beforeAll(async () => {
  firm = await makeFirm({ eng: 'engineer' });
});

describe('sign-in', () => {
  it('signs in with the right password and redirects home with a session cookie', async () => {
    const { response, cookie } = await signIn(firm.people.eng!.email, TEST_PASSWORD);
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe('/');
    expect(cookie).toMatch(/^sequent\.session_token=/);
  });

  it('sets the session cookie HttpOnly, SameSite=Lax and Path=/', async () => {
    const { response } = await signIn(firm.people.eng!.email, TEST_PASSWORD);
    const raw = response.headers.getSetCookie().find((c) => c.startsWith('sequent.session_token='))!;
    expect(raw).toMatch(/;\s*HttpOnly/i);
    expect(raw).toMatch(/;\s*SameSite=Lax/i);
    expect(raw).toMatch(/;\s*Path=\//i);
  });

  it('refuses a wrong password with a clear message and no cookie', async () => {
    const { response, cookie } = await signIn(firm.people.eng!.email, 'not-the-password');
    expect(response.status).toBe(401);
    expect(cookie).toBeNull();
    const html = await response.text();
    expect(html).toContain('That e-mail and password do not match an account.');
    expect(html).toContain(`value="${firm.people.eng!.email}"`);
  });

  it('refuses an unknown e-mail the same way as a wrong password', async () => {
    const { response } = await signIn('nobody@firm.example', TEST_PASSWORD);
    expect(response.status).toBe(401);
    expect(await response.text()).toContain('That e-mail and password do not match an account.');
  });

  it('answers a malformed e-mail with a field message (422), not an error page', async () => {
    const { response } = await signIn('not-an-email', 'x');
    expect(response.status).toBe(422);
    expect(await response.text()).toContain('Enter the e-mail address of your account.');
  });

  it('rejects a form post from another site (CSRF)', async () => {
    const response = await call('/signin', {
      form: { email: firm.people.eng!.email, password: TEST_PASSWORD },
      headers: { origin: 'https://evil.example' },
    });
    expect(response.status).toBe(403);
  });

  it('only redirects to paths on this site after sign-in', async () => {
    const response = await call('/signin?next=//evil.example/x', {
      form: { email: firm.people.eng!.email, password: TEST_PASSWORD },
    });
    expect(response.headers.get('location')).toBe('/');
  });
});

describe('sessions', () => {
  it('sends signed-out visitors of a page to the sign-in page, keeping where they were going', async () => {
    const response = await call('/firm/members');
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe('/signin?next=%2Ffirm%2Fmembers');
  });

  it('answers signed-out API calls with 401 JSON', async () => {
    const response = await call('/api/v1/me');
    expect(response.status).toBe(401);
    expect(response.headers.get('content-type')).toContain('application/json');
    expect(await response.json()).toEqual({ error: { code: 'unauthenticated', message: 'Sign in to continue.' } });
  });

  it('shows the signed-in shell with the user and firm', async () => {
    const cookie = await sessionOf(firm.people.eng!.email, TEST_PASSWORD);
    const response = await call('/', { cookie });
    expect(response.status).toBe(200);
    const html = await response.text();
    expect(html).toContain(firm.firm.name);
    expect(html).toContain('The casebook is empty');
  });

  it('ends the session on sign-out', async () => {
    const cookie = await sessionOf(firm.people.eng!.email, TEST_PASSWORD);
    const out = await call('/signout', { cookie, form: {} });
    expect(out.status).toBe(303);
    expect(out.headers.get('location')).toBe('/signin');
    expect((await call('/api/v1/me', { cookie })).status).toBe(401);
  });

  it('serves pages with protective headers', async () => {
    const response = await call('/signin');
    expect(response.headers.get('x-content-type-options')).toBe('nosniff');
    expect(response.headers.get('x-frame-options')).toBe('DENY');
  });

  it('answers an unknown page with the 404 page', async () => {
    const cookie = await sessionOf(firm.people.eng!.email, TEST_PASSWORD);
    const response = await call('/no/such/page', { cookie });
    expect(response.status).toBe(404);
    expect(await response.text()).toContain('Nothing at this address');
  });
});

describe('better-auth endpoints', () => {
  it.each([
    ['/api/auth/sign-up/email', { email: 'new@firm.example', password: 'long-enough-pass', name: 'New' }],
    ['/api/auth/organization/create', { name: 'Rogue', slug: 'rogue' }],
    ['/api/auth/organization/update-member-role', { memberId: 'x', role: 'admin' }],
  ])('keeps %s closed (404): people and firms change only through Sequent routes', async (path, json) => {
    const cookie = await sessionOf(firm.people.eng!.email, TEST_PASSWORD);
    const response = await call(path, { cookie, json, headers: { origin: new URL(path, 'http://127.0.0.1').origin } });
    expect(response.status).toBe(404);
    expect((await response.json()).error.code).toBe('not_found');
  });
});
