import type { APIRoute } from 'astro';
import { db } from '../../../../db/client';
import { AddMemberSchema, hashPassword } from '../../../../lib/auth';
import { MEMBER_FAILURES, addMember, listMembers } from '../../../../lib/firms';
import { json, jsonError, parseJsonBody, requireMember } from '../../../../lib/http';

/** The members of the caller's firm. */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context, { resource: 'member', action: 'read' });
  if (caller instanceof Response) return caller;
  return json({ members: await listMembers(db(), caller.firm.firm.id) });
};

/** Adds a colleague with a temporary password (firm admins only). */
export const POST: APIRoute = async (context) => {
  const caller = requireMember(context, { resource: 'member', action: 'create' });
  if (caller instanceof Response) return caller;
  const body = await parseJsonBody(context.request, AddMemberSchema);
  if (!body.ok) return body.response;
  const result = await addMember(db(), hashPassword, { ...body.data, firmId: caller.firm.firm.id, actorUserId: caller.user.id });
  if (!result.ok) {
    const failure = MEMBER_FAILURES[result.reason];
    return jsonError(failure.status, failure.code, failure.message);
  }
  return json({ member: result.member, existingAccount: result.existingAccount }, 201);
};
