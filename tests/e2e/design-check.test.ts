/**
 * Template check against a saved design in Chromium on the built app: from the Boards row action
 * to the check page of the demo 650 mm classical board, upload positions measured on a template
 * made for 628.65 mm, read "made for another scale" with the best fit, see the chart, and keep
 * the check by adding the template to the shelf. Also the shelf's filters kept in the URL.
 */
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { BrowserContext } from 'playwright-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { newToken } from '~/lib/auth/index.server.ts';
import { ARTIFACTS_DIR, BASE_URL } from '../support/browser.ts';
import { browserSuite } from '../support/browser-suite.ts';
import { ensureDesign } from '../support/designs.ts';

const suite = browserSuite();
let classicalId: number;

beforeAll(async () => {
  classicalId = await ensureDesign(suite.builder.shopId, suite.builder.id, '650 mm classical', 'classical-650');
});

async function signedIn(): Promise<BrowserContext> {
  const context = await suite.browser.newContext();
  const [name, value] = suite.builder.cookie.split('=') as [string, string];
  await context.addCookies([{ name, value, url: BASE_URL }]);
  return context;
}

/** Slot positions of a template made for 628.65 mm, as a caliper reports them (0.01 mm), 19 frets. */
function measuredCsv(): string {
  const rows = Array.from({ length: 19 }, (_, i) => `${i + 1},${(628.65 * (1 - 2 ** (-(i + 1) / 12))).toFixed(2)}`);
  return `fret,from_nut\n${rows.join('\n')}\n`;
}

describe('Template check against a saved design in Chromium', () => {
  it('finds a template made for another scale with its best fit, charts it, and keeps the check on the shelf', async () => {
    const context = await signedIn();
    const page = await context.newPage();

    await page.goto(`${BASE_URL}/boards?q=${encodeURIComponent('650 mm classical')}`);
    // Other tests may save boards of the same name; any of them will do.
    await page.getByRole('link', { name: 'Check a template against Demo: 650 mm classical guitar', exact: true }).first().click();
    await page.waitForURL(/\/boards\/\d+\/check$/);
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe('Template check: Demo: 650 mm classical guitar');

    await page.getByLabel('CSV file').check();
    await page.getByLabel(/Measured positions CSV/).setInputFiles({ name: 'old-master.csv', mimeType: 'text/csv', buffer: Buffer.from(measuredCsv()) });
    const verdict = page.getByTestId('check-verdict');
    await verdict.waitFor();
    await expect(verdict.textContent()).resolves.toMatch(/^Fail\. .*fit a 628\.65 mm scale, not 650\.00 mm/);
    await expect(page.getByTestId('check-diagnosis').textContent()).resolves.toBe('Made for another scale: best fit 628.65 mm');
    await expect(page.locator('li', { hasText: /^Best-fit scale: 628\.65 mm \(design 650\.00 mm/ }).count()).resolves.toBe(1);
    const chart = page.getByRole('img', { name: /Deviation against fret number for Demo: 650 mm classical guitar/ });
    await expect(chart.locator('path').count()).resolves.toBeGreaterThan(0); // crosses: slots outside tolerance
    mkdirSync(ARTIFACTS_DIR, { recursive: true });
    await chart.screenshot({ path: join(ARTIFACTS_DIR, 'design-check-chart.png') });

    // Keeping the check is optional; it adds the measured template to the shelf with the check.
    await expect(page.getByRole('button', { name: 'Save check' }).count()).resolves.toBe(0);
    const name = `Found in the drawer ${newToken().slice(0, 6)}`;
    await page.getByLabel(/^Template name/).fill(name);
    await page.getByRole('button', { name: 'Add to Template shelf with this check' }).click();
    await page.getByText('Enter the width of the jig key that drops into the slots').waitFor();
    await page.getByLabel('Jig key width (mm)').fill('0.5');
    await page.getByRole('button', { name: 'Add to Template shelf with this check' }).click();
    await page.getByRole('link', { name }).click();
    await page.waitForURL(/\/templates\/\d+$/);
    await expect(page.getByText(/^Demo: 650 mm classical guitar, revision \d+$/).count()).resolves.toBe(1);
    await expect(page.getByRole('region', { name: 'Saved checks' }).getByText('Fail', { exact: true }).count()).resolves.toBe(1);
    await context.close();
  });

  it("answers 404 for a revision the design does not have, and another shop's design", async () => {
    const context = await signedIn();
    const page = await context.newPage();
    expect((await page.goto(`${BASE_URL}/boards/${classicalId}/check?revision=999999`))!.status()).toBe(404);
    expect((await page.goto(`${BASE_URL}/boards/2000000000/check`))!.status()).toBe(404);
    await context.close();
  });

  it('keeps the shelf filters in the URL: a linked view opens filtered, a change updates the URL, Back restores it', async () => {
    const context = await signedIn();
    const page = await context.newPage();
    const oldMaster = 'Old 628.65 mm steel-string master';
    await page.goto(`${BASE_URL}/templates?q=628.65&condition=worn&lastResult=pass`);
    await expect(page.getByLabel('Condition').inputValue()).resolves.toBe('worn');
    await expect(page.getByLabel('Last check').inputValue()).resolves.toBe('pass');
    const row = page.getByRole('row').filter({ hasText: oldMaster });
    await row.getByText('Pass').waitFor();
    await page.getByLabel('Last check').selectOption('never');
    await page.waitForURL(/lastResult=never/);
    await page.getByText('No templates match.').waitFor();
    await page.goBack();
    await page.waitForURL(/lastResult=pass/);
    await row.getByText('Pass').waitFor();
    await expect(page.getByLabel('Last check').inputValue()).resolves.toBe('pass');
    // Sorting by a column header goes into the URL too (newest first is the default direction,
    // so it is left out), and the header says the order.
    const header = page.getByRole('columnheader', { name: /Last check/ });
    await page.getByRole('button', { name: 'Last check' }).click();
    await page.waitForURL(/sort=lastChecked$/);
    await expect(header.getAttribute('aria-sort')).resolves.toBe('descending');
    await page.getByRole('button', { name: /Last check/ }).click();
    await page.waitForURL(/sort=lastChecked&dir=asc$/);
    await expect(header.getAttribute('aria-sort')).resolves.toBe('ascending');
    await context.close();
  });
});
