/**
 * Resetting a forgotten password through better-auth's own endpoints, called from the
 * /forgot-password and /reset-password pages the way sign-in is (so its rate limits apply
 * per client address). The request never says whether an account exists.
 */
import { config } from '../config';
import { auth } from './auth';

/** The outcome of asking for a reset link. */
export type ResetRequestResult = { ok: true } | { ok: false; status: 429 | 503; message: string };

/** The outcome of setting a new password with a token. */
export type ResetResult = { ok: true } | { ok: false; reason: 'invalid_token' | 'weak_password' | 'rate_limited' | 'unavailable'; status: 400 | 410 | 422 | 429 | 503; message: string };

const TOO_MANY = 'Too many requests from this computer. Wait a minute and try again.';
const UNAVAILABLE = 'Password reset is unavailable right now. Try again shortly.';

async function callAuth(path: string, body: unknown, clientAddress: string): Promise<Response> {
  const base = config().SEQUENT_BASE_URL;
  const headers = new Headers({ 'content-type': 'application/json', origin: base, 'x-forwarded-for': clientAddress });
  return auth().handler(new Request(new URL(`/api/auth${path}`, base), { method: 'POST', headers, body: JSON.stringify(body) }));
}

/**
 * Asks better-auth to send a reset link to `email` if an account has it. The answer is the
 * same whether or not one does; only the rate limit (per client address) is told apart.
 */
export async function requestPasswordReset(input: { email: string; clientAddress: string }): Promise<ResetRequestResult> {
  const response = await callAuth('/request-password-reset', { email: input.email }, input.clientAddress);
  if (response.ok) return { ok: true };
  if (response.status === 429) return { ok: false, status: 429, message: TOO_MANY };
  return { ok: false, status: 503, message: UNAVAILABLE };
}

/** Sets `newPassword` for the account the token was issued to; the token is spent. */
export async function resetPassword(input: { token: string; newPassword: string; clientAddress: string }): Promise<ResetResult> {
  const response = await callAuth('/reset-password', { token: input.token, newPassword: input.newPassword }, input.clientAddress);
  if (response.ok) return { ok: true };
  if (response.status === 429) return { ok: false, reason: 'rate_limited', status: 429, message: TOO_MANY };
  const body = (await response.json().catch(() => null)) as { code?: unknown } | null;
  if (body?.code === 'INVALID_TOKEN' || body?.code === 'USER_NOT_FOUND') {
    return { ok: false, reason: 'invalid_token', status: 410, message: INVALID_LINK };
  }
  if (body?.code === 'PASSWORD_TOO_SHORT' || body?.code === 'PASSWORD_TOO_LONG') {
    return { ok: false, reason: 'weak_password', status: 422, message: 'Choose a password of at least 10 and at most 128 characters.' };
  }
  return { ok: false, reason: 'unavailable', status: 503, message: UNAVAILABLE };
}

/** The message for a reset link that is expired, already used or mistyped. */
export const INVALID_LINK = 'This reset link has expired or has already been used. Ask for a new one below; each link works once, within an hour.';

/** True while `token` can still reset a password (not used, not expired). */
export async function isResetTokenUsable(token: string): Promise<boolean> {
  if (!/^[A-Za-z0-9_-]{8,200}$/.test(token)) return false;
  const context = await auth().$context;
  const found = await context.internalAdapter.findVerificationValue(`reset-password:${token}`);
  return Boolean(found && found.expiresAt > new Date());
}
