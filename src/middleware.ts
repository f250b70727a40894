import { defineMiddleware } from 'astro:middleware';
import { db } from './db/client';
import { auth } from './lib/auth';
import { resolveFirm } from './lib/firms';
import { errors } from './lib/http';

/** Routes anyone may open without signing in. */
const PUBLIC_PAGES = new Set(['/signin', '/404']);

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

  const { pathname } = context.url;
  if (!pathname.startsWith('/api/auth/')) {
    const found = await auth().api.getSession({ headers: context.request.headers });
    if (found) {
      context.locals.user = found.user;
      context.locals.session = found.session;
      context.locals.firm = await resolveFirm(db(), found.user.id, found.session.activeOrganizationId);
    }
  }

  if (!isPublic(pathname)) {
    const isApi = pathname.startsWith('/api/');
    if (!context.locals.user) {
      if (isApi) return errors.unauthenticated();
      const nextPath = pathname === '/' ? '' : `?next=${encodeURIComponent(pathname + context.url.search)}`;
      return context.redirect(`/signin${nextPath}`, 303);
    }
    if (!context.locals.firm && isApi) return errors.noFirm();
  }

  const response = await next();
  for (const [name, value] of Object.entries(SECURITY_HEADERS)) {
    if (!response.headers.has(name)) response.headers.set(name, value);
  }
  return response;
});
