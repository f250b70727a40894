import { and, asc, eq, sql } from 'drizzle-orm';
import { prepared, type Database } from '../../db/client';
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

function build(database: Database, withActiveFirm: boolean) {
  const userId = eq(member.userId, sql.placeholder('userId'));
  return database
    .select({
      id: organization.id,
      name: organization.name,
      slug: organization.slug,
      memberId: member.id,
      role: member.role,
    })
    .from(member)
    .innerJoin(organization, eq(organization.id, member.organizationId))
    .where(withActiveFirm ? and(userId, eq(member.organizationId, sql.placeholder('firmId'))) : userId)
    .orderBy(asc(member.createdAt))
    .limit(1)
    .prepare(withActiveFirm ? 'resolve_active_firm' : 'resolve_first_firm');
}

// Every request runs this: prepared once per client, planned once per connection.
const activeFirmQuery = prepared((database) => build(database, true));
const firstFirmQuery = prepared((database) => build(database, false));

/**
 * The firm a signed-in user acts in: the session's active firm if they are still a member
 * there, otherwise their oldest membership. Null when they belong to no firm. Read on
 * every request, so a removal or a role change takes effect at once.
 */
export async function resolveFirm(database: Database, userId: string, activeFirmId: string | null | undefined): Promise<FirmContext | null> {
  const rows = activeFirmId ? await activeFirmQuery(database).execute({ userId, firmId: activeFirmId }) : await firstFirmQuery(database).execute({ userId });
  const row = rows[0];
  if (!row) return activeFirmId ? resolveFirm(database, userId, null) : null;
  const role = asRole(row.role);
  if (!role) return null;
  return { firm: { id: row.id, name: row.name, slug: row.slug }, memberId: row.memberId, role };
}
