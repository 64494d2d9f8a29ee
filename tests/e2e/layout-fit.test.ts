/**
 * The Layout editor on a laptop: from 1280×720 up no column is clipped and nothing overflows the
 * page sideways; every panel (design, fret table, exports, history, proofs) opens in the side
 * panel with the drawing still in view beside it; fret numbers never overprint at the default zoom.
 */
import type { Page } from 'playwright-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { BASE_URL } from '../support/browser.ts';
import { browserSuite } from '../support/browser-suite.ts';
import { ensureDesign } from '../support/designs.ts';
import { waitForDrawing } from '../support/konva-scene.ts';
import { shopRows } from '../support/shop-rows.ts';

const suite = browserSuite();
let boardId: number;

beforeAll(async () => {
  boardId = await ensureDesign(suite.builder.shopId, suite.builder.id, 'Seven-string', 'seven-string-fan');
  // A proof with a long address, so the Proofs panel has a row to fit.
  await shopRows(suite.builder.shopId, suite.builder.id, 'a-client-with-a-rather-long-address@wrenfield.example', 'Laptop fit', boardId);
});

async function builderPage(width: number, height: number): Promise<Page> {
  const context = await suite.browser.newContext({ viewport: { width, height } });
  await context.addCookies([{ name: SESSION_COOKIE, value: suite.builder.token, url: BASE_URL }]);
  return context.newPage();
}

