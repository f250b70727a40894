import type { APIRoute } from 'astro';
import { db } from '../../../db/client';
import { DESIGN_AID_CAUTION } from '../../../lib/caution';
import { json, jsonError, requireMember, toFieldIssues } from '../../../lib/http';
import { PrecedentQuerySchema, queryFromParams, searchPrecedents } from '../../../lib/search';

/**
 * Precedent search over the caller's firm's published cases:
 * `?q=&frMin=&frMax=&dischargeMin=&dischargeMax=&structure=&shape=&kind=&region=&tag=&sort=&page=`
 * (facet parameters repeat). The firm comes from the session, never from the query.
 * 422 for a query that does not read, 503 when the search service is down or not set up.
 */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const parsed = PrecedentQuerySchema.safeParse(queryFromParams(context.url.searchParams));
  if (!parsed.success) {
    const issues = toFieldIssues(parsed.error);
    return jsonError(422, 'invalid_input', `Check the search: ${issues.map((i) => i.message).join(' ')}`, issues);
  }
  const found = await searchPrecedents(db(), caller.firm.firm.id, parsed.data);
  if (!found.ok) {
    return json({ error: { code: found.reason === 'not_configured' ? 'search_not_configured' : 'search_unavailable', message: found.message }, pending: found.pending }, 503, {
      'retry-after': '30',
    });
  }
  return json({ ...found.results, caution: DESIGN_AID_CAUTION }, 200, { 'cache-control': 'private, no-store' });
};
