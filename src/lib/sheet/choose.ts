/**
 * Which revision a calculation sheet or export shows, by the reading page's rule: once a
 * case has a publication, colleagues get the published revision while a newer one is in
 * work; the author (and reviewers, while it is in review) get the newest. `rev` may ask
 * for `published`, `latest` or a revision number.
 */

/** What decides the default revision. */
export interface RevisionChoiceFacts {
  latestRevision: number;
  publishedRevision: number | null;
  state: string;
  isAuthor: boolean;
  isReviewer: boolean;
}

/**
 * The revision number to show for `asked` (the `rev` query parameter, or null), or null
 * when `asked` is neither a keyword nor a revision number of the case.
 */
export function chooseRevision(facts: RevisionChoiceFacts, asked: string | null): number | null {
  const { latestRevision, publishedRevision } = facts;
  if (asked === 'latest') return latestRevision;
  if (asked === 'published') return publishedRevision ?? latestRevision;
  if (asked !== null && asked !== '') {
    if (!/^\d{1,9}$/.test(asked)) return null;
    const n = Number(asked);
    return n >= 1 && n <= latestRevision ? n : null;
  }
  const worksOnLatest = facts.isAuthor || (facts.isReviewer && facts.state === 'in_review');
  return publishedRevision !== null && publishedRevision !== latestRevision && !worksOnLatest ? publishedRevision : latestRevision;
}

/** Paper sizes of the sheet. */
export const PAPER_SIZES = ['a4', 'letter'] as const;
export type PaperSize = (typeof PAPER_SIZES)[number];

/** The paper asked for (`?paper=`), A4 unless `letter`. */
export const paperOf = (asked: string | null): PaperSize => (asked?.toLowerCase() === 'letter' ? 'letter' : 'a4');
