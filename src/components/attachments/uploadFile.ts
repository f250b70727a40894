/**
 * Sending one file to `POST /api/v1/cases/:id/attachments` with XMLHttpRequest, for its
 * upload progress (fetch has none). Browser-only.
 */
import type { AttachmentView } from '../../lib/attachments/services';

/** What an upload came to: the created attachment, or the server's message. */
/** What an upload came to: the created attachment (and whether blocks reading it were recalculated), or the server's message. */
export type UploadOutcome = { ok: true; attachment: AttachmentView; recalculated: boolean; revision: number } | { ok: false; message: string };

/** Uploads `file`, reporting progress from 0 to 1; resolves with the outcome, never rejects. */
export function uploadFile(caseId: string, file: File, onProgress: (fraction: number) => void): Promise<UploadOutcome> {
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/v1/cases/${encodeURIComponent(caseId)}/attachments`);
    xhr.responseType = 'json';
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => {
      const body = xhr.response as { attachments?: AttachmentView[]; recalculated?: boolean; revision?: number; error?: { message?: string } } | null;
      if (xhr.status === 201 && body?.attachments?.[0]) resolve({ ok: true, attachment: body.attachments[0], recalculated: body.recalculated === true, revision: body.revision ?? 0 });
      else resolve({ ok: false, message: body?.error?.message ?? `The upload failed (HTTP ${xhr.status}). Try again.` });
    };
    xhr.onerror = () => resolve({ ok: false, message: 'The connection dropped during the upload. Check the network and try again.' });
    const form = new FormData();
    form.append('file', file, file.name);
    xhr.send(form);
  });
}
