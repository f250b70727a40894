/**
 * How the case index is set up: which attributes are matched (first = most important),
 * filtered and sorted on. Applied whenever a worker first talks to the service, and to the
 * fresh index a reindex builds, so changing a list here takes effect on the next start.
 */
export const INDEX_SETTINGS: { rankingRules: string[]; searchableAttributes: string[]; filterableAttributes: string[]; sortableAttributes: string[] } = {
  // `sort` first: an order the user picks (newest, Fr₁) is strict; relevance ranks within it.
  // Without a sort parameter the rule does nothing and relevance decides alone. Equally
  // relevant cases come newest first (and in the same order after a reindex).
  rankingRules: ['sort', 'words', 'typo', 'proximity', 'attribute', 'exactness', 'publishedAt:desc'],
  searchableAttributes: [
    'title',
    'summary',
    'tags',
    'structureLabel',
    'calcLabels',
    'blockTitles',
    'sectionLabels',
    'region',
    'projectReference',
    'authorName',
    'reviewerNames',
    'body',
  ],
  filterableAttributes: [
    'firmId',
    'structureType',
    'sectionShapes',
    'calcKinds',
    'region',
    'tags',
    'fr1Min',
    'fr1Max',
    'dischargeMin',
    'dischargeMax',
    'publishedAt',
  ],
  sortableAttributes: ['publishedAt', 'fr1Min', 'fr1Max', 'title'],
};

/** The primary key of the case index. */
export const PRIMARY_KEY = 'id';
