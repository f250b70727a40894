import { MAX_NAME_LENGTH } from './limits';

// C0 and C1 controls, DEL, and the bidirectional overrides that can make "gpj.exe" read as "exe.jpg".
// eslint-disable-next-line no-control-regex
const UNSAFE = /[\u0000-\u001f\u007f-\u009f\u200e\u200f\u202a-\u202e\u2066-\u2069\ufeff]/g;

/**
 * A file name fit to store and show: unicode-normalised (NFC), only the last path segment
 * (either separator), no control or direction characters, no leading dots or spaces, no
 * trailing dots or spaces, runs of spaces collapsed, at most {@link MAX_NAME_LENGTH}
 * characters with the extension kept; "attachment" when nothing is left. Pure.
 */
export function sanitiseFileName(raw: string): string {
  let name = raw.normalize('NFC').replace(UNSAFE, '');
  name = name.split(/[/\\]/).pop() ?? '';
  name = name.replace(/\s+/g, ' ').replace(/^[\s.]+/, '').replace(/[\s.]+$/, '');
  if (!name) return 'attachment';
  const chars = Array.from(name);
  if (chars.length <= MAX_NAME_LENGTH) return name;
  const dot = name.lastIndexOf('.');
  const ext = dot > 0 ? Array.from(name.slice(dot)) : [];
  const keep = ext.length > 0 && ext.length <= 10 ? ext : [];
  return chars.slice(0, MAX_NAME_LENGTH - keep.length).join('').trimEnd() + keep.join('');
}

/** The extension of a name, lower case, without the dot ("" for none). */
export function extensionOf(name: string): string {
  const dot = name.lastIndexOf('.');
  return dot > 0 ? name.slice(dot + 1).toLowerCase() : '';
}

/**
 * The `content-disposition` value for a download: `inline` or `attachment`, an ASCII
 * fallback `filename` and the exact name as RFC 5987 `filename*=UTF-8''…`.
 */
export function contentDisposition(name: string, inline: boolean): string {
  const ascii = name.normalize('NFD').replace(/[\u0300-\u036f]/g, '').replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
  const encoded = encodeURIComponent(name).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `${inline ? 'inline' : 'attachment'}; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}
