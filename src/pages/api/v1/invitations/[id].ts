import type { APIRoute } from 'astro';
import { db } from '../../../../db/client';
import { INVITATION_FAILURES, revokeInvitation } from '../../../../lib/firms';
import { json, jsonError, requireMember } from '../../../../lib/http';

/** Withdraws a pending invitation (firm admins only); another firm's is not found. */
export const DELETE: APIRoute = async (context) => {
  const caller = requireMember(context, { resource: 'invitation', action: 'cancel' });
  if (caller instanceof Response) return caller;
  const result = await revokeInvitation(db(), {
    firmId: caller.firm.firm.id,
    invitationId: context.params.id ?? '',
    actorUserId: caller.user.id,
  });
  if (!result.ok) {
    const failure = INVITATION_FAILURES[result.reason];
    return jsonError(failure.status, failure.code, failure.message);
  }
  return json({ revoked: true, email: result.email });
};
