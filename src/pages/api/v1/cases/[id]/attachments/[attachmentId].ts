import type { APIRoute } from 'astro';
import { db } from '../../../../../../db/client';
import { ATTACHMENT_FAILURES, captionAttachment, removeAttachment, UpdateAttachmentSchema } from '../../../../../../lib/attachments';
import { json, jsonError, parseJsonBody, requireMember } from '../../../../../../lib/http';

function failure(reason: keyof typeof ATTACHMENT_FAILURES): Response {
  const f = ATTACHMENT_FAILURES[reason];
  return jsonError(f.status, f.code, f.message);
}

/** Changes a file's caption `{caption}` (the author). A file of a published revision comes back under a new id. */
export const PATCH: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const body = await parseJsonBody(context.request, UpdateAttachmentSchema);
  if (!body.ok) return body.response;
  const result = await captionAttachment(db(), {
    firmId: caller.firm.firm.id,
    caseId: context.params.id ?? '',
    attachmentId: context.params.attachmentId ?? '',
    userId: caller.user.id,
    caption: body.data.caption,
  });
  if (!result.ok) return failure(result.reason);
  return json(result);
};

/** Removes a file from the revision being worked on (the author); a published revision keeps it. */
export const DELETE: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const result = await removeAttachment(db(), {
    firmId: caller.firm.firm.id,
    caseId: context.params.id ?? '',
    attachmentId: context.params.attachmentId ?? '',
    userId: caller.user.id,
  });
  if (!result.ok) return failure(result.reason);
  return json(result);
};
