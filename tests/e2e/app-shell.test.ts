import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, launchBrowser, saveScreenshot } from '../support/browser.ts';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

describe('app shell in Chromium (built server)', () => {
  it('renders the home page, the areas in the navigation and requests nothing from other hosts', async () => {
    const page = await browser.newPage();
    const hosts = new Set<string>();
    page.on('request', (r) => hosts.add(new URL(r.url()).hostname));
    await page.goto(`${BASE_URL}/`, { waitUntil: 'networkidle' });
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toMatch(/Fret slots/);
    const nav = page.getByRole('navigation', { name: 'Main' });
    for (const area of ['Layout', 'Safety']) {
      expect(await nav.getByRole('link', { name: area, exact: true }).count()).toBe(1);
    }
    expect([...hosts]).toEqual(['127.0.0.1']);
    await saveScreenshot(page, 'home');
  });

  it('serves the monospace font from the app itself', async () => {
    const page = await browser.newPage();
    const fonts: string[] = [];
    page.on('response', (r) => {
      if (/\.woff2?$/.test(new URL(r.url()).pathname) && r.ok()) fonts.push(r.url());
    });
    await page.goto(`${BASE_URL}/`, { waitUntil: 'networkidle' });
    await page.evaluate(() => document.fonts.load('16px "JetBrains Mono"'));
    await page.waitForLoadState('networkidle');
    expect(fonts.length).toBeGreaterThan(0);
    for (const url of fonts) expect(url.startsWith(BASE_URL)).toBe(true);
  });

  it('answers an unknown page with the 404 page', async () => {
    const page = await browser.newPage();
    const response = await page.goto(`${BASE_URL}/no-such-page`);
    expect(response?.status()).toBe(404);
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toBe('Nothing here');
  });
});
