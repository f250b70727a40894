/**
 * Splits a rendered case body at its calculation blocks, so a page can interleave HTML with
 * live block components. A block is matched to its rendered `<pre>` by source position (the
 * line of the opening fence equals `BlockResult.line`), never by counting fences.
 */
import type { Element, ElementContent, Root, RootContent } from 'hast';
import { toHtml } from 'hast-util-to-html';

/** One piece of a rendered case body. */
export type CaseSegment = { readonly type: 'html'; readonly html: string } | { readonly type: 'block'; readonly index: number };

const startLine = (node: RootContent | ElementContent): number | undefined => node.position?.start.line;

function isBlockPre(node: RootContent | ElementContent, byLine: ReadonlyMap<number, number>): boolean {
  if (node.type !== 'element' || node.tagName !== 'pre') return false;
  const line = startLine(node);
  return line !== undefined && byLine.has(line);
}

/** Removes the block `<pre>`s nested in `node` and returns their block indexes in order. */
function takeNested(node: Element, byLine: ReadonlyMap<number, number>): number[] {
  const found: number[] = [];
  node.children = node.children.filter((child) => {
    if (isBlockPre(child, byLine)) {
      found.push(byLine.get(startLine(child)!)!);
      return false;
    }
    if (child.type === 'element') found.push(...takeNested(child, byLine));
    return true;
  });
  return found;
}

function linesOfPres(node: Root | Element, byLine: ReadonlyMap<number, number>, into: Set<number>): Set<number> {
  for (const child of node.children) {
    if (isBlockPre(child, byLine)) into.add(startLine(child)!);
    else if (child.type === 'element') linesOfPres(child, byLine, into);
  }
  return into;
}

/**
 * Segments of `tree` (consumed: nested block `<pre>`s are removed from it). `blocks` are the
 * case's blocks as `{ index, line }`. A block inside a list or quote is placed right after
 * that top-level element; a block with no rendered `<pre>` at all (its fence sat inside raw
 * HTML, which is dropped) is placed before the first element that starts below its line.
 */
export function splitSegments(tree: Root, blocks: readonly { readonly index: number; readonly line: number }[]): CaseSegment[] {
  const byLine = new Map(blocks.map((b) => [b.line, b.index] as const));
  const rendered = linesOfPres(tree, byLine, new Set());
  const unplaced = blocks.filter((b) => !rendered.has(b.line)).sort((a, b) => a.line - b.line);
  const segments: CaseSegment[] = [];
  let pending: RootContent[] = [];

  const flush = () => {
    if (pending.some((n) => n.type !== 'text' || n.value.trim() !== '')) {
      // `raw` nodes are KaTeX's output only: the sanitiser removed every other one.
      segments.push({ type: 'html', html: toHtml({ type: 'root', children: pending }, { allowDangerousHtml: true }) });
    }
    pending = [];
  };
  const block = (index: number) => {
    flush();
    segments.push({ type: 'block', index });
  };

  for (const child of tree.children) {
    const line = startLine(child);
    while (line !== undefined && unplaced.length && unplaced[0]!.line < line) block(unplaced.shift()!.index);
    if (isBlockPre(child, byLine)) {
      block(byLine.get(startLine(child)!)!);
    } else if (child.type === 'element' && rendered.size) {
      const nested = takeNested(child, byLine);
      pending.push(child);
      nested.forEach(block);
    } else {
      pending.push(child);
    }
  }
  flush();
  for (const b of unplaced) segments.push({ type: 'block', index: b.index });
  return segments;
}
