import { jsonError } from './responses';

/** The outcome of reading a bounded body. */
export type LimitedBody = { ok: true; form: FormData } | { ok: false; response: Response };

/**
 * Reads a multipart/form-data body of at most `limit` bytes without buffering more: a
 * declared `content-length` over the limit is refused before reading, and a body that
 * grows past it (chunked, or lying) is cut off at the limit. 415 for another content
 * type, 413 with `message` for too large, 400 for a body that is not valid multipart.
 */
export async function readMultipart(request: Request, limit: number, tooLarge: string): Promise<LimitedBody> {
  const type = request.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data;/i.test(type))
    return { ok: false, response: jsonError(415, 'unsupported_media_type', 'Send the files as multipart/form-data, one or more `file` fields.') };
  const declared = Number(request.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > limit) return { ok: false, response: jsonError(413, 'too_large', tooLarge) };
  const chunks: Uint8Array[] = [];
  let total = 0;
  if (request.body) {
    const reader = request.body.getReader();
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      total += value.byteLength;
      if (total > limit) {
        await reader.cancel().catch(() => undefined);
        return { ok: false, response: jsonError(413, 'too_large', tooLarge) };
      }
      chunks.push(value);
    }
  }
  try {
    const form = await new Response(Buffer.concat(chunks), { headers: { 'content-type': type } }).formData();
    return { ok: true, form };
  } catch {
    return { ok: false, response: jsonError(400, 'bad_multipart', 'The upload could not be read as multipart/form-data. Try again.') };
  }
}
