/**
 * Invitations: an admin invites a colleague by e-mail with a role; the link in the message
 * lets them choose a password and join the firm. The link's token is random, works once and
 * expires; only its SHA-256 is stored, so a copy of the database cannot be used to join.
 */
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { and, asc, eq, sql } from 'drizzle-orm';
import type { Database, Queryable } from '../../db/client';
import { account, invitation, member, organization, user } from '../../db/schema';
import { recordAudit } from '../audit';
import { ROLE_LABELS, asRole, type Role } from '../auth/roles';
import { invitationMessage, queueMail } from '../mail';
import type { HashPassword } from './members';

/** How long an invitation link works. */
export const INVITATION_LIFETIME_DAYS = 7;
const LIFETIME_MS = INVITATION_LIFETIME_DAYS * 24 * 60 * 60 * 1000;

/** A token as the link carries it: 32 random bytes, base64url (43 characters). */
const TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;

/** The stored form of a token: its SHA-256, hex. */
export function hashInvitationToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** A pending invitation as the members page and API show it (never the token). */
export interface PendingInvitation {
  invitationId: string;
  email: string;
  role: Role;
  inviterName: string;
  createdAt: Date;
  expiresAt: Date;
  /** The link no longer works; the admin may revoke it and invite again. */
  expired: boolean;
}

/** The firm's pending invitations, newest first, with who sent them and when they expire. */
export async function listInvitations(database: Queryable, firmId: string): Promise<PendingInvitation[]> {
  const rows = await database
    .select({
      invitationId: invitation.id,
      email: invitation.email,
      role: invitation.role,
      inviterName: user.name,
      createdAt: invitation.createdAt,
      expiresAt: invitation.expiresAt,
    })
    .from(invitation)
    .innerJoin(user, eq(user.id, invitation.inviterId))
    .where(and(eq(invitation.organizationId, firmId), eq(invitation.status, 'pending')))
    .orderBy(sql`${invitation.createdAt} desc`, asc(invitation.email));
  const now = Date.now();
  return rows.map((row) => ({ ...row, role: asRole(row.role) ?? 'engineer', expired: row.expiresAt.getTime() <= now }));
}

/** The outcome of sending an invitation. */
export type InviteResult =
  | { ok: true; invitation: PendingInvitation; replaced: number }
  | { ok: false; reason: 'already_member' };

/**
 * Invites `email` into the firm with `role`: refuses a current member, revokes an earlier
 * pending invitation to the same address, stores the new token's hash, and queues the
 * message and the audit record in the same transaction. `baseUrl` is the app's public origin.
 */
