import type { APIRoute } from 'astro';
import { db } from '../../../../db/client';
import { ChangeRoleSchema } from '../../../../lib/auth';
import { MEMBER_FAILURES, changeMemberRole, listMembers } from '../../../../lib/firms';
import { errors, json, jsonError, parseJsonBody, requireMember } from '../../../../lib/http';

/** One member of the caller's firm; a member of another firm is not found. */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context, { resource: 'member', action: 'read' });
  if (caller instanceof Response) return caller;
  const found = (await listMembers(db(), caller.firm.firm.id)).find((m) => m.memberId === context.params.memberId);
  return found ? json({ member: found }) : errors.notFound('That member');
};

/** Changes a member's role (firm admins only; the last admin stays an admin). */
export const PATCH: APIRoute = async (context) => {
  const caller = requireMember(context, { resource: 'member', action: 'update' });
  if (caller instanceof Response) return caller;
  const body = await parseJsonBody(context.request, ChangeRoleSchema);
  if (!body.ok) return body.response;
  const result = await changeMemberRole(db(), {
    firmId: caller.firm.firm.id,
    memberId: context.params.memberId ?? '',
    role: body.data.role,
    actorUserId: caller.user.id,
  });
  if (!result.ok) {
    const failure = MEMBER_FAILURES[result.reason];
    return jsonError(failure.status, failure.code, failure.message);
  }
  return json({ member: result.member, changed: result.changed });
};
