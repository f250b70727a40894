/**
 * Mentions in a comment: `@` and the part of a colleague's e-mail before the `@`
 * (`@helena.brandt`), matched without regard to case against the firm's members. Pure.
 */

/** A member who can be mentioned. */
export interface Mentionable {
  readonly userId: string;
  readonly email: string;
}

const MENTION = /(^|[^\w.@])@([a-z0-9][a-z0-9._%+-]*[a-z0-9]|[a-z0-9])/gi;

/** The members mentioned in `body`, each once, in order of first mention. */
export function findMentions<M extends Mentionable>(body: string, members: readonly M[]): M[] {
  const byLocalPart = new Map(members.map((m) => [m.email.split('@')[0]!.toLowerCase(), m]));
  const found = new Map<string, M>();
  for (const match of body.matchAll(MENTION)) {
    // A sentence may end right after a mention: "ask @helena.brandt."
    const handle = match[2]!.toLowerCase().replace(/\.+$/, '');
    const member = byLocalPart.get(handle);
    if (member && !found.has(member.userId)) found.set(member.userId, member);
  }
  return [...found.values()];
}
