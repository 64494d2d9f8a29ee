/**
 * The README's screenshots: the editor, the board list and the proof page at 1280×720 (a laptop)
 * and 390×844 (a phone), as the demo builder and a client see them. Written to test-results/
 * screenshots on every run; `npm run screenshots` writes them to docs/screenshots instead.
 */
import { mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { ARTIFACTS_DIR, BASE_URL, launchBrowser } from '../support/browser.ts';
import { ensureDesign } from '../support/designs.ts';
import { waitForDrawing } from '../support/konva-scene.ts';
import { signInAs, type TestUser } from '../support/sessions.ts';
import { shopRows, type ShopRows } from '../support/shop-rows.ts';
import { closeDb } from '../support/test-db.ts';

const OUT = process.env.SCREENSHOTS_DIR ?? join(ARTIFACTS_DIR, 'screenshots');
const SIZES = { laptop: { width: 1280, height: 720 }, phone: { width: 390, height: 844 } } as const;

let browser: Browser;
let builder: TestUser;
let rows: ShopRows;

beforeAll(async () => {
  browser = await launchBrowser();
  builder = await signInAs('builder@wrenfield.example');
  const boardId = await ensureDesign(builder.shopId, builder.id, 'Seven-string', 'seven-string-fan');
  rows = await shopRows(builder.shopId, builder.id, 'client@wrenfield.example', 'Screenshot proof', boardId);
  mkdirSync(OUT, { recursive: true });
});
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

/** Width and height from a PNG's IHDR chunk (PNG specification, section 11.2.2). */
function pngSize(path: string): { width: number; height: number } {
  const bytes = readFileSync(path);
  expect(bytes.subarray(1, 4).toString('latin1')).toBe('PNG');
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}

async function shoot(page: Page, name: string, size: { width: number; height: number }): Promise<void> {
  const path = join(OUT, `${name}.png`);
  await page.screenshot({ path, animations: 'disabled' });
  expect(pngSize(path)).toEqual(size);
}

describe('screenshots for the README', () => {
  for (const [label, size] of Object.entries(SIZES)) {
    it(`the editor, the board list and the proof page at ${size.width}×${size.height}`, async () => {
      const context = await browser.newContext({ viewport: size, deviceScaleFactor: 1 });
      await context.addCookies([{ name: SESSION_COOKIE, value: builder.token, url: BASE_URL }]);
      const page = await context.newPage();
      await page.goto(`${BASE_URL}/layout?board=${rows.boardId}`, { waitUntil: 'networkidle' });
      await waitForDrawing(page);
      await shoot(page, `editor-${label}`, size);

      await page.goto(`${BASE_URL}/boards`, { waitUntil: 'networkidle' });
      await page.getByRole('table').first().waitFor();
      await shoot(page, `boards-${label}`, size);

      const client = await browser.newContext({ viewport: size, deviceScaleFactor: 1 });
      const proof = await client.newPage();
      await proof.goto(`${BASE_URL}/p/${rows.proofToken}`, { waitUntil: 'networkidle' });
      await waitForDrawing(proof);
      await shoot(proof, `proof-${label}`, size);
      await client.close();
      await context.close();
    });
  }
});
