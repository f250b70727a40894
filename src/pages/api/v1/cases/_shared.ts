/**
 * Helpers of the case routes (a leading underscore keeps Astro from routing this file).
 */
import type { z } from 'zod';
import { CASE_FAILURES, type LatestRevisionInfo } from '../../../../lib/cases';
import { json, jsonError, toFieldIssues, type Parsed } from '../../../../lib/http';

/** The 404 of every case route: the same for another firm's case as for one that never existed. */
export const caseNotFound = () =>
  jsonError(CASE_FAILURES.not_found.status, CASE_FAILURES.not_found.code, CASE_FAILURES.not_found.message);

/** Reads query parameters against a schema once, at the boundary: 422 with field issues. */
export function parseQuery<S extends z.ZodType>(url: URL, schema: S): Parsed<z.output<S>> {
  const parsed = schema.safeParse(Object.fromEntries(url.searchParams));
  if (parsed.success) return { ok: true, data: parsed.data };
  const issues = toFieldIssues(parsed.error);
  const summary = issues.map((i) => `${i.path}: ${i.message}`).join('; ');
  return { ok: false, response: jsonError(422, 'invalid_input', `Check the query: ${summary}`, issues) };
}

/**
 * The 409 of a stale save: the usual error shape plus the latest revision, so the editor can
 * show the colleague's (or the other tab's) text beside its own.
 */
export function conflictResponse(latest: LatestRevisionInfo): Response {
  const failure = CASE_FAILURES.conflict;
  return json(
    {
      error: {
        code: failure.code,
        message: `${failure.message} The latest is revision ${latest.number}, saved by ${latest.authorName}.`,
        latest,
      },
    },
    failure.status,
  );
}
