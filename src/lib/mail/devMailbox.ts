/**
 * The development mailbox: reads the local mail fake's HTTP API (mail-fake/server.mjs).
 * Only when SEQUENT_DEV_MAILBOX=on and SEQUENT_DEV_MAILBOX_URL are set (npm start and the
 * test app); a real deployment has neither, and /dev/mailbox answers 404.
 */
import { z } from 'zod';
import { config } from '../config';

/** A message in the list (no bodies). */
const SummarySchema = z.object({ id: z.string(), from: z.string(), to: z.array(z.string()), subject: z.string(), date: z.string() });
/** A whole message. */
const MessageSchema = SummarySchema.extend({ text: z.string(), html: z.string() });

export type DevMailSummary = z.output<typeof SummarySchema>;
export type DevMail = z.output<typeof MessageSchema>;

/** The fake's API URL when the development mailbox is on, else null. */
export function devMailboxUrl(): string | null {
  const settings = config();
  return settings.SEQUENT_DEV_MAILBOX === 'on' && settings.SEQUENT_DEV_MAILBOX_URL ? settings.SEQUENT_DEV_MAILBOX_URL : null;
}

/** Outcome of a mailbox read: the fake may be stopped. */
export type DevMailboxResult<T> = { ok: true; value: T } | { ok: false; reason: 'unreachable' | 'not_found' };

async function request(base: string, path: string, method = 'GET'): Promise<Response | null> {
  try {
    return await fetch(new URL(path, base), { method, signal: AbortSignal.timeout(3_000) });
  } catch {
    return null;
  }
}

/** Every message in the fake, newest first. */
export async function listDevMail(base: string): Promise<DevMailboxResult<DevMailSummary[]>> {
  const response = await request(base, '/messages');
  if (!response?.ok) return { ok: false, reason: 'unreachable' };
  const parsed = z.object({ messages: z.array(SummarySchema) }).safeParse(await response.json().catch(() => null));
  return parsed.success ? { ok: true, value: parsed.data.messages } : { ok: false, reason: 'unreachable' };
}

/** One message with its bodies. */
export async function readDevMail(base: string, id: string): Promise<DevMailboxResult<DevMail>> {
  const response = await request(base, `/messages/${encodeURIComponent(id)}`);
  if (!response) return { ok: false, reason: 'unreachable' };
  if (response.status === 404) return { ok: false, reason: 'not_found' };
  const parsed = MessageSchema.safeParse(await response.json().catch(() => null));
  return parsed.success ? { ok: true, value: parsed.data } : { ok: false, reason: 'unreachable' };
}

/** Removes every message from the fake. */
export async function clearDevMail(base: string): Promise<DevMailboxResult<null>> {
  const response = await request(base, '/messages', 'DELETE');
  return response?.ok ? { ok: true, value: null } : { ok: false, reason: 'unreachable' };
}
