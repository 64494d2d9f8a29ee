/** Debian's Chromium driven by playwright-core (Playwright's own browser download cannot work here). */
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';

export const BASE_URL = process.env.TEST_APP_URL ?? 'http://127.0.0.1:4321';
export const ARTIFACTS_DIR = process.env.ARTIFACTS_DIR ?? 'test-results';

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: '/usr/bin/chromium',
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

/** Saves a screenshot under test-results/ and returns its path. */
export async function saveScreenshot(page: Page, name: string): Promise<string> {
  mkdirSync(ARTIFACTS_DIR, { recursive: true });
  const path = join(ARTIFACTS_DIR, `${name}.png`);
  await page.screenshot({ path, fullPage: true });
  return path;
}
