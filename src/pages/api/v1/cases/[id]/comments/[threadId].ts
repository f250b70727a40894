import type { APIRoute } from 'astro';
import { db } from '../../../../../../db/client';
import { json, jsonError, parseJsonBody, requireMember } from '../../../../../../lib/http';
import { COMMENT_FAILURES, resolveThread, ResolveCommentSchema } from '../../../../../../lib/review';

/** Resolves (`{resolved: true}`) or reopens a thread: the author and reviewers only. */
export const PATCH: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const body = await parseJsonBody(context.request, ResolveCommentSchema);
  if (!body.ok) return body.response;
  const result = await resolveThread(db(), {
    firmId: caller.firm.firm.id,
    caseId: context.params.id ?? '',
    threadId: context.params.threadId ?? '',
    commenter: { userId: caller.user.id, role: caller.firm.role },
    resolved: body.data.resolved,
  });
  if (!result.ok) {
    const failure = COMMENT_FAILURES[result.reason];
    return jsonError(failure.status, failure.code, failure.message);
  }
  return json(result);
};
