import type { APIRoute } from 'astro';
import { db } from '../../../../db/client';
import { createCase, CreateCaseSchema, listCases, ListCasesQuerySchema } from '../../../../lib/cases';
import { DESIGN_AID_CAUTION } from '../../../../lib/caution';
import { json, parseJsonBody, requireMember } from '../../../../lib/http';
import { parseQuery } from './_shared';

/** The firm's cases (`?mine=1&state=&sort=updated|title|fr1&dir=asc|desc&limit=&offset=`). */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const query = parseQuery(context.url, ListCasesQuerySchema);
  if (!query.ok) return query.response;
  const { mine, state, sort, dir, limit, offset } = query.data;
  const list = await listCases(db(), caller.firm.firm.id, {
    ...(mine ? { authorId: caller.user.id } : {}),
    ...(state ? { state } : {}),
    sort,
    ...(dir ? { direction: dir } : {}),
    limit,
    offset,
  });
  return json({ ...list, limit, offset });
};

/** Starts a draft case owned by the caller, with revision 1. */
export const POST: APIRoute = async (context) => {
  const caller = requireMember(context, { resource: 'case', action: 'create' });
  if (caller instanceof Response) return caller;
  const body = await parseJsonBody(context.request, CreateCaseSchema);
  if (!body.ok) return body.response;
  const { body: markdown, ...metadata } = body.data;
  const created = await createCase(db(), { firmId: caller.firm.firm.id, authorId: caller.user.id, metadata, body: markdown });
  return json({ case: created, caution: DESIGN_AID_CAUTION }, 201, { location: `/api/v1/cases/${created.id}` });
};
