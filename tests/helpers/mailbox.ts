/** Reading the SMTP fake's HTTP API (mail-fake/server.mjs) in tests. */
import { inject } from 'vitest';

/** The mailbox API of the fake the test app sends to. */
export const appMailboxUrl = (): string => inject('mailboxUrl');

export interface FakeMessage {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  date: string;
}

/** Every message in the fake at `apiUrl`, newest first, with bodies. */
export async function fakeMessages(apiUrl: string): Promise<FakeMessage[]> {
  const list = (await (await fetch(new URL('/messages', apiUrl))).json()) as { messages: Array<{ id: string }> };
  return Promise.all(list.messages.map(async (m) => (await (await fetch(new URL(`/messages/${m.id}`, apiUrl))).json()) as FakeMessage));
}

/** The messages addressed to `address`. */
export async function messagesTo(apiUrl: string, address: string): Promise<FakeMessage[]> {
  return (await fakeMessages(apiUrl)).filter((m) => m.to.includes(address.toLowerCase()));
}

/** Waits (polling) until `count` messages to `address` arrived; fails after `timeoutMs`. */
export async function waitForMail(apiUrl: string, address: string, count = 1, timeoutMs = 15_000): Promise<FakeMessage[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = await messagesTo(apiUrl, address);
    if (found.length >= count) return found;
    if (Date.now() > deadline) throw new Error(`expected ${count} message(s) to ${address} in the mail fake, found ${found.length}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}
