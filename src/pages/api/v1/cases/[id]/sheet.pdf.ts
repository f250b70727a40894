import type { APIRoute } from 'astro';
import { jsonError } from '../../../../../lib/http';
import { renderPdf } from '../../../../../lib/pdf';
import { paperOf } from '../../../../../lib/sheet';
import { caseNotFound } from '../_shared';
import { attachmentHeaders, loadSheet } from './_sheet';

/**
 * Where this server answers on loopback, for Chromium to load the sheet from: the address
 * `scripts/serve.mjs` listens on (`HOST`/`PORT`), else the request's own origin (`astro dev`).
 */
function loopbackOrigin(requestUrl: URL): string {
  const port = process.env.PORT;
  if (!port) return requestUrl.origin;
  const host = process.env.HOST;
  return `http://${!host || host === '0.0.0.0' || host === '::' ? '127.0.0.1' : host}:${port}`;
}

/**
 * The calculation sheet of revision `?rev=` on `?paper=a4|letter` as a PDF: Chromium prints
 * the print view (`/cases/:id/sheet`) loaded on loopback with the caller's cookie, so the
 * PDF shows exactly what the caller may read. 503 when Chromium is missing or fails.
 */
export const GET: APIRoute = async (context) => {
  const loaded = await loadSheet(context);
  if (loaded instanceof Response) return loaded;
  const { facts } = loaded;
  const paper = paperOf(context.url.searchParams.get('paper'));
  const url = new URL(`/cases/${encodeURIComponent(facts.sheet.case.id)}/sheet`, loopbackOrigin(context.url));
  url.search = new URLSearchParams({ rev: String(facts.sheet.revision.number), paper, pdf: '1' }).toString();
  const result = await renderPdf({
    url: url.href,
    cookie: context.request.headers.get('cookie') ?? '',
    format: paper === 'letter' ? 'Letter' : 'A4',
    footerText: `${facts.firmName} · ${facts.sheet.case.title} · revision ${facts.sheet.revision.number}`,
  });
  if (!result.ok) {
    if (result.reason === 'page' && result.status === 404) return caseNotFound();
    return jsonError(
      503,
      'pdf_unavailable',
      `The PDF could not be printed (${result.detail}). Open the calculation sheet and print it from the browser, or try again in a minute.`,
    );
  }
  return new Response(result.pdf, { headers: attachmentHeaders(facts, 'pdf', 'application/pdf') });
};
