/**
 * The one markdown pipeline of case bodies, shared by the reading page (server) and the
 * editor preview (browser):
 *
 *   remark-parse → remark-gfm → remark-math → remark-rehype (raw HTML dropped)
 *   → rehype-sanitize (CASE_SANITIZE_SCHEMA) → KaTeX (`renderMath`, trust off)
 *   → heading ids → split at calculation blocks → hast-util-to-html per segment.
 *
 * KaTeX runs after sanitising because its output is trusted markup (inline styles, MathML)
 * that the schema would strip; with `trust: false` it never emits links, ids, classes or
 * styles taken from the input. Never throws.
 */
import type { Root } from 'hast';
import { toHtml } from 'hast-util-to-html';
import rehypeSanitize from 'rehype-sanitize';
import remarkGfm from 'remark-gfm';
import remarkMath from 'remark-math';
import remarkParse from 'remark-parse';
import remarkRehype from 'remark-rehype';
import { unified } from 'unified';
import { evaluateCase, NO_FILES, type BlockFiles, type CaseEvaluation } from '../calc';
import { escapeHtml } from './escapeHtml';
import { addHeadingIds } from './headingIds';
import { renderMath } from './renderMath';
import { CASE_SANITIZE_SCHEMA } from './sanitizeSchema';
import { splitSegments, type CaseSegment } from './splitSegments';

/** A case body ready for a page: HTML segments with a block placeholder at each block. */
export interface RenderedCase {
  readonly segments: readonly CaseSegment[];
  readonly evaluation: CaseEvaluation;
}

const toHast = unified()
  .use(remarkParse)
  .use(remarkGfm)
  .use(remarkMath)
  .use(remarkRehype, { allowDangerousHtml: false })
  .use(rehypeSanitize, CASE_SANITIZE_SCHEMA)
  .freeze();

/** Serialisation: `raw` nodes are KaTeX's output only (the sanitiser removed all others). */
const HTML_OPTIONS = { allowDangerousHtml: true } as const;

/** The sanitised, math-rendered tree of `markdown`; null only if a plugin failed. */
function hastOf(markdown: string): Root | null {
  try {
    const tree = toHast.runSync(toHast.parse(markdown)) as Root;
    renderMath(tree);
    addHeadingIds(tree);
    return tree;
  } catch {
    return null;
  }
}

/** What is shown if the pipeline ever fails: the text itself, escaped, never raw. */
const fallbackHtml = (markdown: string) => `<pre class="whitespace-pre-wrap">${escapeHtml(markdown)}</pre>`;

/**
 * Renders a case body: HTML segments split at the calculation blocks, and the evaluation of
 * every block (`segments` of type `block` carry `BlockResult.index`). Never throws.
 *
 * @example
 * const { segments, evaluation } = renderCase(body);
 * segments.map((s) => (s.type === 'html' ? s.html : evaluation.blocks[s.index]));
 *
 * `files` are the attached files the blocks may read (see `evaluateCase`).
 */
export function renderCase(markdown: string, files: BlockFiles = NO_FILES): RenderedCase {
  const text = typeof markdown === 'string' ? markdown : '';
  const evaluation = evaluateCase(text, files);
  const blocks = evaluation.blocks.map((b) => ({ index: b.index, line: b.line }));
  const tree = hastOf(text);
  if (!tree) {
    const html: CaseSegment[] = text.trim() ? [{ type: 'html', html: fallbackHtml(text) }] : [];
    return { segments: [...html, ...blocks.map((b) => ({ type: 'block', index: b.index }) as const)], evaluation };
  }
  try {
    return { segments: splitSegments(tree, blocks), evaluation };
  } catch {
    return { segments: [{ type: 'html', html: fallbackHtml(text) }], evaluation };
  }
}

/**
 * Renders markdown with no calculation blocks (comments, notes) to one HTML string through
 * the same pipeline; calculation fences stay code. Never throws.
 */
export function renderMarkdown(markdown: string): string {
  const text = typeof markdown === 'string' ? markdown : '';
  const tree = hastOf(text);
  if (!tree) return fallbackHtml(text);
  try {
    return toHtml(tree, HTML_OPTIONS);
  } catch {
    return fallbackHtml(text);
  }
}
