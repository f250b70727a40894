/**
 * Prints a page of the app to PDF with the process's Chromium: a fresh browser context per
 * request (so one caller's cookie never meets another's), the page loaded with the caller's
 * cookie, `page.pdf` with a footer of "page x of y". Never throws: a browser that is
 * missing or fails, a page that does not load in time, come back as reasons.
 */
import { pdfBrowser } from './chromium';

/** Paper formats Chromium knows. */
export type PdfFormat = 'A4' | 'Letter';

/** What to print. */
export interface PdfRequest {
  /** Absolute URL of the page (on loopback). */
  url: string;
  /** The caller's `cookie` header, sent with the page's requests. */
  cookie: string;
  format: PdfFormat;
  /** Left-hand footer text (plain text; escaped here). */
  footerText: string;
}

/** The outcome of {@link renderPdf}. */
export type PdfResult =
  | { ok: true; pdf: Uint8Array<ArrayBuffer> }
  /** `unavailable`: Chromium could not be started; `page`: the page answered `status`; `failed`: printing failed or timed out. */
  | { ok: false; reason: 'unavailable' | 'page' | 'failed'; status?: number; detail: string };

/** Most time loading and printing one page may take. */
export const PDF_TIMEOUT_MS = 30_000;

const escape = (text: string) => text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** Chromium's footer: the given text on the left, "Page x of y" on the right. */
export function footerTemplate(text: string): string {
  return (
    `<div style="width:100%;margin:0 15mm;font:8px 'Source Sans 3',Arial,sans-serif;color:#555;display:flex;justify-content:space-between;">` +
    `<span>${escape(text)}</span><span>Page <span class="pageNumber"></span> of <span class="totalPages"></span></span></div>`
  );
}

/** The PDF of `request.url`, or why there is none. */
export async function renderPdf(request: PdfRequest): Promise<PdfResult> {
  let browser;
  try {
    browser = await pdfBrowser();
  } catch (error) {
    return { ok: false, reason: 'unavailable', detail: error instanceof Error ? error.message.split('\n')[0]! : String(error) };
  }
  let timer: NodeJS.Timeout | undefined;
  const context = await browser.newContext({ extraHTTPHeaders: request.cookie ? { cookie: request.cookie } : {} }).catch(() => null);
  if (!context) return { ok: false, reason: 'unavailable', detail: 'the browser would not open a page' };
  try {
    const work = (async (): Promise<PdfResult> => {
      const page = await context.newPage();
      const response = await page.goto(request.url, { waitUntil: 'load', timeout: PDF_TIMEOUT_MS });
      if (!response || response.status() !== 200) return { ok: false, reason: 'page', status: response?.status() ?? 0, detail: `the sheet answered ${response?.status()}` };
      await page.evaluate(() => document.fonts.ready).catch(() => undefined);
      const pdf = await page.pdf({
        format: request.format,
        printBackground: true,
        displayHeaderFooter: true,
        headerTemplate: '<span></span>',
        footerTemplate: footerTemplate(request.footerText),
        margin: { top: '16mm', right: '15mm', bottom: '18mm', left: '15mm' },
      });
      return { ok: true, pdf: new Uint8Array(pdf) };
    })();
    const timeout = new Promise<PdfResult>((resolve) => {
      timer = setTimeout(() => resolve({ ok: false, reason: 'failed', detail: `printing took longer than ${PDF_TIMEOUT_MS / 1000} s` }), PDF_TIMEOUT_MS + 5_000);
    });
    return await Promise.race([work, timeout]);
  } catch (error) {
    return { ok: false, reason: 'failed', detail: error instanceof Error ? error.message.split('\n')[0]! : String(error) };
  } finally {
    clearTimeout(timer);
    await context.close().catch(() => undefined);
  }
}
