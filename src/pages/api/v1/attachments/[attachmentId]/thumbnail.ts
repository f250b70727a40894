import type { APIRoute } from 'astro';
import { db } from '../../../../../db/client';
import { findAttachmentFile } from '../../../../../lib/attachments';
import { errors, requireMember } from '../../../../../lib/http';
import { fileStore } from '../../../../../lib/storage';
import { sendFile } from './_send';

/** The 320 px WebP thumbnail of an image of the caller's firm; 404 for files without one. */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const found = await findAttachmentFile(db(), caller.firm.firm.id, context.params.attachmentId ?? '');
  if (!found?.thumbnailKey) return errors.notFound('That thumbnail');
  const bytes = await fileStore().get(found.thumbnailKey);
  if (!bytes) return errors.notFound('That thumbnail');
  const base = found.fileName.replace(/\.[^.]+$/, '');
  return sendFile(bytes, 'image/webp', `${base}-thumbnail.webp`);
};
