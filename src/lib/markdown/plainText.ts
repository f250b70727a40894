/**
 * The words of a case body without its markup, for full-text search: headings,
 * paragraphs, list items and table cells as plain lines. Fenced code (the calculation
 * blocks among it) and math are left out: they are not words a colleague searches for.
 * Pure; never throws.
 */
import type { Nodes, Root } from 'mdast';
import remarkGfm from 'remark-gfm';
import remarkMath from 'remark-math';
import remarkParse from 'remark-parse';
import { unified } from 'unified';

const parser = unified().use(remarkParse).use(remarkGfm).use(remarkMath).freeze();

/** Nodes whose content is not prose. */
const SKIPPED = new Set(['code', 'math', 'inlineMath', 'html', 'definition', 'footnoteDefinition', 'image', 'imageReference']);
/** Nodes that end a line of text. */
const BLOCKS = new Set(['heading', 'paragraph', 'tableCell', 'listItem', 'blockquote', 'thematicBreak']);

function collect(node: Nodes, out: string[]): void {
  if (SKIPPED.has(node.type)) return;
  if ('value' in node && typeof node.value === 'string') {
    out.push(node.value);
    return;
  }
  if ('children' in node) for (const child of node.children) collect(child as Nodes, out);
  if (BLOCKS.has(node.type)) out.push('\n');
  else if (node.type === 'break') out.push(' ');
}

/** The plain text of `markdown`: one line per block of prose, spaces tidied. */
export function plainText(markdown: string): string {
  let tree: Root;
  try {
    tree = parser.parse(markdown);
  } catch {
    return markdown;
  }
  const parts: string[] = [];
  collect(tree, parts);
  return parts
    .join('')
    .split('\n')
    .map((line) => line.replace(/\s+/g, ' ').trim())
    .filter(Boolean)
    .join('\n');
}
