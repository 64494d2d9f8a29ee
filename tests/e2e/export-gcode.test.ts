/**
 * The Export panel's G-code part in Chromium on the built server: options labelled with units,
 * the toolpath preview and run-time estimate, and the G-code download, read back with the npm
 * G-code reader gcode-toolpath (cncjs) to the same number of moves the preview drew.
 */
import { readFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, launchBrowser, saveScreenshot } from '../support/browser.ts';

type Reader = new (options: { addLine: (modal: { motion: string; units: string }, v1: unknown, v2: unknown) => void }) => { loadFromStringSync(text: string): unknown };
const Toolpath = createRequire(import.meta.url)('gcode-toolpath') as Reader;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

describe('Export panel: slot toolpath (Chromium, built server)', () => {
  it('previews the toolpath, estimates the time and downloads G-code a G-code reader takes move for move', async () => {
    const context = await browser.newContext({ acceptDownloads: true });
    const page = await context.newPage();
    await page.goto(`${BASE_URL}/export`, { waitUntil: 'networkidle' });
    await page.getByLabel('Demo preset').selectOption('seven-string-fan');
    await page.getByLabel('Controller').selectOption('grbl');
    // Keyboard only: type the pass depth and leave the field with Tab.
    await page.getByLabel('Deepest cut per pass (mm)').focus();
    await page.keyboard.type('1.5');
    await page.keyboard.press('Tab');
    const preview = page.getByRole('img', { name: /Toolpath preview/ });
    await preview.waitFor();
    const moves = Number(await preview.getAttribute('data-moves'));
    expect(moves).toBeGreaterThan(25 * 4);
    await expect(page.getByTestId('run-time').textContent()).resolves.toMatch(/^Estimated run time \d+\.\d min/);
    // Cuts drawn in shades of the depth ramp (at most 8 paths), rapids dashed apart from them.
    const shades = await preview.locator('[data-kind="cut"]').count();
    expect(shades).toBeGreaterThan(1);
    expect(shades).toBeLessThanOrEqual(8);
    expect(await preview.locator('[data-kind="rapid"]').count()).toBe(1);

    // The cut list table: one row per fret plus the total; the demo fan names no fret wire.
    const cutList = page.getByRole('table', { name: /Cut list/ });
    await expect(cutList.getByRole('row').count()).resolves.toBe(1 + 24 + 1);
    await page.getByText('No fret wire chosen for this board (Layout, "Fret wire").').waitFor();
    await page.getByLabel('Wire stock length (mm)').fill('610');
    await page.getByTestId('stock-count').getByText(/^3 stock pieces of 610\.00 mm/).waitFor();

    const button = page.getByRole('button', { name: 'Download Slot toolpath (G-code)' });
    await button.focus();
    const [download] = await Promise.all([page.waitForEvent('download'), page.keyboard.press('Enter')]);
    expect(download.suggestedFilename()).toBe('demo-seven-string-multi-scale-guitar-slot-toolpath.nc');
    const text = await readFile((await download.path())!, 'utf8');
    expect(text).toMatch(/^G21 G90 G17 G94$/m);
    expect(text).not.toMatch(/^G64/m);
    expect(text).toMatch(/passes of at most 1\.5000/);
    const read: string[] = [];
    new Toolpath({ addLine: (modal) => read.push(modal.motion) }).loadFromStringSync(text);
    // The preview's moves, plus the start (safe Z, then over the origin) and the last return to safe Z.
    expect(read.length).toBe(moves + 3);
    await saveScreenshot(page, 'export-gcode');
    await context.close();
  });

  it('names a cutter wider than the slot next to its field and refuses the download', async () => {
    const page = await browser.newPage();
    await page.goto(`${BASE_URL}/export`, { waitUntil: 'networkidle' });
    await page.getByLabel('Demo preset').selectOption('seven-string-fan');
    await page.getByLabel('Cutter diameter (mm)').fill('0.9');
    await expect(page.locator('#export-toolDiameter-error').textContent()).resolves.toMatch(/must not be wider than the slot/);
    await page.getByRole('button', { name: 'Download Slot toolpath (G-code)' }).click();
    await page.getByRole('status').getByText(/toolDiameter|wider than the slot/).waitFor();
    await page.close();
  });
});
