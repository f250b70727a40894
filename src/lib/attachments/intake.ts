import { detectFileType } from './detect';
import { formatBytes, isImageType, MAX_FILE_BYTES } from './limits';
import { sanitiseFileName } from './names';
import type { CheckedFile } from './services';
import { makeThumbnail } from './thumbnail';

/** A file refused at intake: the HTTP status that fits and a message naming the file. */
export interface RefusedFile {
  fileName: string;
  status: 413 | 415 | 422;
  message: string;
}

/**
 * Checks one uploaded file: sanitises the name, refuses empty and oversize files, decides
 * the type from the content ({@link detectFileType}) and makes a thumbnail of an image
 * (an image that does not decode is refused).
 */
export async function checkUpload(rawName: string, bytes: Uint8Array): Promise<{ ok: true; file: CheckedFile } | { ok: false; refused: RefusedFile }> {
  const fileName = sanitiseFileName(rawName);
  const refuse = (status: RefusedFile['status'], message: string) => ({ ok: false as const, refused: { fileName, status, message } });
  if (bytes.byteLength === 0) return refuse(422, `${fileName} is empty (0 bytes): choose the file again.`);
  if (bytes.byteLength > MAX_FILE_BYTES)
    return refuse(413, `${fileName} is ${formatBytes(bytes.byteLength)}: files may be at most ${formatBytes(MAX_FILE_BYTES)}. Reduce it (a smaller photo, a split PDF) and try again.`);
  const detected = await detectFileType(fileName, bytes);
  if (!detected.ok) return refuse(415, detected.message);
  let thumbnail: Uint8Array | null = null;
  if (isImageType(detected.type)) {
    thumbnail = await makeThumbnail(bytes);
    if (!thumbnail) return refuse(422, `${fileName} looks like an image but cannot be decoded (damaged or cut short).`);
  }
  return { ok: true, file: { fileName, contentType: detected.type, bytes, thumbnail } };
}
