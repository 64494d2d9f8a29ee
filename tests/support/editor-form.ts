/** Types the fanned 7-string (648/686 mm, perpendicular at fret 8) into the Layout form from the blank preset. */
import type { Page } from 'playwright-core';

export async function typeFannedSevenString(page: Page, name: string): Promise<void> {
  await page.getByLabel('Preset').selectOption({ label: 'Blank design' });
  await page.getByRole('button', { name: 'Start', exact: true }).click();
  await page.getByLabel('Design name').fill(name);
  // The fan's scales are given along the outer strings (the blank board quotes the centre line).
  await page.getByLabel('along each outer string').check();
  await page.getByLabel('Strings', { exact: true }).fill('7');
  await page.getByLabel(/^Treble scale length/).fill('648');
  await page.getByLabel(/^Bass scale length/).fill('686');
  await page.getByLabel(/^Perpendicular fret/).fill('8');
  await page.getByLabel('Frets', { exact: true }).fill('24');
  await page.getByLabel(/^String spacing at the nut/).fill('41');
  await page.getByLabel(/^String spacing at the bridge/).fill('63');
}

/**
 * Waits until the editor has kept the typed fanned 7-string as its scratch design (this browser's
 * storage): the form is valid, the drawing shows it, and the autosave has caught up.
 */
export async function waitUntilFannedSevenStringKept(page: Page, name: string): Promise<void> {
  await page.waitForFunction(
    (wanted) => {
      const kept = JSON.parse(localStorage.getItem('kerfline.scratchDesign') ?? '{}') as Record<string, unknown>;
      const scale = kept.scale as { treble?: number; bass?: number } | undefined;
      const spacing = kept.stringSpacing as { nut?: number; bridge?: number } | undefined;
      return kept.name === wanted && kept.strings === 7 && scale?.treble === 648 && scale.bass === 686 && kept.perpendicularFret === 8
        && kept.frets === 24 && spacing?.nut === 41 && spacing.bridge === 63;
    },
    name,
    { timeout: 10_000 },
  );
  await page.getByRole('status').filter({ hasText: /^Saved$/ }).waitFor();
}
