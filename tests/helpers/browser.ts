/** Debian's headless Chromium through playwright-core (never a downloaded browser). */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser } from 'playwright-core';

/** Where screenshots and other browser artefacts are written. */
export const testOutputDir = path.resolve('test-results', 'e2e');

export async function launchBrowser(): Promise<Browser> {
  mkdirSync(testOutputDir, { recursive: true });
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

/** A path for a named screenshot under the test output folder. */
export const screenshotPath = (name: string) => path.join(testOutputDir, `${name}.png`);
