/**
 * The Layout editor and Boards together, in Chromium on the built server: a builder saves a
 * scratch design to Boards, finds it, edits it (autosave, then "Save revision"), restores the first
 * revision from the editor's history and archives it; a save that lost a race keeps the edit.
 */
import type { BrowserContext, Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import type { BoardDetail } from '~/lib/schemas/board.ts';
import { BASE_URL, saveScreenshot } from '../support/browser.ts';
import { browserSuite } from '../support/browser-suite.ts';
import { typeFannedSevenString, waitUntilFannedSevenStringKept } from '../support/editor-form.ts';
import { readScene } from '../support/konva-scene.ts';
import { signInAs, type TestUser } from '../support/sessions.ts';
import { signedInApi } from '../support/signed-in-api.ts';

const suite = browserSuite();

const api = signedInApi(() => suite.builder);

async function signedInContext(user: TestUser): Promise<BrowserContext> {
  const context = await suite.browser.newContext({ viewport: { width: 1400, height: 1000 } });
  await context.addCookies([{ name: SESSION_COOKIE, value: user.token, url: BASE_URL }]);
  return context;
}

const savedBadge = (page: Page) => page.getByRole('status').filter({ hasText: /^Saved$/ });
const keptGroup = (page: Page) => page.getByRole('group', { name: 'Where this design is kept' });

function boardIdIn(url: string): number {
  return Number(new URL(url).searchParams.get('board'));
}

describe('Layout editor and Boards in Chromium (built server)', () => {
  it('saves the fanned 7-string to Boards, finds it, autosaves an edit, restores revision 1 from the history and archives it', async () => {
    const name = `Fanned seven ${Date.now()}`;
    const context = await signedInContext(suite.builder);
    const page = await context.newPage();
    await page.goto(`${BASE_URL}/layout`, { waitUntil: 'networkidle' });

    // The fanned 7-string 648/686 mm, perpendicular at fret 8, from the blank preset by typing.
    await typeFannedSevenString(page, name);
    await waitUntilFannedSevenStringKept(page, name);
    expect((await readScene(page)).frets.length).toBe(24);

    await page.getByRole('button', { name: 'Save to Boards' }).click();
    await page.waitForURL(/\/layout\?board=\d+$/);
    const id = boardIdIn(page.url());
    await savedBadge(page).waitFor();
    const first = await api<BoardDetail>(`/api/boards/${id}`);
    expect(first).toMatchObject({ name, currentRevision: 1, status: 'draft', design: { strings: 7, scale: { treble: 648, bass: 686 }, perpendicularFret: 8, frets: 24 } });

    // Found in Boards by search, and opened from there.
    await page.goto(`${BASE_URL}/boards`);
    await page.getByLabel('Search name or client').fill(name);
    await page.waitForFunction((n) => new URL(location.href).searchParams.get('q') === n, name);
    const row = page.getByRole('row').filter({ has: page.getByRole('link', { name, exact: true }) });
    await row.waitFor();
    expect(await row.locator('[data-label="status"]').textContent()).toBe('Draft');
    await row.getByRole('link', { name: `Open ${name}` }).click();
    await page.waitForURL(`${BASE_URL}/layout?board=${id}`);
    await expect(page.getByLabel('Design name').inputValue()).resolves.toBe(name);
    await savedBadge(page).waitFor();

    // An edit shows as unsaved, and leaving the page then asks first (the edit stays).
    await page.getByLabel(/^Perpendicular fret/).fill('7');
    await page.getByRole('status').filter({ hasText: /^(Unsaved changes|Saving…)$/ }).waitFor();
    const asked = page.waitForEvent('dialog');
    await page.close({ runBeforeUnload: true });
    const dialog = await asked;
    expect(dialog.type()).toBe('beforeunload');
    await dialog.dismiss();
    expect(page.isClosed()).toBe(false);

    // Autosave keeps the edit in the working copy, not as a revision; "Save revision" makes
    // revision 2, and the history lists both and compares them field by field.
    await keptGroup(page).filter({ hasText: 'Changes not yet in a revision' }).waitFor();
    await savedBadge(page).waitFor();
    await page.getByRole('tab', { name: 'History' }).click();
    const history = page.getByRole('region', { name: 'Revision history' });
    await history.getByLabel('Revision note (optional)').fill('Perpendicular at 7');
    await history.getByRole('button', { name: 'Save revision' }).click();
    await keptGroup(page).filter({ hasText: 'Revision 2' }).waitFor();
    await history.getByText('“Perpendicular at 7”').waitFor();
    await history.getByRole('button', { name: 'Restore revision 1' }).waitFor();
    expect(await history.getByRole('listitem').count()).toBe(2);
    // The compare table names fields as the form does, not by their keys.
    await history.getByRole('rowheader', { name: 'Perpendicular fret (0 = nut)' }).waitFor();
    expect(await history.getByRole('rowheader').allInnerTexts()).toEqual(['Perpendicular fret (0 = nut)']);
    await saveScreenshot(page, 'boards-editor-history');

    // Restoring revision 1 makes it the working copy again (no new revision), and the form shows it.
    await history.getByRole('button', { name: 'Restore revision 1' }).click();
    await keptGroup(page).filter({ hasText: 'Revision 1' }).waitFor();
    await expect(page.getByLabel(/^Perpendicular fret/).inputValue()).resolves.toBe('8');
    const restored = await api<BoardDetail>(`/api/boards/${id}`);
    expect(restored).toMatchObject({ currentRevision: 2, workingRevision: 1 });
    expect(restored.design).toEqual(first.design);
    await savedBadge(page).waitFor();

    // Archived from Boards.
    await page.goto(`${BASE_URL}/boards?q=${encodeURIComponent(name)}`);
    await row.getByRole('button', { name: `Archive ${name}` }).click();
    await page.getByText('No boards match these filters.').waitFor();
    expect((await api<BoardDetail>(`/api/boards/${id}`)).status).toBe('archived');
    expect((await api<{ items: unknown[] }>(`/api/boards/${id}/revisions`)).items.length).toBe(2);
    await context.close();
  });

  it('a save that lost a race keeps the edit, shows what changed, and saves it as a copy', async () => {
    const design = { ...structuredClone(DEMO_DESIGNS.find((d) => d.id === 'seven-string-fan')!.design), name: `Raced seven ${Date.now()}` };
    const board = await api<BoardDetail>('/api/boards', 'POST', { design });
    const context = await signedInContext(suite.builder);
    const page = await context.newPage();
    await page.goto(`${BASE_URL}/layout?board=${board.id}`, { waitUntil: 'networkidle' });
    await savedBadge(page).waitFor();

    // Someone else saves first (as a second session would).
    await api(`/api/boards/${board.id}`, 'PATCH', { version: board.version, design: { ...design, perpendicularFret: 7 } });
    await page.getByLabel(/^String spacing at the nut/).fill('42');

    const notice = page.getByRole('alert').filter({ hasText: 'This board was saved elsewhere while you edited it' });
    await notice.waitFor();
    await page.getByRole('status').filter({ hasText: 'Changed elsewhere' }).waitFor();
    expect((await notice.getByRole('rowheader').allInnerTexts()).sort()).toEqual(['Perpendicular fret (0 = nut)', 'String spacing at the nut']);
    await expect(page.getByLabel(/^String spacing at the nut/).inputValue()).resolves.toBe('42');
    await saveScreenshot(page, 'boards-editor-conflict');

    await notice.getByRole('button', { name: 'Save mine as a copy' }).click();
    await page.waitForURL((url) => url.searchParams.get('board') !== String(board.id));
    await savedBadge(page).waitFor();
    const copy = await api<BoardDetail>(`/api/boards/${boardIdIn(page.url())}`);
    expect(copy.design).toMatchObject({ stringSpacing: { nut: 42 }, perpendicularFret: 8 });
    // Both edits are kept: the other save stays on the original board.
    expect((await api<BoardDetail>(`/api/boards/${board.id}`)).design).toMatchObject({ stringSpacing: { nut: 41 }, perpendicularFret: 7 });
    expect(await notice.count()).toBe(0);
    await context.close();
  });

  it('visitors and clients keep the scratch design: no Save to Boards, and a saved board is not theirs to open', async () => {
    const visitor = await suite.browser.newPage();
    await visitor.goto(`${BASE_URL}/layout`, { waitUntil: 'networkidle' });
    await keptGroup(visitor).getByText('Scratch design, kept in this browser only').waitFor();
    expect(await visitor.getByRole('button', { name: 'Save to Boards' }).count()).toBe(0);
    await keptGroup(visitor).getByRole('link', { name: 'Sign in' }).waitFor();
    await visitor.close();

    const client = await signInAs('client@wrenfield.example');
    const context = await signedInContext(client);
    const page = await context.newPage();
    await page.goto(`${BASE_URL}/layout`, { waitUntil: 'networkidle' });
    await keptGroup(page).getByText('Scratch design, kept in this browser only').waitFor();
    expect(await page.getByRole('button', { name: 'Save to Boards' }).count()).toBe(0);
    const [someBoard] = (await api<{ items: BoardDetail[] }>('/api/boards?pageSize=1')).items;
    const response = await page.goto(`${BASE_URL}/layout?board=${someBoard!.id}`);
    expect(response?.status()).toBe(403);
    await context.close();
  });
});
