import type { APIRoute } from 'astro';
import { db } from '../../../../../db/client';
import { findAttachmentFile } from '../../../../../lib/attachments';
import { errors, jsonError, requireMember } from '../../../../../lib/http';
import { fileStore } from '../../../../../lib/storage';
import { sendFile } from './_send';

/** Downloads a file of the caller's firm (images inline, anything else as an attachment). */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const found = await findAttachmentFile(db(), caller.firm.firm.id, context.params.attachmentId ?? '');
  if (!found) return errors.notFound('That attachment');
  const bytes = await fileStore().get(found.storageKey);
  if (!bytes) return jsonError(410, 'file_missing', `The stored bytes of ${found.fileName} are missing from the file store. Ask an administrator to restore them from backup.`);
  return sendFile(bytes, found.contentType, found.fileName);
};
