import type { APIContext } from 'astro';
import { can, type Role } from '../auth/roles';
import type { FirmContext } from '../firms';
import { errors } from './responses';

type Resource = Parameters<typeof can>[1];

/** What a route handler gets once the caller is known to be a member of a firm. */
export interface MemberContext {
  user: NonNullable<App.Locals['user']>;
  firm: FirmContext;
}

/**
 * The session and firm checks every API route starts with: 401 without a session, 403
 * without a firm, 403 when the role lacks the permission. Returns the context or a Response.
 */
export function requireMember<R extends Resource>(
  context: Pick<APIContext, 'locals'>,
  permission?: { resource: R; action: Parameters<typeof can<R>>[2] },
): MemberContext | Response {
  const { user, firm } = context.locals;
  if (!user) return errors.unauthenticated();
  if (!firm) return errors.noFirm();
  if (permission && !can(firm.role as Role, permission.resource, permission.action)) return errors.forbidden();
  return { user, firm };
}
