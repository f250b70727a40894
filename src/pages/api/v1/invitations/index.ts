import type { APIRoute } from 'astro';
import { db } from '../../../../db/client';
import { InviteMemberSchema } from '../../../../lib/auth';
import { config } from '../../../../lib/config';
import { INVITATION_FAILURES, inviteMember, listInvitations } from '../../../../lib/firms';
import { json, jsonError, parseJsonBody, requireMember } from '../../../../lib/http';

/** The caller's firm's pending invitations (firm admins only). */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context, { resource: 'invitation', action: 'create' });
  if (caller instanceof Response) return caller;
  return json({ invitations: await listInvitations(db(), caller.firm.firm.id) });
};

/** Invites a colleague by e-mail with a role (firm admins only); the link goes by e-mail only. */
export const POST: APIRoute = async (context) => {
  const caller = requireMember(context, { resource: 'invitation', action: 'create' });
  if (caller instanceof Response) return caller;
  const body = await parseJsonBody(context.request, InviteMemberSchema);
  if (!body.ok) return body.response;
  const result = await inviteMember(db(), {
    ...body.data,
    firmId: caller.firm.firm.id,
    inviterUserId: caller.user.id,
    baseUrl: config().SEQUENT_BASE_URL,
  });
  if (!result.ok) {
    const failure = INVITATION_FAILURES[result.reason];
    return jsonError(failure.status, failure.code, failure.message);
  }
  return json({ invitation: result.invitation, replaced: result.replaced }, 201);
};
