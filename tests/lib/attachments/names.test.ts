import { describe, expect, it } from 'vitest';
import { contentDisposition, detectFileType, formatBytes, isPlainText, sanitiseFileName } from '../../../src/lib/attachments';

describe('sanitiseFileName', () => {
  it.each([
    ['../../etc/passwd.csv', 'passwd.csv'],
    ['..\\x.png', 'x.png'],
    ['C:\\Users\\me\\photo.jpg', 'photo.jpg'],
    ['a\u0000b\u001fc\u007f\u009f.pdf', 'abc.pdf'],
    ['...hidden.csv', 'hidden.csv'],
    ['  spaced   out  .csv  ', 'spaced out .csv'],
    ['trailing.csv...', 'trailing.csv'],
    ['e\u0301.png', '\u00e9.png'],
    ['rtl\u202egnp.csv', 'rtlgnp.csv'],
    ['../', 'attachment'],
    ['', 'attachment'],
  ])('%j → %j', (raw, expected) => {
    expect(sanitiseFileName(raw)).toBe(expected);
  });

  it('caps the length and keeps the extension', () => {
    const name = sanitiseFileName(`${'é'.repeat(400)}.jpeg`);
    expect(Array.from(name)).toHaveLength(120);
    expect(name.endsWith('.jpeg')).toBe(true);
  });
});

describe('contentDisposition', () => {
  it('gives an ASCII fallback and the exact name in RFC 5987 form', () => {
    expect(contentDisposition('Café "x".pdf', false)).toBe(`attachment; filename="Cafe _x_.pdf"; filename*=UTF-8''Caf%C3%A9%20%22x%22.pdf`);
    expect(contentDisposition("it's (1).png", true)).toBe(`inline; filename="it's (1).png"; filename*=UTF-8''it%27s%20%281%29.png`);
  });
});

describe('detectFileType and isPlainText', () => {
  it('accepts UTF-8 text as CSV and refuses NUL, control bytes and bad encodings', async () => {
    expect(isPlainText(Buffer.from('a;b\r\n1\t2\n'))).toBe(true);
    expect(isPlainText(Buffer.from([0x61, 0x00]))).toBe(false);
    expect(isPlainText(Buffer.from([0x61, 0x1b]))).toBe(false);
    expect(isPlainText(Buffer.from([0xff, 0xfe]))).toBe(false);
    expect(await detectFileType('a.csv', Buffer.from('x,y\n1,2\n'))).toEqual({ ok: true, type: 'text/csv' });
    expect(await detectFileType('a.pdf', Buffer.from('%PDF-1.7\n'))).toEqual({ ok: true, type: 'application/pdf' });
    expect(await detectFileType('a.PDF', Buffer.from('x,y\n'))).toMatchObject({ ok: false, message: expect.stringMatching(/a\.PDF is not a PDF document/) });
    expect(await detectFileType('a', Buffer.from('x'))).toMatchObject({ ok: false });
  });
});

describe('formatBytes', () => {
  it.each([
    [512, '512 B'],
    [1536, '1.5 KB'],
    [25 * 1024 * 1024, '25 MB'],
    [26 * 1024 * 1024 + 1, '26 MB'],
  ])('%d → %s', (n, s) => expect(formatBytes(n)).toBe(s));
});
