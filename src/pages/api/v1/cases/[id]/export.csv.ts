import type { APIRoute } from 'astro';
import { caseCsv } from '../../../../../lib/sheet';
import { attachmentHeaders, loadSheet } from './_sheet';

/** Every block's inputs and results of the revision `?rev=` as CSV, as an attachment. */
export const GET: APIRoute = async (context) => {
  const loaded = await loadSheet(context);
  if (loaded instanceof Response) return loaded;
  return new Response(caseCsv(loaded.facts), { headers: attachmentHeaders(loaded.facts, 'csv', 'text/csv; charset=utf-8') });
};
