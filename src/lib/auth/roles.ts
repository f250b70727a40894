/**
 * Roles inside a firm and what each may do. Pure: shared by pages, API routes and tests.
 *
 * - engineer: writes cases and submits them for review;
 * - reviewer: a senior engineer who checks, returns, approves or withdraws cases (and writes cases too);
 * - admin: manages the firm's people and roles and withdraws cases (and writes cases too).
 */
import { createAccessControl } from 'better-auth/plugins/access';
import { z } from 'zod';

export const ROLES = ['engineer', 'reviewer', 'admin'] as const;

/** A role inside a firm. */
export const RoleSchema = z.enum(ROLES, { message: 'role must be one of engineer, reviewer, admin' });
export type Role = z.output<typeof RoleSchema>;

/** Human labels for roles, as shown in the product. */
export const ROLE_LABELS: Record<Role, string> = {
  engineer: 'Engineer',
  reviewer: 'Reviewer',
  admin: 'Firm admin',
};

/** Everything that can be permitted, by resource. */
export const statements = {
  case: ['create', 'review', 'withdraw'],
  member: ['read', 'create', 'update'],
  /** The firm's audit trail: view and export. */
  audit: ['read'],
  /** Re-checking the firm's published library against today's solver. */
  drift: ['run'],
  // The organization plugin's own resources: nobody gets them, our routes do this work.
  organization: ['update', 'delete'],
  invitation: ['create', 'cancel'],
} as const;

type Statements = typeof statements;
type Resource = keyof Statements;
type Action<R extends Resource> = Statements[R][number];

/** Access control for better-auth's organization plugin; the single table of permissions. */
export const accessControl = createAccessControl(statements);

/** Each role's permissions, as better-auth roles. */
export const authRoles = {
  engineer: accessControl.newRole({ case: ['create'], member: ['read'] }),
  reviewer: accessControl.newRole({ case: ['create', 'review', 'withdraw'], member: ['read'] }),
  admin: accessControl.newRole({
    case: ['create', 'withdraw'],
    member: ['read', 'create', 'update'],
    invitation: ['create', 'cancel'],
    audit: ['read'],
    drift: ['run'],
  }),
} satisfies Record<Role, unknown>;

/** True when `role` may perform `action` on `resource`. */
export function can<R extends Resource>(role: Role | null | undefined, resource: R, action: Action<R>): boolean {
  if (!role) return false;
  const granted = authRoles[role].statements as { [K in Resource]?: readonly string[] };
  const allowed = granted[resource];
  return allowed?.includes(action) ?? false;
}

/** Narrows an arbitrary stored string to a role, or null. */
export function asRole(value: unknown): Role | null {
  const parsed = RoleSchema.safeParse(value);
  return parsed.success ? parsed.data : null;
}
