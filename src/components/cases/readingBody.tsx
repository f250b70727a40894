/**
 * The body of a case's reading page, rendered once per revision and kept in memory.
 *
 * A revision's text never changes (a database trigger refuses updates), and neither do the
 * files its blocks read (changing one writes a new revision), so its rendering depends only
 * on the revision and the solver: the cache key is the revision id and
 * `SOLVER_VERSION`. Each entry holds the sanitised HTML between blocks, each block's saved
 * results rendered to static HTML (tables, warnings, charts), and the small props of the
 * what-if island of each block that has inputs to change, with the header it replaces. A
 * page view then costs a lookup instead of the markdown pipeline, the solver and a React
 * render of every chart: the islands render in the browser only (`client:only`), over
 * their static header.
 *
 * Server only (react-dom/server). The cache is bounded by the characters it holds.
 */
import { LRUCache } from 'lru-cache';
import { renderToStaticMarkup } from 'react-dom/server';
import { escapeHtml, renderCase } from '../../lib/markdown';
import { SOLVER_VERSION } from '../../lib/solver';
import type { CaseEvaluation } from '../../lib/calc/results';
import { filesNamedIn, matchFileName, NO_FILES, type BlockFiles } from '../../lib/calc/files';
import { BlockChart } from '../blocks/BlockChart';
import { BlockBody, BlockHeader, blockHead, BlockResults, PANEL_BODY_CLASS, PANEL_CLASS, type BlockHead } from '../blocks/BlockResults';
import type { WhatIfBlockProps } from '../blocks/WhatIfBlock';
import { whatIfPlan } from '../blocks/whatIf';

/** One piece of the reading body, in document order. */
export type ReadingPart =
  | { readonly type: 'html'; readonly html: string }
  /** A block without inputs to change (or with errors): its whole panel, static. */
  | { readonly type: 'panel'; readonly index: number; readonly html: string }
  /**
   * A block with a what-if form: the island's props (it draws the header), the static
   * header it replaces, and the saved results body, static.
   */
  | {
      readonly type: 'what-if';
      readonly head: BlockHead;
      readonly headingId: string;
      /** The island's props (`WhatIfBlockProps`) as JSON, for `WhatIfIsland`. */
      readonly payload: string;
      /** The header without the button: shown until the island has loaded (and without script). */
      readonly headerHtml: string;
      readonly bodyHtml: string;
    };

/** The rendered body of one revision. */
export interface ReadingBody {
  readonly parts: readonly ReadingPart[];
  /** The evaluation of the body's blocks with today's solver. */
  readonly evaluation: CaseEvaluation;
}

/**
 * What the page writes, in order: HTML, and the islands within it. An HTML chunk may open
 * a block's frame that the chunk after its island closes: the page writes chunks as they
 * are, so the document is whole once all are written. As few chunks as there are islands
 * (plus one), because every expression an Astro page renders has a cost per request.
 */
export type ReadingChunk =
  /**
   * HTML as UTF-8 bytes: Astro writes bytes given to `set:html` as they are, where a
   * string is joined to its neighbours and encoded again on every request (slowly, once a
   * page holds any character beyond Latin-1, as every case with a subscript does).
   */
  | { readonly type: 'html'; readonly html: Uint8Array }
  | { readonly type: 'island'; readonly payload: string; readonly headerHtml: string };

/** Most bytes (and characters) of rendered HTML kept. */
const MAX_CHARACTERS = 48_000_000;

/** A revision as the reading page writes it, with the evaluation its blocks came from. */
export interface ReadingRender {
  readonly chunks: readonly ReadingChunk[];
  readonly evaluation: CaseEvaluation;
}

const cache = new LRUCache<string, ReadingRender>({
  maxSize: MAX_CHARACTERS,
  // The evaluation is counted at about its results' share of the HTML: the HTML is larger.
  sizeCalculation: ({ chunks }) => Math.max(1, 2 * chunks.reduce((n, c) => n + (c.type === 'island' ? c.payload.length + c.headerHtml.length : c.html.byteLength), 0)),
});

/**
 * Renders `body` (the markdown of one revision) for the reading page. Never throws: the
 * pipeline falls back to escaped text, and a block whose rendering fails shows a notice
 * instead of taking the page down.
 */