/** Elements that stick out past the right edge of the viewport, or columns whose content is wider than they are. */
function sidewaysOverflow(page: Page) {
  return page.evaluate(() => {
    const width = document.documentElement.clientWidth;
    const out: string[] = [];
    if (document.documentElement.scrollWidth > width) out.push(`page scrolls sideways: ${document.documentElement.scrollWidth} > ${width}`);
    for (const element of document.querySelectorAll('main *')) {
      const box = element.getBoundingClientRect();
      if (box.width === 0) continue;
      // Content inside its own scrolling box (the fret table) may be wider than that box; the box itself must fit.
      let clipped = false;
      for (let parent = element.parentElement; parent && parent !== document.body; parent = parent.parentElement) {
        const overflowX = getComputedStyle(parent).overflowX;
        if (overflowX === 'auto' || overflowX === 'scroll' || overflowX === 'hidden') clipped = true;
      }
      if (!clipped && box.right > width + 0.5) out.push(`${element.tagName.toLowerCase()}${element.id ? `#${element.id}` : ''} ends at ${box.right} px`);
    }
    for (const column of document.querySelectorAll('main section[aria-label="Design and board panels"], main [role="tabpanel"]:not([hidden])')) {
      if (column.scrollWidth <= column.clientWidth + 1) continue;
      // Name the outermost element that sticks out, to say what to fix.
      const edge = column.getBoundingClientRect().right;
      const culprit = [...column.querySelectorAll('*')].find((el) => el.getBoundingClientRect().right > edge + 1);
      const what = culprit ? `${culprit.tagName.toLowerCase()}.${[...culprit.classList].join('.')} ${culprit.getBoundingClientRect().width} px` : 'unknown';
      out.push(`${column.getAttribute('aria-label') ?? column.id} is clipped: ${column.scrollWidth} > ${column.clientWidth} (by ${what})`);
    }
    return out;
  });
}

describe('the Layout editor fits a laptop', () => {
  it('at 1280×720 nothing overflows sideways, and every panel opens beside the drawing with the drawing in view', async () => {
    const page = await builderPage(1280, 720);
    await page.goto(`${BASE_URL}/layout?board=${boardId}`, { waitUntil: 'networkidle' });
    await waitForDrawing(page);
    expect(await sidewaysOverflow(page)).toEqual([]);

    const panels = page.getByRole('tablist', { name: 'Panels' });
    const names = await panels.getByRole('tab').allInnerTexts();
    expect(names).toEqual(['Design', 'Fret table', 'Exports', 'History', 'Proofs']);
    const drawing = page.getByRole('application', { name: /Drawing of the board/ });
    for (const name of names) {
      await panels.getByRole('tab', { name }).click();
      const panel = page.getByRole('tabpanel', { name });
      await panel.waitFor();
      // Each panel shows something of its own (its first heading, field or control); Proofs its list.
      await panel.locator('h2, h3, label, button, table').first().waitFor();
      if (name === 'Proofs') await panel.getByRole('table', { name: 'Proofs of this design' }).waitFor();
      const panelBox = (await panel.boundingBox())!;
      const drawingBox = (await drawing.boundingBox())!;
      // The drawing stays wholly in view, and the panel starts in view beside it (to its left).
      expect(drawingBox.y, `${name}: drawing top`).toBeGreaterThanOrEqual(0);
      expect(drawingBox.y + drawingBox.height, `${name}: drawing bottom`).toBeLessThanOrEqual(720);
      expect(panelBox.y, `${name}: panel top`).toBeLessThan(720);
      expect(panelBox.x + panelBox.width, `${name}: panel beside the drawing`).toBeLessThanOrEqual(drawingBox.x);
      expect(panelBox.y, `${name}: panel beside the drawing, not below it`).toBeLessThan(drawingBox.y + drawingBox.height);
      expect(await sidewaysOverflow(page), name).toEqual([]);
    }
    await page.context().close();
  });

  it('at 1920×1080 and 1440×900 nothing overflows sideways either', async () => {
    for (const [width, height] of [[1920, 1080], [1440, 900]] as const) {
      const page = await builderPage(width, height);
      await page.goto(`${BASE_URL}/layout?board=${boardId}`, { waitUntil: 'networkidle' });
      await waitForDrawing(page);
      for (const name of ['Design', 'Fret table', 'Exports', 'History']) {
        await page.getByRole('tab', { name }).click();
        await page.getByRole('tabpanel', { name }).waitFor();
        expect(await sidewaysOverflow(page), `${width}×${height} ${name}`).toEqual([]);
      }
      await page.context().close();
    }
  });
});

/** Every fret number's box on the page (Konva's own getClientRect), and pairs of them that intersect. */
function fretNumberBoxes(page: Page) {
  return page.evaluate(() => {
    type Node = { getAttr(name: string): unknown; getClientRect(): { x: number; y: number; width: number; height: number } };
    const stage = (window as unknown as { Konva: { stages: { find(selector: string): Node[] }[] } }).Konva.stages[0];
    const boxes = (stage?.find('.fret-number') ?? []).map((node) => ({ fret: Number(node.getAttr('fret')), ...node.getClientRect() }));
    const overlaps: string[] = [];
    boxes.forEach((a, i) =>
      boxes.slice(i + 1).forEach((b) => {
        if (a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height) overlaps.push(`${a.fret} and ${b.fret}`);
      }),
    );
    return { frets: boxes.map((b) => b.fret).sort((a, b) => a - b), overlaps };
  });
}

describe('fret numbers never overprint', () => {
  it('at the default zoom of the demo fan made an 8-string, and of the 7-string, no two fret-number boxes intersect; zooming in shows more', async () => {
    const page = await builderPage(1280, 720);
    await page.goto(`${BASE_URL}/layout?preset=seven-string-fan`, { waitUntil: 'networkidle' });
    await waitForDrawing(page);
    const seven = await fretNumberBoxes(page);
    expect(seven.overlaps).toEqual([]);

    await page.getByLabel('Strings', { exact: true }).fill('8');
    await page.waitForFunction(() => {
      const stage = (window as unknown as { Konva: { stages: { find(s: string): unknown[] }[] } }).Konva.stages[0];
      return stage?.find('.string-line').length === 8;
    });
    const eight = await fretNumberBoxes(page);
    expect(eight.overlaps).toEqual([]);
    // The low frets and the octaves keep their numbers; the crowded high frets are thinned.
    for (const fret of [1, 2, 3, 12, 24]) expect(eight.frets).toContain(fret);
    expect(eight.frets.length).toBeLessThan(24);

    for (let i = 0; i < 3; i++) await page.getByRole('button', { name: 'Zoom in' }).click();
    const closer = await fretNumberBoxes(page);
    expect(closer.overlaps).toEqual([]);
    expect(closer.frets.length).toBeGreaterThan(eight.frets.length);
    await page.context().close();
  });
});
