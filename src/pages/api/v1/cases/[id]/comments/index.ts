import type { APIRoute } from 'astro';
import { db } from '../../../../../../db/client';
import { getCase } from '../../../../../../lib/cases';
import { json, jsonError, parseJsonBody, requireMember } from '../../../../../../lib/http';
import { addComment, COMMENT_FAILURES, listComments, NewCommentSchema } from '../../../../../../lib/review';
import { caseNotFound } from '../../_shared';

/** The case's comment threads, oldest first, with replies. */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const found = await getCase(db(), caller.firm.firm.id, context.params.id ?? '');
  if (!found) return caseNotFound();
  const threads = await listComments(db(), caller.firm.firm.id, found.id);
  return json({ threads, open: threads.filter((t) => !t.resolvedAt).length });
};

/** A new thread (on the case, or on block `blockIndex`) or a reply (`threadId`): the author and reviewers only. */
export const POST: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const body = await parseJsonBody(context.request, NewCommentSchema);
  if (!body.ok) return body.response;
  const result = await addComment(db(), {
    firmId: caller.firm.firm.id,
    caseId: context.params.id ?? '',
    commenter: { userId: caller.user.id, role: caller.firm.role },
    comment: body.data,
  });
  if (!result.ok) {
    const failure = COMMENT_FAILURES[result.reason];
    return jsonError(failure.status, failure.code, failure.message);
  }
  return json(result, 201);
};
