/**
 * An approved board in the Layout editor, in Chromium on the built server: the builder is asked
 * before the first change that moves it off the approved layout (undo or keep), then warned in
 * the editor, the Boards list and the Export panel, and the print names its new revision.
 */
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { createProof, decideProof } from '~/lib/proofs/proofs.server.ts';
import type { BoardDetail, BoardList } from '~/lib/schemas/board.ts';
import { BASE_URL, saveScreenshot } from '../support/browser.ts';
import { browserSuite } from '../support/browser-suite.ts';
import { signedInApi } from '../support/signed-in-api.ts';

const suite = browserSuite();

const api = signedInApi(() => suite.builder);
const perpendicular = (page: Page) => page.getByLabel(/^Perpendicular fret/);

describe('an approved board in the editor', () => {
  it('asks before the first change, warns after it, and every export names the new revision', async () => {
    const name = `Approved fan ${Date.now()}`;
    const design = { ...structuredClone(DEMO_DESIGNS.find((d) => d.id === 'seven-string-fan')!.design), name };
    const board = await api<BoardDetail>('/api/boards', 'POST', { design, clientName: 'Ines Calloway' });
    const proof = await createProof(suite.builder, board.id, { clientName: 'Ines Calloway', clientEmail: `ines-${Date.now()}@wrenfield.example`, message: '', expiresInDays: 30 }, new Date());
    const token = proof!.link.slice(proof!.link.lastIndexOf('/') + 1);
    expect((await decideProof({ token }, { decision: 'approved', name: 'Ines', confirmed: true }, new Date())).ok).toBe(true);

    const context = await suite.browser.newContext({ viewport: { width: 1400, height: 1000 } });
    await context.addCookies([{ name: SESSION_COOKIE, value: suite.builder.token, url: BASE_URL }]);
    const page = await context.newPage();
    await page.goto(`${BASE_URL}/layout?board=${board.id}`, { waitUntil: 'networkidle' });
    await page.getByText('Approved by the client: revision 1').waitFor();

    // The first change away from the approved layout waits for the builder's answer.
    await perpendicular(page).fill('7');
    const question = page.getByRole('alertdialog', { name: 'The client approved this board as it is' });
    await question.waitFor();
    await question.getByText(/this change will need a new proof/).waitFor();
    await saveScreenshot(page, 'approval-question');
    expect((await api<BoardDetail>(`/api/boards/${board.id}`)).design).toMatchObject({ perpendicularFret: 8 });
    await question.getByRole('button', { name: 'Undo my change' }).click();
    await expect.poll(() => perpendicular(page).inputValue()).toBe('8');
    expect(await question.count()).toBe(0);

    // Asked again, the builder keeps the change: the board is now "changed since approval".
    await perpendicular(page).fill('7');
    await question.getByRole('button', { name: 'Keep my change (needs a new proof)' }).click();
    await page.getByText('Changed since approval.').waitFor();
    await page.locator('[data-board-status="changed_since_approval"]').waitFor();
    await expect.poll(async () => (await api<BoardDetail>(`/api/boards/${board.id}`)).design).toMatchObject({ perpendicularFret: 7 });
    const list = await api<BoardList>(`/api/boards?q=${encodeURIComponent(name)}`);
    expect(list.items.map((b) => b.status)).toEqual(['changed_since_approval']);

    // The Export panel says so, and the PDF it downloads is revision 2, made for the export.
    await page.getByRole('tab', { name: 'Exports' }).click();
    await page.getByText(/Not the approved layout: the client approved revision 1/).waitFor();
    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Download Paper template (PDF)' }).click();
    const file = await download;
    expect(file.suggestedFilename()).toBe(`${name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-r2-paper-template.pdf`);
    const revisions = await api<{ items: { revision: number; reason: string }[] }>(`/api/boards/${board.id}/revisions`);
    expect(revisions.items.map((r) => [r.revision, r.reason])).toEqual([[2, 'export'], [1, 'created']]);
    await saveScreenshot(page, 'approval-changed-export');
    await context.close();
  });
});
