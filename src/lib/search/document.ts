/**
 * The search document of a published case: what precedent search matches words against,
 * filters by and shows in a result. One document per published case, built from its latest
 * published revision. Pure: the loader reads the rows, this shapes them.
 */
import type { BlockResult, CaseEvaluation } from '../calc';
import { keyFigures } from '../cases/keyFigures';
import { SECTION_SHAPE_LABELS, STRUCTURE_TYPE_LABELS } from '../cases/validation';
import { plainText } from '../markdown/plainText';
import { KIND_SPECS, isSolverKind } from '../solver';
import { pickFigures, type SearchFigures } from './figures';

/** Longest body text indexed, in characters (the start of a case says what it is about). */
export const MAX_INDEXED_BODY = 20_000;

/** One published case as the search index holds it. Numbers are SI; absent figures are null. */
export interface SearchDocument extends SearchFigures {
  /** The case id (the index's primary key). */
  id: string;
  /** The firm: every search is filtered on it by the server. */
  firmId: string;
  title: string;
  summary: string;
  /** The published revision's body as plain text (markup, math and blocks left out). */
  body: string;
  /** Titles of the calculation blocks, e.g. "Stationary hydraulic jump (toe)". */
  blockTitles: string[];
  structureType: string;
  structureLabel: string;
  /** The case's section shape and every block's, as ids… */
  sectionShapes: string[];
  /** …and as words. */
  sectionLabels: string[];
  /** Solver kinds of the blocks that solved, as ids… */
  calcKinds: string[];
  /** …and as titles. */
  calcLabels: string[];
  tags: string[];
  region: string | null;
  projectReference: string | null;
  authorName: string;
  /** Who approved the published revision. */
  reviewerNames: string[];
  /** When the published revision was approved, as epoch milliseconds (sortable)… */
  publishedAt: number;
  /** …and which revision it is. */
  revision: number;
}

/** What {@link buildSearchDocument} is made from: the case row and its published revision. */
export interface PublishedCaseRow {
  id: string;
  firmId: string;
  title: string;
  summary: string | null;
  structureType: string;
  sectionShape: string;
  region: string | null;
  projectReference: string | null;
  tags: readonly string[];
  authorName: string;
  reviewerNames: readonly string[];
  publishedAt: Date;
  revision: number;
  body: string;
  results: CaseEvaluation;
}

/** Outputs that give a surge or bore front's speed over the bed. */
const CELERITY_OUTPUTS = new Set(['surgeSpeed', 'frontSpeed']);

function largestCelerity(blocks: readonly BlockResult[]): number | null {
  let most: number | null = null;
  for (const block of blocks) {
    if (block.status !== 'ok') continue;
    for (const output of block.outputs) {
      if (!CELERITY_OUTPUTS.has(output.name) || typeof output.si !== 'number' || !Number.isFinite(output.si)) continue;
      const speed = Math.abs(output.si);
      if (most === null || speed > most) most = speed;
    }
  }
  return most;
}

const labelOf = <K extends string>(labels: Record<K, string>, id: string): string => (labels as Record<string, string>)[id] ?? id;

/** Builds the document of one published case; see {@link SearchDocument}. */
export function buildSearchDocument(row: PublishedCaseRow): SearchDocument {
  const blocks = row.results?.blocks ?? [];
  const figures = keyFigures(row.results);
  const sectionShapes = [...new Set([row.sectionShape, ...figures.sectionShapes])].sort();
  const text = plainText(row.body);
  return {
    id: row.id,
    firmId: row.firmId,
    title: row.title,
    summary: row.summary ?? '',
    body: text.length > MAX_INDEXED_BODY ? text.slice(0, MAX_INDEXED_BODY) : text,
    blockTitles: [...new Set(blocks.map((b) => b.title).filter(Boolean))],
    structureType: row.structureType,
    structureLabel: labelOf(STRUCTURE_TYPE_LABELS, row.structureType),
    sectionShapes,
    sectionLabels: sectionShapes.map((s) => labelOf(SECTION_SHAPE_LABELS, s)),
    calcKinds: figures.calcKinds,
    calcLabels: figures.calcKinds.map((k) => (isSolverKind(k) ? KIND_SPECS[k].title : k)),
    tags: [...row.tags],
    region: row.region,
    projectReference: row.projectReference,
    authorName: row.authorName,
    reviewerNames: [...new Set(row.reviewerNames)],
    publishedAt: row.publishedAt.getTime(),
    revision: row.revision,
    ...pickFigures({ ...figures, surgeCelerity: largestCelerity(blocks) }),
  };
}
