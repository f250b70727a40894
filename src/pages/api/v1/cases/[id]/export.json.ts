import type { APIRoute } from 'astro';
import { caseJson } from '../../../../../lib/sheet';
import { attachmentHeaders, loadSheet } from './_sheet';

/** The whole case at revision `?rev=` (metadata, body, results, sign-off, solver, caution) as JSON, as an attachment. */
export const GET: APIRoute = async (context) => {
  const loaded = await loadSheet(context);
  if (loaded instanceof Response) return loaded;
  return new Response(JSON.stringify(caseJson(loaded.facts), null, 2), { headers: attachmentHeaders(loaded.facts, 'json', 'application/json; charset=utf-8') });
};
