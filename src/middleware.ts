import type { APIContext, MiddlewareNext } from 'astro';
import { defineMiddleware } from 'astro:middleware';
import { db } from './db/client';
import { auth } from './lib/auth';
import { resolveFirm } from './lib/firms';
import { errors } from './lib/http';
import { startMailWorker } from './lib/mail';
import { startSearchWorker } from './lib/search';

/** Routes anyone may open without signing in. */
const PUBLIC_PAGES = new Set(['/signin', '/join', '/forgot-password', '/reset-password', '/404']);

function isPublic(pathname: string): boolean {
  return PUBLIC_PAGES.has(pathname) || pathname.startsWith('/api/auth/');
}

const SECURITY_HEADERS: Record<string, string> = {
  'x-content-type-options': 'nosniff',
  'x-frame-options': 'DENY',
  'referrer-policy': 'same-origin',
  'permissions-policy': 'camera=(), microphone=(), geolocation=()',
};

/**
 * Resolves the session and the active firm for every on-demand request and puts them on
 * `locals`. Pages need a session (else a redirect to /signin); API routes answer 401/403
 * as JSON. Firm and role checks beyond membership are each route's job (requireMember).
 */
export const onRequest = defineMiddleware(async (context, next) => {
  context.locals.user = null;
  context.locals.session = null;
  context.locals.firm = null;
  if (context.isPrerendered) return next();
  // The process's mail delivery worker starts with the first request (once; off without SEQUENT_SMTP_URL).
  startMailWorker();
  // Likewise the search worker, which drains the search outbox (off without SEQUENT_SEARCH_URL).
  startSearchWorker();

  const { pathname } = context.url;
  // Cookies better-auth sets while reading the session (a renewed session cache, a cleared
  // stale one): passed on with whatever response this request ends with.
  let sessionCookies: string[] = [];
  if (!pathname.startsWith('/api/auth/')) {
    const { headers, response: found } = await auth().api.getSession({ headers: context.request.headers, returnHeaders: true });
    sessionCookies = headers.getSetCookie();
    if (found) {
      context.locals.user = found.user;
      context.locals.session = found.session;
      context.locals.firm = await resolveFirm(db(), found.user.id, found.session.activeOrganizationId);
    }
  }

  return finish(await guard(context, next), sessionCookies);
});

/** The response for a request whose session is resolved: a redirect, a JSON error, or the route's. */
async function guard(context: APIContext, next: MiddlewareNext): Promise<Response> {
  const { pathname } = context.url;
  if (!isPublic(pathname)) {
    const isApi = pathname.startsWith('/api/');
    if (!context.locals.user) {
      if (isApi) return errors.unauthenticated();
      const nextPath = pathname === '/' ? '' : `?next=${encodeURIComponent(pathname + context.url.search)}`;
      return context.redirect(`/signin${nextPath}`, 303);
    }
    if (!context.locals.firm && isApi) return errors.noFirm();
  }
  return next();
}

/** Adds the protective headers and the session cookies to `response`. */
function finish(response: Response, sessionCookies: readonly string[]): Response {
  for (const [name, value] of Object.entries(SECURITY_HEADERS)) {
    if (!response.headers.has(name)) response.headers.set(name, value);
  }
  // A route that sets its own session cookies (sign-in, sign-out) has the last word.
  const own = response.headers.getSetCookie().map((c) => c.slice(0, c.indexOf('=')));
  for (const cookie of sessionCookies) {
    if (!own.includes(cookie.slice(0, cookie.indexOf('=')))) response.headers.append('set-cookie', cookie);
  }
  return response;
}
