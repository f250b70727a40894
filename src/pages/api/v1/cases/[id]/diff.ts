import type { APIRoute } from 'astro';
import { db } from '../../../../../db/client';
import { diffCaseRevisions, DiffQuerySchema } from '../../../../../lib/cases';
import { errors, json, requireMember } from '../../../../../lib/http';
import { parseQuery } from '../_shared';

/** The line difference between two revisions of a case (`?from=1&to=3`). */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const query = parseQuery(context.url, DiffQuerySchema);
  if (!query.ok) return query.response;
  const result = await diffCaseRevisions(db(), caller.firm.firm.id, context.params.id ?? '', query.data);
  return result.ok ? json(result.value) : errors.notFound('That revision');
};
