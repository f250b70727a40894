/**
 * One headless Chromium per server process, for printing PDFs: launched on first use
 * (Debian's /usr/bin/chromium through playwright-core, never a downloaded browser), reused
 * by every request, launched again if it dies. playwright-core closes it when the process
 * exits or is signalled (its default SIGINT/SIGTERM/SIGHUP handling); `closePdfBrowser`
 * closes it sooner.
 */
import { chromium, type Browser } from 'playwright-core';

/** Where Chromium is: `CHROMIUM_PATH`, else Debian's package. */
export const chromiumPath = () => process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

/** Most time a launch may take. */
const LAUNCH_TIMEOUT_MS = 20_000;

const slot = globalThis as typeof globalThis & { __sequentPdfBrowser?: Promise<Browser> | undefined };

/** The process's browser, launching it when there is none (or the last one closed). */
export function pdfBrowser(): Promise<Browser> {
  if (!slot.__sequentPdfBrowser) {
    const launching = chromium.launch({
      executablePath: chromiumPath(),
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
      timeout: LAUNCH_TIMEOUT_MS,
    });
    slot.__sequentPdfBrowser = launching;
    launching.then(
      (browser) => browser.on('disconnected', () => {
        if (slot.__sequentPdfBrowser === launching) slot.__sequentPdfBrowser = undefined;
      }),
      () => {
        // A failed launch is tried again by the next request.
        if (slot.__sequentPdfBrowser === launching) slot.__sequentPdfBrowser = undefined;
      },
    );
  }
  return slot.__sequentPdfBrowser;
}

/** Closes the process's browser, if one is running. */
export async function closePdfBrowser(): Promise<void> {
  const launching = slot.__sequentPdfBrowser;
  slot.__sequentPdfBrowser = undefined;
  if (launching) await launching.then((b) => b.close()).catch(() => undefined);
}
