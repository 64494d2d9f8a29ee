/**
 * The client's page on a phone (390×844 CSS px): the proof from the link and the signed-in
 * client's shared proof show the drawing (the editor's picture), the key numbers in words and the
 * two answers, nothing from the builder's tools, and no sideways scrolling; the answer works there.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { BASE_URL, launchBrowser, saveScreenshot } from '../support/browser.ts';
import { ensureDesign } from '../support/designs.ts';
import { readScene, waitForDrawing } from '../support/konva-scene.ts';
import { signInAs, type TestUser } from '../support/sessions.ts';
import { shopRows } from '../support/shop-rows.ts';
import { closeDb } from '../support/test-db.ts';

const PHONE = { width: 390, height: 844 };

let browser: Browser;
let builder: TestUser;
let client: TestUser;
let boardId: number;

beforeAll(async () => {
  browser = await launchBrowser();
  builder = await signInAs('builder@wrenfield.example');
  client = await signInAs('client@wrenfield.example');
  boardId = await ensureDesign(builder.shopId, builder.id, 'Seven-string', 'seven-string-fan');
});
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

async function expectClientsPage(page: Page): Promise<void> {
  await waitForDrawing(page);
  const widths = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, viewport: window.innerWidth }));
  expect(widths.scroll, 'no sideways scrolling').toBeLessThanOrEqual(widths.viewport);
  await page.getByRole('heading', { level: 1, name: 'Demo: seven-string multi-scale guitar' }).waitFor();
  // The key numbers in words.
  const specs = page.getByRole('region', { name: 'Key specifications' });
  expect(await specs.innerText()).toContain('648.00 mm on the treble side to 686.00 mm on the bass side');
  // The drawing is the editor's picture: every fret the key numbers name.
  const frets = Number((await specs.getByRole('definition').nth(3).innerText()).trim());
  expect(await specs.getByRole('term').nth(3).innerText()).toBe('Frets');
  expect(frets).toBeGreaterThan(0);
  expect((await readScene(page)).frets.map((f) => f.fret)).toEqual(Array.from({ length: frets }, (_, i) => i + 1));
  const stage = await page.getByRole('application', { name: /Drawing of the board/ }).boundingBox();
  expect(stage!.x + stage!.width).toBeLessThanOrEqual(PHONE.width);
  // Nothing from the builder's tools.
  for (const tool of ['Screen calibration', 'Measure', '1:1 on screen', 'Download CSV', 'Copy CSV', 'Save to Boards']) {
    expect(await page.getByRole('button', { name: tool, exact: true }).count(), tool).toBe(0);
  }
  expect(await page.getByRole('toolbar', { name: 'Layout tools' }).count()).toBe(0);
  expect(await page.getByRole('tab').count()).toBe(0);
  expect(await page.getByLabel('Strings', { exact: true }).count()).toBe(0);
}

describe('the proof page on a phone (390×844)', () => {
  it('from the link: readable with no sideways scroll, and the client approves there', async () => {
    const rows = await shopRows(builder.shopId, builder.id, `phone-${Date.now()}@wrenfield.example`, 'Phone proof', boardId);
    const context = await browser.newContext({ viewport: PHONE, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    await page.goto(`${BASE_URL}/p/${rows.proofToken}`, { waitUntil: 'networkidle' });
    await expectClientsPage(page);
    await saveScreenshot(page, 'proof-phone');

    const approve = page.getByRole('form', { name: 'Approve' });
    await approve.getByLabel('Your name').fill('Ines Calloway');
    await approve.getByRole('checkbox').check();
    const button = approve.getByRole('button', { name: 'Approve' });
    await button.scrollIntoViewIfNeeded();
    const box = (await button.boundingBox())!;
    // Reachable: wholly on the screen once scrolled to, wide enough to tap (WCAG 2.2 SC 2.5.8: 24 px).
    expect(box.x).toBeGreaterThanOrEqual(0);
    expect(box.x + box.width).toBeLessThanOrEqual(PHONE.width);
    expect(box.y).toBeGreaterThanOrEqual(0);
    expect(box.y + box.height).toBeLessThanOrEqual(PHONE.height);
    expect(Math.min(box.width, box.height)).toBeGreaterThanOrEqual(24);
    await button.tap();
    await page.getByRole('heading', { name: /^Approved by Ines Calloway on / }).waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await context.close();
  });

  it('the signed-in client\'s shared proof: the same page, and a request for changes with a message', async () => {
    const rows = await shopRows(builder.shopId, builder.id, client.email, 'Phone shared proof', boardId);
    const context = await browser.newContext({ viewport: PHONE, isMobile: true, hasTouch: true });
    await context.addCookies([{ name: SESSION_COOKIE, value: client.token, url: BASE_URL }]);
    const page = await context.newPage();
    await page.goto(`${BASE_URL}/shared/${rows.proofId}`, { waitUntil: 'networkidle' });
    await expectClientsPage(page);
    const changes = page.getByRole('form', { name: 'Request changes' });
    await changes.getByLabel('Your name').fill('Ines Calloway');
    await changes.getByLabel(/What should change/).fill('A little more room at the bass side, please.');
    await changes.getByRole('button', { name: 'Request changes' }).tap();
    await page.getByRole('heading', { name: /^Changes requested by Ines Calloway on / }).waitFor();
    expect(await page.getByText('A little more room at the bass side, please.').count()).toBe(1);
    await context.close();
  });
});
