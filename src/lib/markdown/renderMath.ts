/**
 * Renders the math of a sanitised tree with KaTeX: elements with the `language-math`,
 * `math-inline` or `math-display` class (remark-math's output, and ` ```math ` fences).
 * The same matching as rehype-katex, but KaTeX's HTML goes in as a `raw` node instead of
 * being parsed back into a tree with parse5, which was most of a case's rendering time.
 * Safe only after sanitising: the sanitiser drops every `raw` node, so the only raw HTML
 * serialised is KaTeX's own, rendered with `trust: false`. Never throws.
 */
import type { Element, ElementContent, Root, RootContent } from 'hast';
import katex, { type KatexOptions } from 'katex';
import { escapeHtml } from './escapeHtml';

/** Colour of a formula KaTeX cannot read: the palette's `fault`. */
export const MATH_ERROR_COLOR = '#9a3026';

const OPTIONS: KatexOptions = {
  errorColor: MATH_ERROR_COLOR,
  // No \href, \url, \includegraphics, \htmlClass/Id/Style/Data: those need trust.
  trust: false,
  strict: 'ignore',
  output: 'htmlAndMathml',
  // Bounds against formulas written to exhaust the renderer.
  maxExpand: 500,
  maxSize: 40,
};

/** The TeX source of a rendered formula, kept for heading ids and plain-text extracts. */
export interface MathData {
  readonly tex: string;
}

function classes(node: Element): readonly unknown[] {
  const c = node.properties['className'];
  return Array.isArray(c) ? c : [];
}

function textOf(node: ElementContent): string {
  if (node.type === 'text') return node.value;
  return node.type === 'element' ? node.children.map(textOf).join('') : '';
}

/** KaTeX's HTML for `tex`; a red, escaped copy of the source when KaTeX cannot read it. */
export function katexHtml(tex: string, displayMode: boolean): string {
  try {
    return katex.renderToString(tex, { ...OPTIONS, displayMode, throwOnError: false });
  } catch {
    // throwOnError: false covers parse errors; anything else still must not break the page.
    return `<span class="katex-error" style="color:${MATH_ERROR_COLOR}">${escapeHtml(tex)}</span>`;
  }
}

function mathNode(tex: string, displayMode: boolean): RootContent {
  return { type: 'raw', value: katexHtml(tex, displayMode), data: { tex } as MathData } as RootContent;
}

/** Replaces every math element of `tree` with its KaTeX rendering (see the module comment). */
export function renderMath(tree: Root): void {
  const visit = (parent: Root | Element): void => {
    const children = parent.children as RootContent[];
    for (let i = 0; i < children.length; i += 1) {
      const child = children[i]!;
      if (child.type !== 'element') continue;
      const own = classes(child);
      if (child.tagName === 'pre' && child.children.length === 1) {
        const code = child.children[0]!;
        if (code.type === 'element' && code.tagName === 'code' && classes(code).includes('language-math')) {
          children[i] = mathNode(textOf(code), true);
          continue;
        }
      }
      const inline = own.includes('math-inline');
      if (inline || own.includes('math-display') || own.includes('language-math')) {
        children[i] = mathNode(textOf(child), !inline && own.includes('math-display'));
        continue;
      }
      visit(child);
    }
  };
  visit(tree);
}
