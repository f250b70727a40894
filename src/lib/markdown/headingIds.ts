/**
 * Heading ids for in-page links (`#design-flood`), added after sanitising: the ids are made
 * here from the heading text (lower case letters, digits and `-` only), never taken from input.
 */
import type { Element, ElementContent, Root, RootContent } from 'hast';
import type { MathData } from './renderMath';

const HEADING = /^h[1-6]$/;

function textOf(node: ElementContent | RootContent): string {
  if (node.type === 'text') return node.value;
  if (node.type === 'raw') return (node.data as Partial<MathData> | undefined)?.tex ?? '';
  if (node.type === 'element') {
    return node.children.map(textOf).join('');
  }
  return '';
}

/** A URL fragment made of the heading text: `Design flood (Q100)` → `design-flood-q100`. */
export function slugify(text: string): string {
  return text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 64);
}

/** Gives every heading of `tree` without an id (footnote labels have one) a unique id (`-2`, `-3`… on repeats). */
export function addHeadingIds(tree: Root): void {
  const used = new Set<string>();
  const visit = (node: Root | Element): void => {
    for (const child of node.children) {
      if (child.type !== 'element') continue;
      if (HEADING.test(child.tagName) && child.properties['id'] === undefined) {
        const base = slugify(textOf(child)) || 'section';
        let id = base;
        for (let n = 2; used.has(id); n += 1) id = `${base}-${n}`;
        used.add(id);
        child.properties['id'] = id;
      } else {
        visit(child);
      }
    }
  };
  visit(tree);
}
