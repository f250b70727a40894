import type { APIRoute } from 'astro';
import { db } from '../../../../../db/client';
import { CASE_FAILURES, getCase, saveCase, SaveCaseSchema } from '../../../../../lib/cases';
import { DESIGN_AID_CAUTION } from '../../../../../lib/caution';
import { json, jsonError, parseJsonBody, requireMember } from '../../../../../lib/http';
import { caseNotFound, conflictResponse } from '../_shared';

/** A case of the caller's firm with its latest revision; another firm's case is not found. */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const found = await getCase(db(), caller.firm.firm.id, context.params.id ?? '');
  return found ? json({ case: found, caution: DESIGN_AID_CAUTION }) : caseNotFound();
};

/** Saves the author's draft from `baseRevision`: 409 with the latest revision when stale. */
export const PATCH: APIRoute = async (context) => {
  const caller = requireMember(context, { resource: 'case', action: 'create' });
  if (caller instanceof Response) return caller;
  const body = await parseJsonBody(context.request, SaveCaseSchema);
  if (!body.ok) return body.response;
  const result = await saveCase(db(), {
    firmId: caller.firm.firm.id,
    caseId: context.params.id ?? '',
    userId: caller.user.id,
    baseRevision: body.data.baseRevision,
    ...(body.data.body !== undefined ? { body: body.data.body } : {}),
    ...(body.data.metadata ? { metadata: body.data.metadata } : {}),
  });
  if (!result.ok) {
    if (result.reason === 'conflict') return conflictResponse(result.latest);
    const failure = CASE_FAILURES[result.reason];
    return jsonError(failure.status, failure.code, failure.message);
  }
  return json({ case: result.case, revisionCreated: result.revisionCreated, changedFields: result.changedFields, caution: DESIGN_AID_CAUTION });
};
