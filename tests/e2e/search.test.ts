/**
 * Precedent search in the browser: words and a Froude range find the demo culvert case and
 * not the others (including a second culvert case published here at Fr1 ≈ 9), the query
 * lives in the address, the range handles work from the keyboard, and a result starts a
 * new case.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl } from '../helpers/app';
import { launchBrowser, screenshotPath, signedInPage } from '../helpers/browser';

// b = 3 m, y1 = 0.30 m, Fr1 = 9: q = Fr1·√(g·y1³) = 4.63 m²/s, Q = 13.9 m³/s.
const BODY = `## Purpose

Flood bypass culvert outlet at Brackenfold, high-energy jump on the apron.

\`\`\`jump outlet
b = 3 m
Q = 13.9 m3/s
y1 = 0.30 m
\`\`\`
`;

let browser: Browser;
const errors: string[] = [];

const signedIn = (email: string) => signedInPage(browser, email, errors);

let engineer: Page;
let otherCulvert = '';

const hitTitles = (page: Page) => page.locator('[data-testid=hit-title]').allTextContents();

beforeAll(async () => {
  browser = await launchBrowser();
  engineer = await signedIn('tomas.ilvar@kestrelweir.example');
  const reviewer = await signedIn('helena.brandt@kestrelweir.example');
  const headers = { origin: appUrl() };
  const created = await engineer.request.post(`${appUrl()}/api/v1/cases`, {
    data: { title: 'Brackenfold flood bypass culvert outlet', structureType: 'culvert-outlet', sectionShape: 'rectangular', tags: ['culvert'], body: BODY },
    headers,
  });
  expect(created.status()).toBe(201);
  otherCulvert = (await created.json()).case.id;
  expect((await engineer.request.post(`${appUrl()}/api/v1/cases/${otherCulvert}/review`, { data: { action: 'submit' }, headers })).status()).toBe(200);
  const approved = await reviewer.request.post(`${appUrl()}/api/v1/cases/${otherCulvert}/review`, { data: { action: 'approve' }, headers });
  expect((await approved.json()).state).toBe('published');
  // Wait for the worker to index it (moments).
  for (let i = 0; i < 100; i += 1) {
    const found = await (await engineer.request.get(`${appUrl()}/api/v1/search?q=Brackenfold`)).json();
    if (found.hits?.some((h: { id: string }) => h.id === otherCulvert)) break;
    await engineer.waitForTimeout(150);
  }
});

afterAll(async () => {
  await browser?.close();
});

describe('the search page', () => {
  it('finds the demo culvert case by "culvert" and Fr1 4–6, and not the others', async () => {
    await engineer.goto(`${appUrl()}/search`);
    await engineer.getByRole('link', { name: 'Find a precedent' }).waitFor();
    await engineer.fill('#search-text', 'culvert');
    await engineer.waitForURL(/q=culvert/);
    await expect.poll(() => hitTitles(engineer), { timeout: 10_000 }).toEqual(expect.arrayContaining([expect.stringContaining('Kilnbarrow'), expect.stringContaining('Brackenfold')]));
    await engineer.fill('#fr-min', '4');
    await engineer.press('#fr-min', 'Enter');
    await engineer.fill('#fr-max', '6');
    await engineer.press('#fr-max', 'Enter');
    await engineer.waitForURL(/frMin=4&frMax=6/);
    await expect.poll(() => hitTitles(engineer), { timeout: 10_000 }).toEqual([expect.stringContaining('Kilnbarrow Lane culvert')]);
    await expect.poll(() => engineer.textContent('[data-testid=search-status]'), { timeout: 10_000 }).toBe('1 published case');
    // The matched word is marked in the title.
    expect(await engineer.locator('[data-testid=search-hit] mark').first().textContent()).toMatch(/culvert/i);
    await engineer.screenshot({ path: screenshotPath('search-culvert-froude'), fullPage: true });

    // The address is the search: opened afresh, it shows the same result, rendered by the server.
    const shared = engineer.url();
    const fresh = await engineer.context().newPage();
    await fresh.goto(shared);
    expect(await hitTitles(fresh)).toEqual([expect.stringContaining('Kilnbarrow Lane culvert')]);
    expect(await fresh.inputValue('#search-text')).toBe('culvert');
    expect(await fresh.inputValue('#fr-min')).toBe('4');
    await fresh.close();
  });

  it('moves the Froude handles from the keyboard and narrows by a facet with counts', async () => {
    await engineer.goto(`${appUrl()}/search`);
    const low = engineer.getByRole('slider', { name: 'Lowest Fr₁' });
    await low.focus();
    for (let i = 0; i < 3; i += 1) await engineer.keyboard.press('PageUp');
    await engineer.waitForURL(/frMin=4/);
    await expect.poll(() => engineer.inputValue('#fr-min')).toBe('4');
    const structure = engineer.locator('[data-testid=facet-structure]');
    await structure.getByLabel(/Culvert outlet/).check();
    await engineer.waitForURL(/structure=culvert-outlet/);
    await expect.poll(() => hitTitles(engineer), { timeout: 10_000 }).toEqual(expect.arrayContaining([expect.stringContaining('Brackenfold'), expect.stringContaining('Kilnbarrow')]));
    // Other structure types still show what they would give (disjunctive counts).
    expect(await structure.locator('li').count()).toBeGreaterThan(1);
  });

  it('says so when nothing matches, and offers to clear the search', async () => {
    await engineer.goto(`${appUrl()}/search?q=zzyzx-nothing&frMin=2`);
    await engineer.locator('[data-testid=search-empty]').waitFor();
    await engineer.screenshot({ path: screenshotPath('search-empty') });
    await engineer.getByRole('button', { name: 'Clear the search' }).first().click();
    await expect.poll(() => engineer.locator('[data-testid=search-hit]').count()).toBeGreaterThan(1);
    expect(engineer.url()).toBe(`${appUrl()}/search`);
  });

  it('starts a new case from a result, with the published body copied', async () => {
    await engineer.goto(`${appUrl()}/search?q=Kilnbarrow`);
    await engineer.locator('[data-testid=start-from]').first().click();
    await engineer.waitForURL(/\/cases\/new\?from=/);
    expect(await engineer.textContent('[data-testid=copy-source]')).toContain('Kilnbarrow');
    expect(await engineer.isChecked('input[name=start][value=copy]')).toBe(true);
    await engineer.screenshot({ path: screenshotPath('new-case-from-result'), fullPage: true });
    await engineer.fill('#title', 'Kilnbarrow-style outlet for the Wenlow crossing');
    await Promise.all([engineer.waitForURL(/\/cases\/[^/]+\/edit$/), engineer.getByRole('button', { name: 'Create and open the editor' }).click()]);
    await engineer.locator('#case-summary').waitFor();
    await engineer.screenshot({ path: screenshotPath('editor-with-summary') });
    expect(errors).toEqual([]);
  });
});
