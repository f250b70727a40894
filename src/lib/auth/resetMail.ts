/**
 * The password-reset e-mail: better-auth hands over the token (emailAndPassword.sendResetPassword)
 * and this queues the message in the outbox, linking to Sequent's own /reset-password page.
 */
import { db } from '../../db/client';
import { config } from '../config';
import { passwordResetMessage, queueMail, wakeMailWorker } from '../mail';

/** How long a reset link works. */
export const RESET_TOKEN_MINUTES = 60;

/** The link in the message: the reset page with the token. */
export function resetLinkFor(token: string): string {
  const url = new URL('/reset-password', config().SEQUENT_BASE_URL);
  url.searchParams.set('token', token);
  return url.href;
}

/** Queues the reset message for `user` (account mail: no firm) and wakes the worker. */
export async function queuePasswordResetMail(user: { name: string; email: string }, token: string): Promise<void> {
  await queueMail(db(), {
    kind: 'account.password_reset',
    firmId: null,
    to: [user.email],
    ...passwordResetMessage({ name: user.name, resetUrl: resetLinkFor(token), expiresInMinutes: RESET_TOKEN_MINUTES }),
  });
  wakeMailWorker();
}
