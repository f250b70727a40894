/**
 * The body of a case's calculation sheet: exactly what the reading page renders (prose,
 * saved block results, charts, from `renderReadingBody`), but all static: a block with a
 * what-if form keeps its plain header, and no island is written. Cached per revision and
 * solver version like the reading body (a revision's text never changes).
 *
 * Server only (react-dom/server, through `renderReadingBody`).
 */
import { LRUCache } from 'lru-cache';
import { SOLVER_VERSION } from '../../lib/solver';
import type { CaseEvaluation } from '../../lib/calc/results';
import { PANEL_BODY_CLASS, PANEL_CLASS } from '../blocks/BlockResults';
import { filesNamedIn, NO_FILES, type BlockFiles } from '../../lib/calc/files';
import { renderReadingBody, type ReadingPart } from '../cases/readingBody';

/** A revision as its sheet writes it. */
export interface SheetBody {
  readonly html: string;
  readonly evaluation: CaseEvaluation;
}

const cache = new LRUCache<string, SheetBody>({ maxSize: 16_000_000, sizeCalculation: ({ html }) => Math.max(1, 2 * html.length) });

/** The static HTML of reading-body parts, each block in a `sheet-block` wrapper. */
export function sheetHtml(parts: readonly ReadingPart[]): string {
  let html = '';
  for (const part of parts) {
    if (part.type === 'html') html += part.html;
    else if (part.type === 'panel') html += `<div class="not-prose sheet-block my-6" id="block-${part.index}">${part.html}</div>`;
    else
      html +=
        `<div class="not-prose sheet-block my-6" id="block-${part.head.index}">` +
        `<section class="${PANEL_CLASS}" aria-labelledby="${part.headingId}" data-block-index="${part.head.index}" data-status="${part.head.status}">` +
        `${part.headerHtml}<div class="${PANEL_BODY_CLASS}">${part.bodyHtml}</div></section></div>`;
  }
  return html;
}

/** The sheet body of revision `revisionId` (markdown `body`), from the cache when rendered before. */
export async function sheetBody(revisionId: string, body: string, loadFiles: () => Promise<BlockFiles>): Promise<SheetBody> {
  const key = `${revisionId}@${SOLVER_VERSION}`;
  const hit = cache.get(key);
  if (hit) return hit;
  // As on the reading page: a revision's files are fixed with it.
  const rendered = renderReadingBody(body, filesNamedIn(body).length ? await loadFiles() : NO_FILES);
  const made: SheetBody = { html: sheetHtml(rendered.parts), evaluation: rendered.evaluation };
  cache.set(key, made);
  return made;
}
