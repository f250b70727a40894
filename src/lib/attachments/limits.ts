/**
 * The limits of attachments, in one place (pure: the editor island imports it too).
 */

/** The largest file accepted: 25 MB. */
export const MAX_FILE_BYTES = 25 * 1024 * 1024;
/** Files a case may carry at once (removed ones do not count). */
export const MAX_FILES_PER_CASE = 50;
/** Files in one upload request. */
export const MAX_FILES_PER_REQUEST = 10;
/** The largest upload request read: two full-size files and the multipart framing. */
export const MAX_REQUEST_BYTES = 2 * MAX_FILE_BYTES + 1024 * 1024;
/** The longest stored file name, in characters (the extension is kept). */
export const MAX_NAME_LENGTH = 120;
/** The longest caption, in characters. */
export const MAX_CAPTION_LENGTH = 500;
/** The width of image thumbnails, in pixels (WebP). */
export const THUMBNAIL_WIDTH = 320;

/** The kinds of file accepted, by their content type, with the words the messages use. */
export const ACCEPTED_TYPES = {
  'image/jpeg': { label: 'JPEG image', extensions: ['jpg', 'jpeg'] },
  'image/png': { label: 'PNG image', extensions: ['png'] },
  'image/webp': { label: 'WebP image', extensions: ['webp'] },
  'application/pdf': { label: 'PDF document', extensions: ['pdf'] },
  'text/csv': { label: 'CSV file', extensions: ['csv'] },
} as const;

/** A content type Sequent accepts. */
export type AcceptedType = keyof typeof ACCEPTED_TYPES;

/** The `accept` attribute of the file picker (a hint only: the server checks content). */
export const ACCEPT_ATTRIBUTE = '.jpg,.jpeg,.png,.webp,.pdf,.csv,image/jpeg,image/png,image/webp,application/pdf,text/csv';

/** Whether the type is shown as an image (inline, with a thumbnail). */
export function isImageType(type: string): boolean {
  return type === 'image/jpeg' || type === 'image/png' || type === 'image/webp';
}

/** 1536 → "1.5 KB"; 26214400 → "25 MB". */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${trim(bytes / 1024)} KB`;
  return `${trim(bytes / (1024 * 1024))} MB`;
}

function trim(x: number): string {
  return x >= 10 ? String(Math.round(x)) : String(Math.round(x * 10) / 10);
}
