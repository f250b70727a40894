import type { APIRoute } from 'astro';
import { db } from '../../../../../../db/client';
import {
  addAttachments,
  ATTACHMENT_FAILURES,
  canChangeAttachments,
  CaptionSchema,
  checkUpload,
  formatBytes,
  listAttachments,
  ListAttachmentsQuery,
  MAX_FILE_BYTES,
  MAX_FILES_PER_REQUEST,
  MAX_REQUEST_BYTES,
  type CheckedFile,
  type RefusedFile,
} from '../../../../../../lib/attachments';
import { json, jsonError, readMultipart, requireMember } from '../../../../../../lib/http';
import { fileStore } from '../../../../../../lib/storage';
import { caseNotFound, parseQuery } from '../../_shared';

/** The files of the case seen by `?revision=` (default: the revision being worked on). */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const query = parseQuery(context.url, ListAttachmentsQuery);
  if (!query.ok) return query.response;
  const listed = await listAttachments(db(), caller.firm.firm.id, context.params.id ?? '', query.data.revision);
  if (!listed) return caseNotFound();
  return json(listed);
};

function failure(reason: keyof typeof ATTACHMENT_FAILURES): Response {
  const f = ATTACHMENT_FAILURES[reason];
  return jsonError(f.status, f.code, f.message);
}

/**
 * Attaches one or more files (`file` fields of a multipart form, optional `caption`): the
 * author only. All or nothing: if any file is refused, none is added, and the answer lists
 * each refused file with why (413 too large, 415 not what it claims, 422 empty or damaged).
 */
export const POST: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const firmId = caller.firm.firm.id;
  const caseId = context.params.id ?? '';
  // Who may, before reading a byte of the body.
  const allowed = await canChangeAttachments(db(), firmId, caseId, caller.user.id);
  if (!allowed.ok) return failure(allowed.reason);
  const body = await readMultipart(
    context.request,
    MAX_REQUEST_BYTES,
    `The upload is larger than ${formatBytes(MAX_REQUEST_BYTES)}. Files may be at most ${formatBytes(MAX_FILE_BYTES)} each; send large files one at a time.`,
  );
  if (!body.ok) return body.response;
  const files = body.form.getAll('file').filter((v): v is File => typeof v !== 'string');
  if (files.length === 0) return jsonError(422, 'no_file', 'Choose a file to attach (a `file` field of the form).', [{ path: 'file', message: 'Choose a file.' }]);
  if (files.length > MAX_FILES_PER_REQUEST) return jsonError(422, 'too_many_in_request', `Send at most ${MAX_FILES_PER_REQUEST} files at once.`);
  const caption = CaptionSchema.safeParse(body.form.get('caption') ?? '');
  if (!caption.success) return jsonError(422, 'invalid_input', caption.error.issues[0]!.message, [{ path: 'caption', message: caption.error.issues[0]!.message }]);

  const checked: CheckedFile[] = [];
  const refused: RefusedFile[] = [];
  for (const file of files) {
    const bytes = new Uint8Array(await file.arrayBuffer());
    const outcome = await checkUpload(file.name, bytes);
    if (outcome.ok) checked.push(outcome.file);
    else refused.push(outcome.refused);
  }
  if (refused.length > 0) {
    // Mixed refusals answer with the first file's status; every file is named in `issues`.
    const status = refused[0]!.status;
    const code = status === 413 ? 'file_too_large' : status === 415 ? 'unsupported_file_type' : 'invalid_file';
    const message = refused.map((r) => r.message).join(' ') + (checked.length ? ' Nothing was attached; send the other files again without it.' : '');
    return jsonError(status, code, message, refused.map((r) => ({ path: r.fileName, message: r.message })));
  }
  const added = await addAttachments(db(), fileStore(), { firmId, caseId, userId: caller.user.id, files: checked, caption: caption.data });
  if (!added.ok) return failure(added.reason);
  return json(added, 201);
};
