import { betterAuth } from 'better-auth';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import { organization } from 'better-auth/plugins';
import { db } from '../../db/client';
import * as schema from '../../db/schema';
import { config } from '../config';
import { queuePasswordResetMail, RESET_TOKEN_MINUTES } from './resetMail';
import { accessControl, authRoles } from './roles';

/** How long a request may trust the session cookie cache before reading the session row again. */
export const SESSION_CACHE_SECONDS = 60;

/** Minimum password length for every account (temporary passwords included). */
export const MIN_PASSWORD_LENGTH = 10;

// Only for development and tests; config() refuses to start production without a secret.
const DEV_SECRET = 'sequent-development-secret-not-for-production-use';

function createAuth() {
  const settings = config();
  return betterAuth({
    appName: 'Sequent',
    baseURL: settings.SEQUENT_BASE_URL,
    secret: settings.BETTER_AUTH_SECRET ?? DEV_SECRET,
    database: drizzleAdapter(db(), { provider: 'pg', schema }),
    emailAndPassword: {
      enabled: true,
      // Nobody signs themselves up: a firm admin adds people (invitations come later).
      disableSignUp: true,
      minPasswordLength: MIN_PASSWORD_LENGTH,
      maxPasswordLength: 128,
      // Forgotten passwords: the link goes out through the mail outbox (src/lib/mail), to
      // Sequent's /reset-password page; a reset ends every session of the account.
      resetPasswordTokenExpiresIn: RESET_TOKEN_MINUTES * 60,
      revokeSessionsOnPasswordReset: true,
      sendResetPassword: ({ user, token }) => queuePasswordResetMail(user, token),
    },
    session: {
      expiresIn: 60 * 60 * 24 * 7,
      updateAge: 60 * 60 * 24,
      // A signed copy of the session and user in a second cookie, trusted for a minute,
      // spares two queries per request. The price: a session ended elsewhere stays usable
      // for up to that minute with a copied cookie pair. Firm membership and role are still
      // read from the database on every request (resolveFirm), so removing someone from a
      // firm or changing their role takes effect at once.
      cookieCache: { enabled: true, maxAge: SESSION_CACHE_SECONDS },
    },
    rateLimit: {
      enabled: settings.SEQUENT_RATE_LIMIT === 'on',
      // In PostgreSQL so every app server behind a load balancer shares the counters.
      storage: 'database',
      window: 60,
      max: 100,
      customRules: {
        '/sign-in/email': { window: 60, max: 10 },
        // Each request may send a message: few per client address.
        '/request-password-reset': { window: 60, max: 3 },
        '/reset-password': { window: 60, max: 10 },
      },
    },
    advanced: {
      cookiePrefix: 'sequent',
      // The app sets x-forwarded-for from the socket address before handing requests over
      // (src/lib/auth/handler.ts), so one client cannot use up everyone's sign-in budget.
      ipAddress: { ipAddressHeaders: ['x-forwarded-for'] },
      useSecureCookies: settings.SEQUENT_BASE_URL.startsWith('https://'),
    },
    plugins: [
      organization({
        ac: accessControl,
        roles: authRoles,
        creatorRole: 'admin',
        allowUserToCreateOrganization: false,
      }),
    ],
  });
}

export type Auth = ReturnType<typeof createAuth>;
/** A signed-in session and its user, as better-auth returns them. */
export type AuthSession = Auth['$Infer']['Session'];

const globalForAuth = globalThis as unknown as { sequentAuth?: Auth };

/** The process's better-auth instance (created on first use, after the environment is read). */
export function auth(): Auth {
  globalForAuth.sequentAuth ??= createAuth();
  return globalForAuth.sequentAuth;
}
