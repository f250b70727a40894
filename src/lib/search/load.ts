/**
 * Reads published cases from PostgreSQL as search documents: by id (the outbox drain) or
 * the whole library page by page (a reindex). The document is always built from what the
 * database holds now, so draining the same change twice, or late, is harmless.
 */
import { sql } from 'drizzle-orm';
import type { Queryable } from '../../db/client';
import type { CaseEvaluation } from '../calc';
import { buildSearchDocument, type SearchDocument } from './document';

interface PublishedRow extends Record<string, unknown> {
  id: string;
  firm_id: string;
  title: string;
  summary: string | null;
  structure_type: string;
  section_shape: string;
  region: string | null;
  project_reference: string | null;
  tags: string[];
  author_name: string;
  reviewer_names: string[] | null;
  published_at: Date | string;
  revision: number;
  body: string;
  results: CaseEvaluation;
}

/** The published cases matching `where` (a SQL condition on `c`, the case table), in id order. */
function selectPublished(where: ReturnType<typeof sql>, limit?: number) {
  return sql`
    select c.id, c.firm_id, c.title, c.summary, c.structure_type, c.section_shape, c.region,
           c.project_reference, c.tags, u.name as author_name, r.number as revision, r.body, r.results,
           a.reviewer_names, coalesce(a.approved_at, r.created_at) as published_at
      from "case" c
      join "user" u on u.id = c.author_id
      join case_revision r on r.case_id = c.id and r.number = c.published_revision
      left join lateral (
        select array_agg(distinct ru.name order by ru.name) as reviewer_names, max(ap.created_at) as approved_at
          from approval ap join "user" ru on ru.id = ap.reviewer_id
         where ap.case_id = c.id and ap.revision_number = c.published_revision and ap.cancelled_at is null
      ) a on true
     where c.published_revision is not null and c.state <> 'withdrawn' and ${where}
     order by c.id
     ${limit === undefined ? sql`` : sql`limit ${limit}`}`;
}

function toDocument(row: PublishedRow): SearchDocument {
  return buildSearchDocument({
    id: row.id,
    firmId: row.firm_id,
    title: row.title,
    summary: row.summary,
    structureType: row.structure_type,
    sectionShape: row.section_shape,
    region: row.region,
    projectReference: row.project_reference,
    tags: row.tags ?? [],
    authorName: row.author_name,
    reviewerNames: row.reviewer_names ?? [],
    publishedAt: new Date(row.published_at),
    revision: row.revision,
    body: row.body,
    results: row.results,
  });
}

/** Documents of those of `caseIds` that are published now (the others belong out of the index). */
export async function loadSearchDocuments(database: Queryable, caseIds: readonly string[]): Promise<SearchDocument[]> {
  if (caseIds.length === 0) return [];
  const ids = sql.join(caseIds.map((id) => sql`${id}`), sql`, `);
  const result = await database.execute<PublishedRow>(selectPublished(sql`c.id in (${ids})`));
  return result.rows.map(toDocument);
}

/** One page of every firm's published cases after `afterId` (keyset on the case id). */
export async function loadSearchDocumentPage(database: Queryable, afterId: string | null, limit: number): Promise<SearchDocument[]> {
  const result = await database.execute<PublishedRow>(selectPublished(afterId === null ? sql`true` : sql`c.id > ${afterId}`, limit));
  return result.rows.map(toDocument);
}

/** How many published cases the index should hold (every firm). */
export async function countPublishedCases(database: Queryable): Promise<number> {
  const result = await database.execute<{ n: number }>(
    sql`select count(*)::int as n from "case" c where c.published_revision is not null and c.state <> 'withdrawn'`,
  );
  return result.rows[0]?.n ?? 0;
}
