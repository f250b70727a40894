import { config } from '../config';
import { auth } from './auth';

/**
 * better-auth endpoints reachable over HTTP. Everything else (sign-up, the organization
 * plugin's member and role endpoints) answers 404: firms, members and roles change only
 * through Sequent's own routes, which enforce its rules (e.g. never remove the last admin).
 */
const OPEN_AUTH_PATHS = new Set([
  '/sign-in/email',
  '/sign-out',
  '/get-session',
  '/change-password',
  '/ok',
  // Forgotten passwords (the /forgot-password and /reset-password pages use them too).
  '/request-password-reset',
  '/reset-password',
]);

/** The better-auth path of a request under /api/auth, e.g. `/sign-in/email`. */
function authPath(url: URL): string {
  return url.pathname.replace(/^\/api\/auth/, '') || '/';
}

/** True when the request may reach better-auth at all. */
export function isOpenAuthPath(url: URL): boolean {
  return OPEN_AUTH_PATHS.has(authPath(url));
}

/**
 * Hands a request to better-auth with the client's address as x-forwarded-for, so its rate
 * limiter counts per client. `clientAddress` is Astro's, which scripts/serve.mjs makes the
 * socket address unless a trusted load balancer forwards the client's.
 */
export async function forwardToAuth(request: Request, clientAddress: string): Promise<Response> {
  const headers = new Headers(request.headers);
  headers.set('x-forwarded-for', clientAddress);
  const init: RequestInit & { duplex?: 'half' } = { method: request.method, headers };
  if (request.method !== 'GET' && request.method !== 'HEAD') {
    init.body = await request.arrayBuffer();
  }
  return auth().handler(new Request(request.url, init));
}

/** The outcome of a password sign-in. */
export type SignInResult =
  | { ok: true; setCookies: string[] }
  | { ok: false; status: number; message: string };

/** Signs in with e-mail and password through better-auth's own endpoint (rate limit included). */
export async function signInWithPassword(input: {
  email: string;
  password: string;
  rememberMe: boolean;
  clientAddress: string;
  userAgent: string | null;
}): Promise<SignInResult> {
  const base = config().SEQUENT_BASE_URL;
  const headers = new Headers({ 'content-type': 'application/json', origin: base, 'x-forwarded-for': input.clientAddress });
  if (input.userAgent) headers.set('user-agent', input.userAgent);
  const response = await auth().handler(
    new Request(new URL('/api/auth/sign-in/email', base), {
      method: 'POST',
      headers,
      body: JSON.stringify({ email: input.email, password: input.password, rememberMe: input.rememberMe }),
    }),
  );
  if (response.ok) return { ok: true, setCookies: response.headers.getSetCookie() };
  if (response.status === 429) {
    return { ok: false, status: 429, message: 'Too many sign-in attempts. Wait a minute and try again.' };
  }
  if (response.status === 401 || response.status === 400) {
    return { ok: false, status: 401, message: 'That e-mail and password do not match an account.' };
  }
  return { ok: false, status: 500, message: 'Sign-in is unavailable right now. Try again shortly.' };
}

/** Ends the session of the request's cookie; returns the cookies that clear it. */
export async function signOut(request: Request): Promise<string[]> {
  const base = config().SEQUENT_BASE_URL;
  const headers = new Headers({ origin: base, cookie: request.headers.get('cookie') ?? '' });
  const response = await auth().handler(new Request(new URL('/api/auth/sign-out', base), { method: 'POST', headers }));
  return response.headers.getSetCookie();
}
