/**
 * The words of a case body without its markup, for full-text search: one line per line of
 * prose. Fenced code (the calculation blocks among it), math, images, raw HTML and link
 * targets are left out; link texts, emphasis and table cells keep their words.
 *
 * A line scanner and a few regular expressions rather than the remark pipeline: a reindex
 * runs this over every published case, and parsing to a syntax tree costs about 2 ms per
 * case against some 0.05 ms here. It only has to find words, not render. Pure; never throws.
 */

const FENCE = /^ {0,3}(`{3,}|~{3,})/;

/** Inline markup → its words (order matters: images before links, code before emphasis). */
const INLINE: ReadonlyArray<readonly [RegExp, string]> = [
  [/\\\$/g, '\u0000'], // an escaped dollar is text, not math
  [/\$[^$\n]+\$/g, ' '], // inline math
  [/\u0000/g, '$'],
  [/!\[[^\]]*\]\([^)]*\)/g, ' '], // images
  [/!\[[^\]]*\]\[[^\]]*\]/g, ' '],
  [/\[([^\]]*)\]\([^)]*\)/g, '$1'], // links keep their text
  [/\[([^\]]*)\]\[[^\]]*\]/g, '$1'],
  [/<https?:[^>]*>/g, ' '], // autolinks
  [/<\/?[A-Za-z][^>]*>/g, ' '], // raw HTML tags
  [/`+([^`]*)`+/g, '$1'], // inline code keeps its words
  [/(\*{1,3}|_{1,3}|~~)(?=\S)([^*_~\n]*?\S)\1/g, '$2'], // emphasis, strong, strikethrough
  [/\[\^[^\]]*\]/g, ' '], // footnote references
  [/\\([\\`*_{}[\]()#+\-.!|>~$])/g, '$1'], // backslash escapes
];

/** Block-level markers at the start of a line (headings, quotes, list items, table pipes). */
function stripLine(line: string): string {
  let text = line
    .replace(/^ {0,3}>\s?/, '')
    .replace(/^ {0,3}#{1,6}\s+/, '')
    .replace(/\s#+\s*$/, '')
    .replace(/^\s*(?:[-*+]|\d{1,9}[.)])\s+(?:\[[ xX]\]\s+)?/, '');
  if (/^\s*\|?\s*:?-{3,}:?\s*(\|\s*:?-{3,}:?\s*)*\|?\s*$/.test(text)) return ''; // table separator
  if (/^\s*([-*_])(\s*\1){2,}\s*$/.test(text)) return ''; // thematic break
  if (/^\s*\[[^\]]+\]:\s/.test(text)) return ''; // link reference definition
  if (text.includes('|')) text = text.replace(/\|/g, ' ');
  for (const [pattern, replacement] of INLINE) text = text.replace(pattern, replacement);
  return text.replace(/\s+/g, ' ').trim();
}

/** The plain text of `markdown`; see the module comment. */
export function plainText(markdown: string): string {
  const out: string[] = [];
  let fence: string | null = null;
  let inMath = false;
  for (const line of markdown.split(/\r?\n/)) {
    if (fence !== null) {
      const close = FENCE.exec(line);
      if (close && close[1]![0] === fence[0] && close[1]!.length >= fence.length && line.trim() === close[1]) fence = null;
      continue;
    }
    const open = FENCE.exec(line);
    if (open) {
      fence = open[1]!;
      continue;
    }
    const trimmed = line.trim();
    if (inMath) {
      if (trimmed.endsWith('$$')) inMath = false;
      continue;
    }
    if (trimmed.startsWith('$$')) {
      // A display-math block; one line when it also ends on this line.
      if (!(trimmed.length > 2 && trimmed.endsWith('$$'))) inMath = true;
      continue;
    }
    if (/^ {4,}\S/.test(line) && out.length > 0 && out[out.length - 1] === '') continue; // indented code
    const text = stripLine(line);
    if (text || out[out.length - 1] !== '') out.push(text);
  }
  return out.filter(Boolean).join('\n');
}
