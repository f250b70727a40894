/**
 * CSV as spreadsheet programs read it (RFC 4180): every cell quoted when it holds a comma,
 * quote, or line break; quotes doubled; CRLF between rows. Cells a spreadsheet would run as
 * a formula (starting with = + - @, tab or carriage return) get a leading apostrophe, so an
 * exported audit trail can never execute anything a user typed into a case or a reason.
 */

/** One cell, guarded and quoted as needed. */
export function csvCell(value: unknown): string {
  let text = value === null || value === undefined ? '' : value instanceof Date ? value.toISOString() : String(value);
  if (/^[=+\-@\t\r]/.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) || /^\s|\s$/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** One row, ending in CRLF. */
export function csvRow(values: readonly unknown[]): string {
  return `${values.map(csvCell).join(',')}\r\n`;
}
