import { readFile } from 'node:fs/promises';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, launchBrowser, saveScreenshot } from '../support/browser.ts';
import { pageText, readPdf } from '../support/pdf-readback.ts';
import sevenStringFan from '../../src/lib/boards/demo/seven-string-fan.json';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

describe('Export a design page in Chromium (built server)', () => {
  it('downloads a tiled A4 paper template of the chosen preset, with the tiling preview matching its pages', async () => {
    const context = await browser.newContext({ acceptDownloads: true });
    const page = await context.newPage();
    await page.goto(`${BASE_URL}/export`, { waitUntil: 'networkidle' });
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe('Export a design');
    await page.getByLabel('Demo preset').selectOption('short-scale-bass');
    await page.getByLabel('Paper', { exact: true }).selectOption('a4');
    await page.getByLabel('Overlap between pages (mm)').fill('15');
    const previewPages = Number(await page.getByRole('img', { name: /Page tiling/ }).getAttribute('data-pages'));
    expect(previewPages).toBeGreaterThan(1);
    await expect(page.getByRole('complementary', { name: 'Safety note' }).textContent()).resolves.toContain(
      'eye and hearing protection',
    );

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download Paper template (PDF)' }).click(),
    ]);
    expect(download.suggestedFilename()).toMatch(/-paper-template\.pdf$/);
    const bytes = new Uint8Array(await readFile((await download.path())!));
    const pages = await readPdf(bytes);
    expect(pages.length).toBe(previewPages);
    // ISO 216 A4 is 210 x 297 mm = 595.28 x 841.89 pt, in either orientation.
    const sides = [pages[0]!.widthPt, pages[0]!.heightPt].sort((a, b) => a - b);
    expect(Math.abs(sides[0]! - 595.2756)).toBeLessThan(0.01);
    expect(Math.abs(sides[1]! - 841.8898)).toBeLessThan(0.01);
    expect(pageText(bytes, 1)).toContain('Measure both bars before cutting.');
    await expect(page.getByRole('status').textContent()).resolves.toMatch(/Downloaded .*paper-template\.pdf/);
    await saveScreenshot(page, 'export-panel');
    await context.close();
  });

  it('shows an overlap that is too large next to the field and disables the downloads', async () => {
    const page = await browser.newPage();
    await page.goto(`${BASE_URL}/export`, { waitUntil: 'networkidle' });
    await page.getByLabel('Overlap between pages (mm)').fill('500');
    await expect(page.locator('#export-overlap-error').textContent()).resolves.toMatch(/must be less than/);
    expect(await page.getByRole('button', { name: 'Download Slot paths (DXF)' }).isDisabled()).toBe(true);
  });
});

describe('Export panel messages next to the download buttons (Chromium, built server)', () => {
  const largest = { ...sevenStringFan, name: 'Largest board', strings: 16, frets: 36, scale: { treble: 5000, bass: 5000 }, perpendicularFret: 0, stringSpacing: { nut: 5000, bridge: 5000 }, radius: { nut: 0 }, markers: [] };
  const problem = (status: number, body: unknown, headers: Record<string, string> = {}) => ({
    status,
    headers: { 'content-type': 'application/json; charset=utf-8', ...headers },
    body: JSON.stringify(body),
  });

  it('says which option to change for a template over the page cap (the server\'s 422), when to retry when busy, and the error id of a server error', async () => {
    const page = await browser.newPage();
    await page.goto(`${BASE_URL}/export`, { waitUntil: 'networkidle' });
    await page.getByLabel('Design as JSON').fill(JSON.stringify(largest));
    await page.getByLabel('Overlap between pages (mm)').fill('99.9');
    const pdfButton = page.getByRole('button', { name: 'Download Paper template (PDF)' });
    const status = page.getByRole('status');

    await pdfButton.click();
    await status.getByText(/^Too large:/).waitFor();
    await expect(status.textContent()).resolves.toMatch(
      /^Too large: this paper template would print \d{1,2},\d{3} pages; the most is 200: use a larger paper, less overlap or paper "fit"$/,
    );
    await saveScreenshot(page, 'export-panel-too-large');

    // A full export queue and an unexpected failure, as the server answers them (src/lib/export/worker/run-export.server.ts).
    await page.route('**/api/export?*', (route) =>
      route.fulfill(problem(503, { error: 'The export queue is full: try again in 7 s.', retryAfter: 7 }, { 'retry-after': '7' })),
    );
    await pdfButton.click();
    await status.getByText('The server is busy: try again in 7 s.').waitFor();

    await page.unroute('**/api/export?*');
    await page.route('**/api/export?*', (route) =>
      route.fulfill(problem(500, { error: 'The export failed on the server: try again.', errorId: '0a1b2c3d4e5f' })),
    );
    await pdfButton.click();
    await status.getByText('The export failed on the server: try again (error id 0a1b2c3d4e5f).').waitFor();
    await page.close();
  });
});

describe('POST /api/export on the built server', () => {
  const post = (query: string, body: unknown, origin = BASE_URL) =>
    fetch(`${BASE_URL}/api/export${query}`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin },
      body: JSON.stringify(body),
    });

  it('serves a DXF attachment in millimetres and answers bad options with 400 naming them', async () => {
    const response = await post('?format=dxf&slots=outlines', sevenStringFan);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-disposition')).toBe(
      'attachment; filename="demo-seven-string-multi-scale-guitar-slot-paths.dxf"',
    );
    expect(await response.text()).toMatch(/\$INSUNITS\n70\n4\n/);
    const bad = await post('?format=pdf&paper=quarto', sevenStringFan);
    expect(bad.status).toBe(400);
    expect(await bad.json()).toMatchObject({ field: 'paper' });
  });

  it('refuses a cross-site POST (403)', async () => {
    expect((await post('?format=csv', sevenStringFan, 'http://evil.example')).status).toBe(403);
  });
});
