/**
 * Template shelf in Chromium on the built app: add a template from a saved design, open its label
 * PDF, upload measured positions as CSV, read the verdict, see the chart, save the check.
 */
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createBoard } from '~/lib/boards/boards.server.ts';
import { newToken } from '~/lib/auth/index.server.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { ARTIFACTS_DIR, BASE_URL, launchBrowser } from '../support/browser.ts';
import { signInAs, type TestUser } from '../support/sessions.ts';
import { closeDb } from '../support/test-db.ts';

let browser: Browser;
let builder: TestUser;
let boardName: string;

beforeAll(async () => {
  browser = await launchBrowser();
  builder = await signInAs('builder@wrenfield.example');
  // A saved board on the builder's shop, saved through the designs module.
  const preset = DEMO_DESIGNS.find((d) => d.id === 'classical-650')!.design;
  boardName = `Classical for the shelf test ${newToken().slice(0, 6)}`;
  await createBoard({ id: builder.id, shopId: builder.shopId }, { design: { ...preset, name: boardName }, instrumentType: 'classical', clientName: '', note: '' });
});

afterAll(async () => {
  await browser?.close();
  await closeDb();
});

/** Slot positions of a 650 mm template shifted 0.3 mm at the nut, as a caliper reports them (0.01 mm). */
function measuredCsv(): string {
  const rows = Array.from({ length: 19 }, (_, i) => `${i + 1},${(650 * (1 - 2 ** (-(i + 1) / 12)) + 0.3).toFixed(2)}`);
  return `fret,from_nut\n${rows.join('\n')}\n`;
}

describe('Template shelf and Template check in Chromium', () => {
  it('adds a template from a design, opens its label PDF, checks an uploaded CSV and saves the verdict', async () => {
    const context = await browser.newContext();
    const [name, value] = builder.cookie.split('=') as [string, string];
    await context.addCookies([{ name, value, url: BASE_URL }]);
    const page = await context.newPage();

    await page.goto(`${BASE_URL}/templates`);
    await expect(page.getByRole('heading', { name: 'Template shelf', level: 1 }).count()).resolves.toBe(1);
    await page.getByLabel('Design', { exact: true }).selectOption({ label: `${boardName} (rev. 1)` });
    await page.getByLabel("Jig key width (design's units)").fill('0.5');
    await page.getByLabel('Material').fill('6 mm aluminium');
    await page.getByRole('button', { name: 'Add template' }).click();
    await page.waitForURL(/\/templates\/\d+$/);
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe(boardName);

    // The label form opens the PDF in a new tab; fetch the same URL with the page's session.
    await page.getByLabel('Label size').selectOption('62x29');
    const action = await page.locator('form[action$="/label"]').getAttribute('action');
    const label = await page.request.get(`${BASE_URL}${action}?size=62x29`);
    expect(label.status()).toBe(200);
    expect(label.headers()['content-type']).toBe('application/pdf');
    expect((await label.body()).subarray(0, 5).toString()).toBe('%PDF-');

    await page.getByLabel('CSV file').check();
    await page.getByLabel(/Measured positions CSV/).setInputFiles({ name: 'measured.csv', mimeType: 'text/csv', buffer: Buffer.from(measuredCsv()) });
    const verdict = page.getByTestId('check-verdict');
    await verdict.waitFor();
    await expect(verdict.textContent()).resolves.toMatch(/^Fail\. .*shifted by a constant \+0\.30 mm at the nut/);
    const chart = page.getByRole('img', { name: /Deviation against fret number/ });
    await expect(chart.count()).resolves.toBe(1);
    await expect(chart.locator('path').count()).resolves.toBeGreaterThan(0); // crosses: slots outside tolerance
    await expect(page.getByRole('table', { name: /Slot by slot/ }).getByRole('row').count()).resolves.toBe(20);
    mkdirSync(ARTIFACTS_DIR, { recursive: true });
    await chart.screenshot({ path: join(ARTIFACTS_DIR, 'template-check-chart.png') });

    await page.getByRole('button', { name: 'Save check' }).click();
    await page.getByText('Saved on the template.').waitFor();
    await page.goto(`${BASE_URL}/templates?q=${encodeURIComponent(boardName)}`);
    await expect(page.getByLabel('Search').inputValue()).resolves.toBe(boardName);
    const row = page.getByRole('row').filter({ hasText: boardName });
    await row.getByText('Fail').waitFor();
    await context.close();
  });

  it('shows the CSV line at fault, offers nothing to save, and edits the shelf record', async () => {
    const context = await browser.newContext();
    const [name, value] = builder.cookie.split('=') as [string, string];
    await context.addCookies([{ name, value, url: BASE_URL }]);
    const page = await context.newPage();
    const created = await page.request.post(`${BASE_URL}/api/templates`, {
      headers: { origin: BASE_URL },
      data: { source: 'typed', name: 'Shelf test: typed 635', units: 'mm', trebleScale: 635, bassScale: 635, frets: 20, slotWidth: 0.6, keyWidth: 0.55 },
    });
    expect(created.status()).toBe(201);
    const { id } = (await created.json()) as { id: number };
    await page.goto(`${BASE_URL}/templates/${id}`);
    await page.getByLabel('CSV file').check();
    await page.getByLabel(/Measured positions CSV/).setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from('fret,from_nut\n1,36.4\n2,abc\n') });
    await expect(page.getByRole('alert').filter({ hasText: 'Line 3' }).textContent()).resolves.toMatch(/from_nut "abc" is not a number/);
    await expect(page.getByRole('button', { name: 'Save check' }).count()).resolves.toBe(0);

    await page.getByText('Edit shelf record').click();
    await page.getByLabel('Condition').selectOption('worn');
    await page.getByLabel('Stored at').fill('Drawer 5');
    await page.getByRole('button', { name: 'Save shelf record' }).click();
    await page.getByText('Saved.', { exact: true }).waitFor();
    const after = await page.request.get(`${BASE_URL}/api/templates/${id}`);
    expect(await after.json()).toMatchObject({ condition: 'worn', storagePlace: 'Drawer 5' });
    await context.close();
  });
});