export async function inviteMember(
  database: Database,
  input: { firmId: string; inviterUserId: string; email: string; role: Role; baseUrl: string },
): Promise<InviteResult> {
  const email = input.email.trim().toLowerCase();
  const token = randomBytes(32).toString('base64url');
  const acceptUrl = `${input.baseUrl.replace(/\/+$/, '')}/join?token=${token}`;
  return database.transaction(async (tx) => {
    // One invitation at a time per address and firm, so two admins inviting the same
    // colleague at once leave exactly one pending invitation.
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`invitation:${input.firmId}:${email}`}))`);
    const [existing] = await tx
      .select({ id: member.id })
      .from(member)
      .innerJoin(user, eq(user.id, member.userId))
      .where(and(eq(member.organizationId, input.firmId), eq(user.email, email)));
    if (existing) return { ok: false, reason: 'already_member' } as const;

    const replaced = await tx
      .update(invitation)
      .set({ status: 'revoked' })
      .where(and(eq(invitation.organizationId, input.firmId), eq(invitation.email, email), eq(invitation.status, 'pending')))
      .returning({ id: invitation.id });
    for (const old of replaced) {
      await recordAudit(tx, {
        firmId: input.firmId,
        actorUserId: input.inviterUserId,
        action: 'member.invitation_revoked',
        targetType: 'invitation',
        targetId: old.id,
        details: { email, replaced: true },
      });
    }

    const [context] = await tx
      .select({ firmName: organization.name, inviterName: user.name })
      .from(organization)
      .innerJoin(user, eq(user.id, input.inviterUserId))
      .where(eq(organization.id, input.firmId));
    if (!context) throw new Error(`inviteMember: firm ${input.firmId} or inviter ${input.inviterUserId} does not exist`);

    const invitationId = randomUUID();
    const expiresAt = new Date(Date.now() + LIFETIME_MS);
    const [created] = await tx
      .insert(invitation)
      .values({
        id: invitationId,
        organizationId: input.firmId,
        email,
        role: input.role,
        status: 'pending',
        expiresAt,
        inviterId: input.inviterUserId,
        tokenHash: hashInvitationToken(token),
      })
      .returning({ createdAt: invitation.createdAt });
    const message = invitationMessage({
      firmName: context.firmName,
      inviterName: context.inviterName,
      roleLabel: ROLE_LABELS[input.role],
      acceptUrl,
      expiresAt,
    });
    await queueMail(tx, { kind: 'firm.invitation', firmId: input.firmId, to: [email], ...message });
    await recordAudit(tx, {
      firmId: input.firmId,
      actorUserId: input.inviterUserId,
      action: 'member.invited',
      targetType: 'invitation',
      targetId: invitationId,
      details: { email, role: input.role, expiresAt: expiresAt.toISOString() },
    });
    return {
      ok: true,
      replaced: replaced.length,
      invitation: {
        invitationId,
        email,
        role: input.role,
        inviterName: context.inviterName,
        createdAt: created!.createdAt,
        expiresAt,
        expired: false,
      },
    } as const;
  });
}

/** The outcome of revoking an invitation. */
export type RevokeInvitationResult = { ok: true; email: string } | { ok: false; reason: 'not_found' | 'not_pending' };

/** Withdraws a pending invitation of `firmId`; another firm's invitation is not found. */
export async function revokeInvitation(
  database: Database,
  input: { firmId: string; invitationId: string; actorUserId: string },
): Promise<RevokeInvitationResult> {
  return database.transaction(async (tx) => {
    const [found] = await tx
      .select({ id: invitation.id, email: invitation.email, status: invitation.status })
      .from(invitation)
      .where(and(eq(invitation.id, input.invitationId), eq(invitation.organizationId, input.firmId)))
      .for('update');
    if (!found) return { ok: false, reason: 'not_found' } as const;
    if (found.status !== 'pending') return { ok: false, reason: 'not_pending' } as const;
    await tx.update(invitation).set({ status: 'revoked' }).where(eq(invitation.id, found.id));
    await recordAudit(tx, {
      firmId: input.firmId,
      actorUserId: input.actorUserId,
      action: 'member.invitation_revoked',
      targetType: 'invitation',
      targetId: found.id,
      details: { email: found.email },
    });
    return { ok: true, email: found.email } as const;
  });
}

/** Why an invitation link does not work. */
export type InvitationProblem = 'expired' | 'used' | 'revoked' | 'not_found';

/** A working invitation as the join page shows it. */
export interface OpenInvitation {
  invitationId: string;
  firmId: string;
  firmName: string;
  email: string;
  role: Role;
  expiresAt: Date;
  /** The address already has a Sequent account, which cannot join through this link (yet). */
  existingAccount: boolean;
}

/** The outcome of looking up an invitation link. */
export type FindInvitationResult = { ok: true; invitation: OpenInvitation } | { ok: false; reason: InvitationProblem };

function problemOf(row: { status: string; expiresAt: Date }, now: number): InvitationProblem | null {
  if (row.status === 'accepted') return 'used';
  if (row.status !== 'pending') return 'revoked';
  if (row.expiresAt.getTime() <= now) return 'expired';
  return null;
}

/** The pending, unexpired, unused invitation a link's token belongs to, or why there is none. */
export async function findInvitation(database: Queryable, token: string | null | undefined): Promise<FindInvitationResult> {
  if (!token || !TOKEN_PATTERN.test(token)) return { ok: false, reason: 'not_found' };
  const [row] = await database
    .select({
      invitationId: invitation.id,
      firmId: invitation.organizationId,
      firmName: organization.name,
      email: invitation.email,
      role: invitation.role,
      status: invitation.status,
      expiresAt: invitation.expiresAt,
    })
    .from(invitation)
    .innerJoin(organization, eq(organization.id, invitation.organizationId))
    .where(eq(invitation.tokenHash, hashInvitationToken(token)));
  if (!row) return { ok: false, reason: 'not_found' };
  const problem = problemOf(row, Date.now());
  const role = asRole(row.role);
  if (problem || !role) return { ok: false, reason: problem ?? 'revoked' };
  const [known] = await database.select({ id: user.id }).from(user).where(eq(user.email, row.email));
  const { status: _status, ...open } = row;
  return { ok: true, invitation: { ...open, role, existingAccount: Boolean(known) } };
}

/** The outcome of accepting an invitation. */
export type AcceptInvitationResult =
  | { ok: true; userId: string; memberId: string; email: string; firmId: string }
  | { ok: false; reason: InvitationProblem | 'existing_account' };

/**
 * Accepts the invitation of `token`: creates the account (the invited address, verified by
 * the link itself) with a credential password, adds the membership with the invited role,
 * marks the invitation used and records `member.joined`, all in one transaction with the
 * invitation row locked, so a link works exactly once. An address that already has an
 * account is refused: its owner signs in and asks the firm admin to add them.
 */
export async function acceptInvitation(
  database: Database,
  hashPassword: HashPassword,
  input: { token: string; name: string; password: string },
): Promise<AcceptInvitationResult> {
  if (!TOKEN_PATTERN.test(input.token)) return { ok: false, reason: 'not_found' };
  const passwordHash = await hashPassword(input.password);
  return database.transaction(async (tx) => {
    const [row] = await tx
      .select({
        id: invitation.id,
        firmId: invitation.organizationId,
        email: invitation.email,
        role: invitation.role,
        status: invitation.status,
        expiresAt: invitation.expiresAt,
        inviterId: invitation.inviterId,
      })
      .from(invitation)
      .where(eq(invitation.tokenHash, hashInvitationToken(input.token)))
      .for('update');
    if (!row) return { ok: false, reason: 'not_found' } as const;
    const problem = problemOf(row, Date.now());
    const role = asRole(row.role);
    if (problem || !role) return { ok: false, reason: problem ?? 'revoked' } as const;

    const userId = randomUUID();
    // A concurrent sign-up of the same address (another firm's invitation) loses on the
    // unique e-mail index instead of failing with an error.
    const [created] = await tx
      .insert(user)
      .values({ id: userId, name: input.name.trim(), email: row.email, emailVerified: true })
      .onConflictDoNothing()
      .returning({ id: user.id });
    if (!created) return { ok: false, reason: 'existing_account' } as const;
    await tx.insert(account).values({ id: randomUUID(), accountId: userId, providerId: 'credential', userId, password: passwordHash });
    const memberId = randomUUID();
    await tx.insert(member).values({ id: memberId, organizationId: row.firmId, userId, role });
    await tx.update(invitation).set({ status: 'accepted', acceptedAt: new Date() }).where(eq(invitation.id, row.id));
    await recordAudit(tx, {
      firmId: row.firmId,
      actorUserId: userId,
      action: 'member.joined',
      targetType: 'member',
      targetId: memberId,
      details: { userId, email: row.email, role, invitationId: row.id, invitedBy: row.inviterId },
    });
    return { ok: true, userId, memberId, email: row.email, firmId: row.firmId } as const;
  });
}