export function renderReadingBody(body: string, files: BlockFiles = NO_FILES): ReadingBody {
  const rendered = renderCase(body, files);
  const lines = body.split(/\r\n|\r|\n/);
  const parts: ReadingPart[] = [];
  for (const segment of rendered.segments) {
    if (segment.type === 'html') {
      parts.push(segment);
      continue;
    }
    const block = rendered.evaluation.blocks[segment.index];
    if (!block) continue;
    // React ids (headings, chart clip paths) must not collide between blocks of one page.
    const options = { identifierPrefix: `b${block.index}-` };
    try {
      const source = lines.slice(block.line - 1, block.endLine).join('\n');
      const plan = whatIfPlan(block, source);
      if (plan.fields.length === 0) {
        const html = renderToStaticMarkup(
          <BlockResults block={block}>
            <BlockChart block={block} />
          </BlockResults>,
          options,
        );
        parts.push({ type: 'panel', index: block.index, html });
      } else {
        const bodyHtml = renderToStaticMarkup(
          <BlockBody block={block}>
            <BlockChart block={block} />
          </BlockBody>,
          options,
        );
        const head = blockHead(block);
        const headingId = `block-${block.index}-title`;
        const blockFiles = filesOfBlock(source, files);
        const props: WhatIfBlockProps = { head, headingId, plan, source, ...(blockFiles ? { files: blockFiles } : {}) };
        const headerHtml = renderToStaticMarkup(<BlockHeader head={head} headingId={headingId} />);
        parts.push({ type: 'what-if', head, headingId, payload: JSON.stringify(props), headerHtml, bodyHtml });
      }
    } catch {
      parts.push({
        type: 'panel',
        index: block.index,
        html: `<p class="notice notice-fault">The results of block “${escapeHtml(block.title)}” (line ${block.line}) could not be drawn. The text of the case is unaffected.</p>`,
      });
    }
  }
  return { parts, evaluation: rendered.evaluation };
}

/** The part of `files` one block's text reads (its names, the texts it names), or null when it reads none. */
function filesOfBlock(source: string, files: BlockFiles): BlockFiles | null {
  const named = filesNamedIn(source);
  if (named.length === 0) return null;
  const texts: Record<string, string> = {};
  const unreadable: Record<string, string> = {};
  for (const asked of named) {
    const name = matchFileName(asked, files.names);
    if (name === undefined) continue;
    if (files.texts[name] !== undefined) texts[name] = files.texts[name]!;
    if (files.unreadable?.[name] !== undefined) unreadable[name] = files.unreadable[name]!;
  }
  return { names: files.names, texts, ...(Object.keys(unreadable).length ? { unreadable } : {}) };
}

/**
 * The chunks of `parts`: prose as it is, every block in a `not-prose` wrapper, and each
 * what-if block in its panel frame (class `PANEL_CLASS`) around its island and its saved
 * body (`block-saved`, which a stylesheet rule hides while the island shows a live body).
 */
export function readingChunks(parts: readonly ReadingPart[]): ReadingChunk[] {
  const chunks: ReadingChunk[] = [];
  const encoder = new TextEncoder();
  let html = '';
  for (const part of parts) {
    if (part.type === 'html') html += part.html;
    // `block-N` anchors let review comments link to the block they are about.
    else if (part.type === 'panel') html += `<div class="not-prose my-6" id="block-${part.index}">${part.html}</div>`;
    else {
      html += `<div class="not-prose my-6" id="block-${part.head.index}"><section class="${PANEL_CLASS}" aria-labelledby="${part.headingId}" data-block-index="${part.head.index}" data-status="${part.head.status}">`;
      chunks.push({ type: 'html', html: encoder.encode(html) });
      chunks.push({ type: 'island', payload: part.payload, headerHtml: part.headerHtml });
      html = `<div class="${PANEL_BODY_CLASS} block-saved">${part.bodyHtml}</div></section></div>`;
    }
  }
  if (html) chunks.push({ type: 'html', html: encoder.encode(html) });
  return chunks;
}

/**
 * The reading body of revision `revisionId` (whose markdown is `body`) as page chunks with
 * its evaluation, from the cache when this server has rendered it before with the same solver.
 */
export async function readingBody(revisionId: string, body: string, loadFiles: () => Promise<BlockFiles>): Promise<ReadingRender> {
  const key = `${revisionId}@${SOLVER_VERSION}`;
  const hit = cache.get(key);
  if (hit) return hit;
  // The files a revision's blocks read are fixed with it (a change of them writes a new revision).
  const rendered = renderReadingBody(body, filesNamedIn(body).length ? await loadFiles() : NO_FILES);
  const made: ReadingRender = { chunks: readingChunks(rendered.parts), evaluation: rendered.evaluation };
  cache.set(key, made);
  return made;
}
