import type { APIRoute } from 'astro';
import { db } from '../../../../../db/client';
import { getCase } from '../../../../../lib/cases';
import { json, jsonError, parseJsonBody, requireMember } from '../../../../../lib/http';
import { actOnCase, getReviewPanel, ReviewActionSchema } from '../../../../../lib/review';
import { caseNotFound } from '../_shared';

/** The case's review: open round, approvals, who checked the published revision, comments, history. */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const found = await getCase(db(), caller.firm.firm.id, context.params.id ?? '');
  if (!found) return caseNotFound();
  const panel = await getReviewPanel(db(), caller.firm.firm.id, found);
  return json({ state: found.state, latestRevision: found.latestRevision, publishedRevision: found.publishedRevision, ...panel });
};

/**
 * A review action: `submit` (author; `reviewerIds` optional), `return` (reviewer; `reason`
 * holds the comments), `approve` (reviewer), `withdraw` (reviewer or admin; `reason`).
 * Who may do what, and from which state, is decided in one transaction (`actOnCase`): 403
 * for the wrong person, 409 for the wrong state (someone acted first), 422 without a reason.
 */
export const POST: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const body = await parseJsonBody(context.request, ReviewActionSchema);
  if (!body.ok) return body.response;
  const result = await actOnCase(db(), {
    firmId: caller.firm.firm.id,
    caseId: context.params.id ?? '',
    actor: { userId: caller.user.id, role: caller.firm.role },
    action: body.data.action,
    ...(body.data.reason !== undefined ? { reason: body.data.reason } : {}),
    ...(body.data.reviewerIds ? { reviewerIds: body.data.reviewerIds } : {}),
  });
  if (!result.ok) return result.reason === 'not_found' ? caseNotFound() : jsonError(result.status, result.reason, result.message);
  return json(result);
};
