/**
 * The Fret wire page in Chromium on the built app, as the demo builder: the three generic sizes
 * marked "from memory", adding a wire with the keyboard, and a bad size named next to the form.
 */
import { describe, expect, it } from 'vitest';
import { newToken } from '~/lib/auth/index.server.ts';
import { BASE_URL, saveScreenshot } from '../support/browser.ts';
import { browserSuite } from '../support/browser-suite.ts';

const suite = browserSuite();

describe('Fret wire page (Chromium, built server)', () => {
  it('lists the generic sizes from memory, adds a wire typed with the keyboard, and names a bad size', async () => {
    const context = await suite.browser.newContext();
    const [name, value] = suite.builder.cookie.split('=') as [string, string];
    await context.addCookies([{ name, value, url: BASE_URL }]);
    const page = await context.newPage();
    await page.goto(`${BASE_URL}/fret-wire`, { waitUntil: 'networkidle' });
    const table = page.getByRole('table', { name: /Fret wire the shop uses/ });
    for (const generic of ['Generic narrow', 'Generic medium', 'Generic jumbo']) {
      await expect(table.getByRole('row', { name: new RegExp(generic) }).textContent()).resolves.toContain('from memory');
    }

    const form = page.getByRole('form', { name: 'Add fret wire' });
    const wireName = `Keyboard wire ${newToken().slice(0, 6)}`;
    await form.getByLabel('Name').focus();
    for (const text of [wireName, '2.4', '1.1', '0.5', '1.5', '0.4', '610', 'measured']) {
      await page.keyboard.type(text);
      await page.keyboard.press('Tab');
    }
    await page.keyboard.press('Enter');
    // Barbs (0.4 mm) narrower than the tang (0.5 mm): refused, naming the field.
    await form.getByRole('alert').getByText(/barbWidthMm: must be wider than the tang/).waitFor();
    expect(await form.getByLabel('Barb width (mm)').getAttribute('aria-invalid')).toBe('true');

    await form.getByLabel('Barb width (mm)').fill('0.7');
    await form.getByRole('button', { name: 'Add wire' }).press('Enter');
    await page.getByRole('status').getByText(`Saved ${wireName}.`).waitFor();
    await expect(table.getByRole('row', { name: new RegExp(wireName) }).textContent()).resolves.toContain('0.70');
    await saveScreenshot(page, 'fret-wire');
    await context.close();
  });
});
