/**
 * Sending a stored file (a leading underscore keeps Astro from routing this file): the
 * headers that keep a file from running as a page in Sequent's origin.
 */
import { contentDisposition, isImageType } from '../../../../../lib/attachments';

/** The download response: the detected type, exact length, no sniffing, a sandbox, private caching. */
export function sendFile(bytes: Buffer, type: string, name: string): Response {
  const inline = isImageType(type);
  return new Response(new Uint8Array(bytes), {
    status: 200,
    headers: {
      'content-type': type === 'text/csv' ? 'text/csv; charset=utf-8' : type,
      'content-length': String(bytes.byteLength),
      'content-disposition': contentDisposition(name, inline),
      'x-content-type-options': 'nosniff',
      'content-security-policy': "default-src 'none'; sandbox",
      'cache-control': 'private, max-age=3600',
      'cross-origin-resource-policy': 'same-origin',
    },
  });
}
