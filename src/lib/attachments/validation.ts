import { z } from 'zod';
import { MAX_CAPTION_LENGTH } from './limits';

/** A caption: trimmed, at most {@link MAX_CAPTION_LENGTH} characters, may be empty. */
export const CaptionSchema = z
  .string()
  .transform((s) => s.normalize('NFC').replace(/[\u0000-\u0008\u000b-\u001f\u007f]/g, '').trim())
  .pipe(z.string().max(MAX_CAPTION_LENGTH, `A caption is at most ${MAX_CAPTION_LENGTH} characters.`));

/** `PATCH …/attachments/:id`: the new caption. */
export const UpdateAttachmentSchema = z.object({ caption: CaptionSchema }).strict();

/** `GET …/attachments?revision=`: the revision whose files to list (default: the one being worked on). */
export const ListAttachmentsQuery = z.object({
  revision: z.coerce.number().int('revision must be a whole number').min(1, 'revision starts at 1').optional(),
});
