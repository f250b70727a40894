import { randomUUID } from 'node:crypto';
import { and, asc, eq, sql } from 'drizzle-orm';
import type { Database, Queryable } from '../../db/client';
import { account, member, organization, user } from '../../db/schema';
import { recordAudit } from '../audit';
import { asRole, type Role } from '../auth/roles';
import type { Firm } from './firm';

/** A member of a firm as the members page and API show it. */
export interface FirmMember {
  memberId: string;
  userId: string;
  name: string;
  email: string;
  role: Role;
  joinedAt: Date;
}

/** The firm's members, admins first, then by name. */
export async function listMembers(database: Queryable, firmId: string): Promise<FirmMember[]> {
  const rows = await database
    .select({
      memberId: member.id,
      userId: user.id,
      name: user.name,
      email: user.email,
      role: member.role,
      joinedAt: member.createdAt,
    })
    .from(member)
    .innerJoin(user, eq(user.id, member.userId))
    .where(eq(member.organizationId, firmId))
    .orderBy(sql`case ${member.role} when 'admin' then 0 when 'reviewer' then 1 else 2 end`, asc(user.name));
  return rows.map((row) => ({ ...row, role: asRole(row.role) ?? 'engineer' }));
}

/** The outcome of a role change. */
export type ChangeRoleResult =
  | { ok: true; member: FirmMember; changed: boolean }
  | { ok: false; reason: 'not_found' | 'last_admin' };

/**
 * Changes a member's role inside `firmId`. The member is looked up by id *and* firm, so a
 * member of another firm is simply not found. The firm's admin rows are locked for the
 * check, so two concurrent demotions cannot leave a firm without an admin.
 */
export async function changeMemberRole(
  database: Database,
  input: { firmId: string; memberId: string; role: Role; actorUserId: string },
): Promise<ChangeRoleResult> {
  return database.transaction(async (tx) => {
    const admins = await tx
      .select({ id: member.id })
      .from(member)
      .where(and(eq(member.organizationId, input.firmId), eq(member.role, 'admin')))
      .for('update');
    const [target] = await tx
      .select({ id: member.id, role: member.role, userId: member.userId })
      .from(member)
      .where(and(eq(member.id, input.memberId), eq(member.organizationId, input.firmId)))
      .for('update');
    if (!target) return { ok: false, reason: 'not_found' } as const;
    const previous = asRole(target.role);
    if (previous === 'admin' && input.role !== 'admin' && admins.length <= 1) {
      return { ok: false, reason: 'last_admin' } as const;
    }
    const changed = previous !== input.role;
    if (changed) {
      await tx.update(member).set({ role: input.role }).where(eq(member.id, target.id));
      await recordAudit(tx, {
        firmId: input.firmId,
        actorUserId: input.actorUserId,
        action: 'member.role_changed',
        targetType: 'member',
        targetId: target.id,
        details: { userId: target.userId, from: previous, to: input.role },
      });
    }
    const [updated] = (await listMembers(tx, input.firmId)).filter((m) => m.memberId === target.id);
    return { ok: true, member: updated!, changed } as const;
  });
}

/** The outcome of adding a member. */
export type AddMemberResult =
  | { ok: true; member: FirmMember; existingAccount: boolean }
  | { ok: false; reason: 'already_member' };

/** A password hasher (better-auth's, so the account can sign in with it). */
export type HashPassword = (password: string) => Promise<string>;

/**
 * Adds a person to a firm with a role. A new e-mail address gets an account with the
 * temporary password; an existing account keeps its password and only gains the membership.
 */
export async function addMember(
  database: Database,
  hashPassword: HashPassword,
  input: { firmId: string; name: string; email: string; role: Role; temporaryPassword: string; actorUserId: string | null },
): Promise<AddMemberResult> {
  const email = input.email.trim().toLowerCase();
  const passwordHash = await hashPassword(input.temporaryPassword);
  return database.transaction(async (tx) => {
    let [existing] = await tx.select({ id: user.id }).from(user).where(eq(user.email, email));
    const existingAccount = Boolean(existing);
    if (!existing) {
      const userId = randomUUID();
      await tx.insert(user).values({ id: userId, name: input.name.trim(), email, emailVerified: true });
      await tx.insert(account).values({
        id: randomUUID(),
        accountId: userId,
        providerId: 'credential',
        userId,
        password: passwordHash,
      });
      existing = { id: userId };
    } else {
      const [membership] = await tx
        .select({ id: member.id })
        .from(member)
        .where(and(eq(member.organizationId, input.firmId), eq(member.userId, existing.id)));
      if (membership) return { ok: false, reason: 'already_member' } as const;
    }
    const memberId = randomUUID();
    await tx.insert(member).values({ id: memberId, organizationId: input.firmId, userId: existing.id, role: input.role });
    await recordAudit(tx, {
      firmId: input.firmId,
      actorUserId: input.actorUserId,
      action: 'member.added',
      targetType: 'member',
      targetId: memberId,
      details: { userId: existing.id, email, role: input.role, existingAccount },
    });
    const [added] = (await listMembers(tx, input.firmId)).filter((m) => m.memberId === memberId);
    return { ok: true, member: added!, existingAccount } as const;
  });
}


/** Creates a firm (idempotent by slug); returns it. */
export async function ensureFirm(database: Database, input: { name: string; slug: string }): Promise<Firm> {
  const [found] = await database
    .select({ id: organization.id, name: organization.name, slug: organization.slug })
    .from(organization)
    .where(eq(organization.slug, input.slug));
  if (found) return found;
  const id = randomUUID();
  await database.transaction(async (tx) => {
    await tx.insert(organization).values({ id, name: input.name, slug: input.slug });
    await recordAudit(tx, { firmId: id, actorUserId: null, action: 'firm.created', details: { slug: input.slug } });
  });
  return { id, name: input.name, slug: input.slug };
}
