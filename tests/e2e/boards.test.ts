import { describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import type { BoardDetail } from '~/lib/schemas/board.ts';
import { BASE_URL, saveScreenshot } from '../support/browser.ts';
import { browserSuite } from '../support/browser-suite.ts';
import { signedInApi } from '../support/signed-in-api.ts';

const suite = browserSuite();

const api = signedInApi(() => suite.builder);

describe('Boards page in Chromium (built server)', () => {
  it('finds a saved fanned 7-string by search, shows its history, restores revision 1 and archives it', async () => {
    const design = { ...structuredClone(DEMO_DESIGNS.find((d) => d.id === 'seven-string-fan')!.design), name: `Fanned seven ${Date.now()}` };
    const board = await api<BoardDetail>('/api/boards', 'POST', { design, clientName: 'Ines Calloway', instrumentType: 'guitar' });

    const context = await suite.browser.newContext();
    await context.addCookies([{ name: SESSION_COOKIE, value: suite.builder.token, url: BASE_URL }]);
    const page = await context.newPage();
    await page.goto(`${BASE_URL}/boards`);
    await page.getByLabel('Search name or client').fill(design.name);
    const row = page.getByRole('row').filter({ has: page.getByRole('link', { name: design.name, exact: true }) });
    // The search goes into the URL after a short pause in typing, then the list is fetched again.
    await page.waitForFunction((name) => new URL(location.href).searchParams.get('q') === name, design.name);
    await page.waitForFunction(() => document.querySelectorAll('tbody tr').length === 1 && !document.querySelector('table[aria-busy="true"]'));
    await row.waitFor();
    await expect(row.getByRole('link', { name: `Open ${design.name}` }).getAttribute('href')).resolves.toBe(`/layout?board=${board.id}`);
    await expect(row.getByRole('link', { name: `Export JSON of ${design.name}` }).getAttribute('href')).resolves.toBe(`/api/boards/${board.id}/export?format=json`);
    const drawing = row.getByRole('img', { name: `Drawing of ${design.name}` });
    await drawing.waitFor();
    await page.waitForFunction((img) => (img as HTMLImageElement).complete && (img as HTMLImageElement).naturalWidth > 0, await drawing.elementHandle());

    // A second revision saved elsewhere (as the editor will), then the page is reloaded from its URL.
    await api(`/api/boards/${board.id}`, 'PATCH', { version: board.version, design: { ...design, perpendicularFret: 7 }, note: 'Perpendicular at 7', saveRevision: true });
    await page.reload();
    await row.waitFor();
    await row.getByRole('button', { name: `History of ${design.name}` }).click();
    const history = page.getByRole('region', { name: 'Revision history' });
    await history.getByText('“Perpendicular at 7”').waitFor();
    await history.getByRole('rowheader', { name: 'Perpendicular fret (0 = nut)' }).waitFor();
    await history.getByRole('button', { name: 'Restore revision 1' }).click();
    // Restore makes revision 1 the working copy again; no new revision is made.
    await history.getByRole('listitem').filter({ hasText: '#1' }).getByText('working copy').waitFor();
    const restored = await api<BoardDetail>(`/api/boards/${board.id}`);
    expect(restored).toMatchObject({ currentRevision: 2, workingRevision: 1, design });
    await saveScreenshot(page, 'boards-history');

    await page.getByRole('button', { name: 'Close history' }).click();
    await row.getByRole('button', { name: `Archive ${design.name}` }).click();
    await page.getByText('No boards match these filters.').waitFor();
    expect((await api<BoardDetail>(`/api/boards/${board.id}`)).status).toBe('archived');
    // Undo right away brings it back; archiving again leaves it to the Archived filter.
    const undo = page.getByRole('status').filter({ hasText: `Archived “${design.name}”` });
    await undo.getByRole('button', { name: 'Undo' }).click();
    await row.getByRole('button', { name: `Archive ${design.name}` }).waitFor();
    expect((await api<BoardDetail>(`/api/boards/${board.id}`)).status).not.toBe('archived');
    expect(await undo.count()).toBe(0);
    await row.getByRole('button', { name: `Archive ${design.name}` }).click();
    await page.getByText('No boards match these filters.').waitFor();
    await page.getByLabel('Status').selectOption('archived');
    await row.getByRole('button', { name: `Unarchive ${design.name}` }).waitFor();
    expect(new URL(page.url()).searchParams.get('status')).toBe('archived');
    await context.close();
  });

  it('shows the demo shop boards with their clients, sorted by scale', async () => {
    const context = await suite.browser.newContext();
    await context.addCookies([{ name: SESSION_COOKIE, value: suite.builder.token, url: BASE_URL }]);
    const page = await context.newPage();
    await page.goto(`${BASE_URL}/boards?q=Demo%3A&sort=scale`);
    await page.getByRole('link', { name: 'Demo: mandolin, 13.875 in', exact: true }).waitFor();
    const names = await page.locator('tbody tr td:nth-child(2) a').allTextContents();
    // Sorted by treble scale: mandolin 352.425 mm, ukulele 431.8 mm, then the guitars and the bass.
    expect(names.slice(0, 2)).toEqual(['Demo: mandolin, 13.875 in', 'Demo: tenor ukulele, 17 in, zero fret']);
    await expect(page.getByRole('row').filter({ hasText: 'Demo: mandolin' }).getByText('Ines Calloway').count()).resolves.toBe(1);
    await saveScreenshot(page, 'boards');

    const uke = { ...DEMO_DESIGNS.find((d) => d.id === 'tenor-ukulele')!.design, name: `Imported uke ${Date.now()}` };
    await page.getByLabel('Import a design (JSON file, up to 256 KiB)').setInputFiles({ name: 'uke.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(uke)) });
    await page.getByText(`Imported as “${uke.name}”.`).waitFor();
    await page.getByLabel('Import a design (JSON file, up to 256 KiB)').setInputFiles({ name: 'bad.json', mimeType: 'application/json', buffer: Buffer.from('{"name": "x"}') });
    await page.getByRole('alert').filter({ hasText: 'Not imported: units' }).waitFor();
    await context.close();
  });
});
