import { and, asc, eq } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import { member, organization } from '../../db/schema';
import { asRole, type Role } from '../auth/roles';

/** A firm as pages show it. */
export interface Firm {
  id: string;
  name: string;
  slug: string;
}

/** The firm a request acts in, with the signed-in person's membership there. */
export interface FirmContext {
  firm: Firm;
  memberId: string;
  role: Role;
}

/**
 * The firm a signed-in user acts in: the session's active firm if they are still a member
 * there, otherwise their oldest membership. Null when they belong to no firm.
 */
export async function resolveFirm(
  database: Queryable,
  userId: string,
  activeFirmId: string | null | undefined,
): Promise<FirmContext | null> {
  const rows = await database
    .select({
      id: organization.id,
      name: organization.name,
      slug: organization.slug,
      memberId: member.id,
      role: member.role,
    })
    .from(member)
    .innerJoin(organization, eq(organization.id, member.organizationId))
    .where(activeFirmId ? and(eq(member.userId, userId), eq(member.organizationId, activeFirmId)) : eq(member.userId, userId))
    .orderBy(asc(member.createdAt))
    .limit(1);
  const row = rows[0];
  if (!row) return activeFirmId ? resolveFirm(database, userId, null) : null;
  const role = asRole(row.role);
  if (!role) return null;
  return { firm: { id: row.id, name: row.name, slug: row.slug }, memberId: row.memberId, role };
}
