import { fileTypeFromBuffer } from 'file-type';
import { ACCEPTED_TYPES, type AcceptedType } from './limits';
import { extensionOf } from './names';

/** What the content of a file turned out to be, or why it is refused. */
export type Detection = { ok: true; type: AcceptedType } | { ok: false; message: string };

const ACCEPTED_LIST = 'JPEG, PNG or WebP images, PDF documents and CSV files';

/** The accepted type a name's extension claims, or undefined. */
function claimedType(name: string): AcceptedType | undefined {
  const ext = extensionOf(name);
  return (Object.keys(ACCEPTED_TYPES) as AcceptedType[]).find((t) => (ACCEPTED_TYPES[t].extensions as readonly string[]).includes(ext));
}

/** Whether the bytes read as UTF-8 text: valid encoding, no NUL, no control characters but tab, CR, LF, FF. */
export function isPlainText(bytes: Uint8Array): boolean {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return false;
  }
  // eslint-disable-next-line no-control-regex
  return !/[\u0000-\u0008\u000b\u000e-\u001f\u007f]/.test(text);
}

/**
 * Decides a file's type from its CONTENT (magic numbers through `file-type`; CSV, which has
 * none, as UTF-8 text without NUL or control bytes), and checks that it is what its name
 * says: a PNG named `.pdf`, or a program named `.png`, is refused. The browser's claimed
 * type is never consulted.
 */
export async function detectFileType(name: string, bytes: Uint8Array): Promise<Detection> {
  const claimed = claimedType(name);
  if (!claimed) return { ok: false, message: `${name} is not a file Sequent keeps: attach ${ACCEPTED_LIST} (by content and name).` };
  const found = await fileTypeFromBuffer(bytes);
  const expected = ACCEPTED_TYPES[claimed].label;
  if (claimed === 'text/csv') {
    if (found) return { ok: false, message: `${name} is not a ${expected}: its content is ${describe(found.mime, found.ext)}.` };
    if (!isPlainText(bytes)) return { ok: false, message: `${name} is not a ${expected}: its content is not UTF-8 text (binary data or another encoding). Save it as CSV UTF-8 and try again.` };
    return { ok: true, type: 'text/csv' };
  }
  if (!found) return { ok: false, message: `${name} is not a ${expected}: its content is not a recognised file format.` };
  if (found.mime !== claimed) return { ok: false, message: `${name} is not a ${expected}: its content is ${describe(found.mime, found.ext)}.` };
  return { ok: true, type: claimed };
}

function describe(mime: string, ext: string): string {
  const known = (ACCEPTED_TYPES as Record<string, { label: string }>)[mime];
  if (known) return `a ${known.label}`;
  return `another kind of file (${ext.toUpperCase()}, ${mime})`;
}
