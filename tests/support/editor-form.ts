/** Types the fanned 7-string (648/686 mm, perpendicular at fret 8) into the Layout form from the blank preset. */
import type { Page } from 'playwright-core';

export async function typeFannedSevenString(page: Page, name: string): Promise<void> {
  await page.getByLabel('Preset').selectOption({ label: 'Blank design' });
  await page.getByRole('button', { name: 'Start', exact: true }).click();
  await page.getByLabel('Design name').fill(name);
  await page.getByLabel('Strings', { exact: true }).fill('7');
  await page.getByLabel(/^Treble scale length/).fill('648');
  await page.getByLabel(/^Bass scale length/).fill('686');
  await page.getByLabel(/^Perpendicular fret/).fill('8');
  await page.getByLabel('Frets', { exact: true }).fill('24');
  await page.getByLabel(/^String spacing at the nut/).fill('41');
  await page.getByLabel(/^String spacing at the bridge/).fill('63');
}
