import { auth } from './auth';

/** Hashes a password the way better-auth verifies it at sign-in. */
export async function hashPassword(password: string): Promise<string> {
  const context = await auth().$context;
  return context.password.hash(password);
}
