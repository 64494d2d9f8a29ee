import { join } from 'node:path';
import { mkdirSync, readFileSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ARTIFACTS_DIR, BASE_URL, launchBrowser } from '../support/browser.ts';
import { expectNear } from '../support/expect-near.ts';
import { typeFannedSevenString, waitUntilFannedSevenStringKept } from '../support/editor-form.ts';
import { pagePointOf, readScene, waitForDrawing } from '../support/konva-scene.ts';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(() => browser?.close());

const length = (p: number[]) => Math.hypot((p[2] ?? 0) - (p[0] ?? 0), (p[3] ?? 0) - (p[1] ?? 0));

async function fretTableText(page: Page): Promise<string> {
  return (await page.getByRole('table', { name: 'Fret table' }).innerText()).trim();
}

describe('Layout editor in Chromium (built server)', () => {
  it('builds the fanned 7-string 648/686 mm board perpendicular at fret 8 by typing, and draws it exactly', async () => {
    const context = await browser.newContext({ viewport: { width: 1400, height: 1000 }, acceptDownloads: true });
    const page = await context.newPage();
    await page.goto(`${BASE_URL}/layout`, { waitUntil: 'networkidle' });

    await typeFannedSevenString(page, 'Wrenfield seven-string fan');
    await waitUntilFannedSevenStringKept(page, 'Wrenfield seven-string fan');

    const scene = await readScene(page);
    expect(scene.frets.map((f) => f.fret)).toEqual(Array.from({ length: 24 }, (_, i) => i + 1));
    // Fret 8 square to the centre line: the centre line runs along y = 0 and fret 8 has one x.
    expect(scene.centre[1]).toBe(0);
    expect(scene.centre[3]).toBe(0);
    const eight = scene.frets.find((f) => f.fret === 8)?.points ?? [];
    expectNear(eight[0] ?? Number.NaN, eight[2] ?? Number.NaN, 1e-6);
    // Another fret is slanted, so the check above could fail.
    const one = scene.frets.find((f) => f.fret === 1)?.points ?? [];
    expect(Math.abs((one[0] ?? 0) - (one[2] ?? 0))).toBeGreaterThan(0.1);
    const strings = new Map(scene.strings.map((s) => [s.string, s.points]));
    expect(strings.size).toBe(7);
    expectNear(length(strings.get(1) ?? []), 648, 1e-6);
    expectNear(length(strings.get(7) ?? []), 686, 1e-6);

    // Hover fret 12 halfway across the board: per-string distances appear.
    const twelve = scene.frets.find((f) => f.fret === 12)?.points ?? [];
    const at = await pagePointOf(page, ((twelve[0] ?? 0) + (twelve[2] ?? 0)) / 2, ((twelve[1] ?? 0) + (twelve[3] ?? 0)) / 2);
    await page.mouse.move(at.x, at.y);
    const readout = page.getByRole('region', { name: 'Fret 12 readout' });
    await readout.waitFor();
    const rows = await readout.getByRole('row').allInnerTexts();
    // 12-tone equal temperament: fret 12 halves the string (an octave is a 2:1 ratio).
    expect(rows[1]?.split(/\s+/)).toEqual(['1', '324.00', formatMm(648 * (2 ** (-11 / 12) - 0.5))]);
    expect(rows[7]?.split(/\s+/)).toEqual(['7', '343.00', formatMm(686 * (2 ** (-11 / 12) - 0.5))]);

    // An invalid value: the error sits by its field and the drawing keeps the last valid layout.
    await page.getByRole('tab', { name: 'Design' }).click();
    await page.getByLabel('Frets', { exact: true }).fill('40');
    const fretsField = page.getByLabel('Frets', { exact: true });
    expect(await fretsField.getAttribute('aria-invalid')).toBe('true');
    const errorId = (await fretsField.getAttribute('aria-describedby'))?.split(' ').find((id) => id.startsWith('error-'));
    expect(await page.locator(`[id="${errorId}"]`).innerText()).toMatch(/whole number from 1 to 36/);
    await page.getByText(/Out of date: this is the last valid layout/).waitFor();
    expect((await readScene(page)).frets.length).toBe(24);
    await fretsField.fill('24');
    await page.getByText(/Out of date/).waitFor({ state: 'detached' });

    // Inches and back: the same numbers (the form and the fret table are tabs of the side panel).
    await page.getByRole('tab', { name: 'Fret table' }).click();
    const tableInMm = await fretTableText(page);
    await page.getByRole('tab', { name: 'Design' }).click();
    await page.getByLabel('Inches (in)').check();
    expect(await page.getByLabel(/^Treble scale length/).inputValue()).toBe('25.5118');
    await page.getByRole('tab', { name: 'Fret table' }).click();
    await page.getByRole('columnheader', { name: /From nut \(in\)/ }).waitFor();
    await page.getByRole('tab', { name: 'Design' }).click();
    await page.getByLabel('Millimetres (mm)').check();
    expect(await page.getByLabel(/^Treble scale length/).inputValue()).toBe('648');
    await page.getByRole('tab', { name: 'Fret table' }).click();
    await page.getByRole('columnheader', { name: /From nut \(mm\)/ }).waitFor();
    expect(await fretTableText(page)).toBe(tableInMm);
    const back = await readScene(page);
    expectNear(length(back.strings.find((s) => s.string === 7)?.points ?? []), 686, 1e-6);
    await waitUntilFannedSevenStringKept(page, 'Wrenfield seven-string fan');

    // The fret table downloads as the CSV the API serves, written in the browser by the same code:
    // the same rows, and numbers that agree within 1e-9 mm (Chromium's and Node's Math.pow may
    // differ in the last bit, about 1e-13 mm here).
    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Download CSV' }).click();
    const csv = readFileSync((await (await download).path()) ?? '', 'utf8');
    const design = await page.evaluate(() => localStorage.getItem('kerfline.scratchDesign'));
    const api = await fetch(`${BASE_URL}/api/layout?format=csv`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: BASE_URL },
      body: design ?? '',
    });
    expect(api.status).toBe(200);
    expectSameCsv(csv, await api.text(), 1e-9);
    expect(csv.trim().split('\n').length).toBe(1 + 7 * 24);

    // The Exports tab holds the Export panel for the same design.
    await page.getByRole('tab', { name: 'Exports' }).click();
    await page.getByRole('button', { name: 'Paper template (PDF)' }).waitFor();
    await page.getByRole('tab', { name: 'Fret table' }).click();

    mkdirSync(ARTIFACTS_DIR, { recursive: true });
    await page.getByTestId('board-drawing').screenshot({ path: join(ARTIFACTS_DIR, 'layout-editor-drawing.png') });
    await page.screenshot({ path: join(ARTIFACTS_DIR, 'layout-editor-page.png'), fullPage: true });
    await context.close();
  });

  it('measures between two clicked points, snapping to fret and string crossings', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await page.goto(`${BASE_URL}/layout?preset=seven-string-fan`, { waitUntil: 'networkidle' });
    await waitForDrawing(page);
    const scene = await readScene(page);
    const string1 = scene.strings.find((s) => s.string === 1)?.points ?? [];
    await page.getByRole('button', { name: 'Measure' }).click();
    // Click slightly off the nut end of string 1, then slightly off its saddle end: both snap.
    const nut = await pagePointOf(page, (string1[0] ?? 0) + 2 / scene.zoom, string1[1] ?? 0);
    const saddle = await pagePointOf(page, (string1[2] ?? 0) - 3 / scene.zoom, string1[3] ?? 0);
    await page.mouse.click(nut.x, nut.y);
    await page.mouse.click(saddle.x, saddle.y);
    await page.getByText('Measured distance 648.00 mm').waitFor();
  });

  it('draws 1:1 on screen from the screen calibration kept in local storage', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await page.goto(`${BASE_URL}/layout?preset=classical-650`, { waitUntil: 'networkidle' });
    await page.getByRole('button', { name: 'Screen calibration' }).click();
    await page.getByLabel('Measured length of the bar (mm)').fill('5');
    await page.getByRole('button', { name: 'Save calibration' }).click();
    await page.getByText('Enter a length from 20 to 500 mm.').waitFor();
    await page.getByLabel('Measured length of the bar (mm)').fill('80');
    await page.getByRole('button', { name: 'Save calibration' }).click();
    await page.getByRole('button', { name: '1:1 on screen' }).click();
    // The bar is 100 mm at the CSS reference of 96 px per inch; seen as 80 mm, 1 mm takes 100/80 as many px.
    const expected = (96 / 25.4) * (100 / 80);
    expectNear((await readScene(page)).zoom, expected, 1e-9);
    await page.reload({ waitUntil: 'networkidle' });
    await page.getByRole('button', { name: '1:1 on screen' }).click();
    expectNear((await readScene(page)).zoom, expected, 1e-9);
  });

  it('view mode shows the drawing, navigation, readouts and fret table without the form', async () => {
    const page = await browser.newPage({ viewport: { width: 1200, height: 900 } });
    await page.goto(`${BASE_URL}/layout?preset=seven-string-fan&mode=view`, { waitUntil: 'networkidle' });
    await page.getByRole('heading', { level: 1, name: 'Demo: seven-string multi-scale guitar' }).waitFor();
    expect(await page.getByRole('form', { name: 'Design parameters' }).count()).toBe(0);
    expect(await page.getByLabel('Strings', { exact: true }).count()).toBe(0);
    const before = await readScene(page);
    expect(before.frets.length).toBe(24);
    await page.getByRole('button', { name: 'Zoom in' }).click();
    expectNear((await readScene(page)).zoom / before.zoom, 1.25, 1e-9);
    await page.getByRole('button', { name: 'Fit board' }).click();
    expectNear((await readScene(page)).zoom, before.zoom, 1e-9);
    // The wheel zooms about the pointer: the board point under it stays under it (within 1e-6 mm).
    // Mouse events carry whole CSS pixels, so the pointer goes to a whole pixel.
    const near = await pagePointOf(page, 300, 10);
    const pointer = { x: Math.round(near.x), y: Math.round(near.y) };
    const boardUnderPointer = () =>
      page.evaluate(([px, py]) => {
        type View = { getAbsoluteTransform(): { copy(): { invert(): { point(p: { x: number; y: number }): { x: number; y: number } } } } };
        const stage = (window as unknown as { Konva: { stages: { find(s: string): View[]; container(): HTMLElement }[] } }).Konva.stages[0];
        const view = stage?.find('.board-view')[0];
        if (!stage || !view) throw new Error('no drawing');
        const box = stage.container().getBoundingClientRect();
        return view.getAbsoluteTransform().copy().invert().point({ x: px - box.left, y: py - box.top });
      }, [pointer.x, pointer.y] as const);
    const beforeWheel = await boardUnderPointer();
    await page.mouse.move(pointer.x, pointer.y);
    await page.mouse.wheel(0, -240);
    await page.waitForFunction((zoom) => {
      type Stage = { find(s: string): { getAttr(n: string): unknown }[] };
      const stage = (window as unknown as { Konva: { stages: Stage[] } }).Konva.stages[0];
      return Number(stage?.find('.board-view')[0]?.getAttr('scaleX')) > zoom * 1.2;
    }, before.zoom);
    const afterWheel = await boardUnderPointer();
    expectNear(afterWheel.x, beforeWheel.x, 1e-6);
    expectNear(afterWheel.y, beforeWheel.y, 1e-6);
    // Shift and the arrow keys pan the view by a fixed screen step (the arrows alone move the fret cursor).
    await page.getByRole('button', { name: 'Fit board' }).click();
    const fittedAt = await pagePointOf(page, 0, 0);
    await page.getByRole('application', { name: /Drawing of the board/ }).focus();
    await page.keyboard.press('Shift+ArrowLeft');
    expectNear((await pagePointOf(page, 0, 0)).x - fittedAt.x, 40, 1e-9);
    const five = before.frets.find((f) => f.fret === 5)?.points ?? [];
    const at = await pagePointOf(page, ((five[0] ?? 0) + (five[2] ?? 0)) / 2, ((five[1] ?? 0) + (five[3] ?? 0)) / 2);
    await page.mouse.move(at.x, at.y);
    await page.getByRole('region', { name: 'Fret 5 readout' }).waitFor();
    expect(await page.getByRole('table', { name: 'Fret table' }).getByRole('row').count()).toBe(1 + 7 * 24);
    expect(await page.getByRole('tab', { name: 'Exports' }).count()).toBe(0);
  });
});

describe('changing the string count', () => {
  it('offers to keep the spacing per string and says what it did (blank 6-string at 35 / 52 mm made a 7-string: 42 / 62.4 mm)', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await page.goto(`${BASE_URL}/layout`, { waitUntil: 'networkidle' });
    await page.getByLabel('Preset').selectOption({ label: 'Blank design' });
    await page.getByRole('button', { name: 'Start', exact: true }).click();
    expect(await page.getByLabel(/^String spacing at the nut/).inputValue()).toBe('35');
    await page.getByLabel('Strings', { exact: true }).fill('7');
    const offer = page.getByRole('group', { name: 'String spacing for the new string count' });
    await offer.getByText('6 → 7 strings').waitFor();
    await offer.getByRole('button', { name: 'Keep the spacing per string' }).click();
    expect(await page.getByLabel(/^String spacing at the nut/).inputValue()).toBe('42');
    expect(await page.getByLabel(/^String spacing at the bridge/).inputValue()).toBe('62.4');
    await page.getByText('Spacing scaled for 7 strings: 42.00 mm at the nut and 62.40 mm at the bridge').waitFor();
    expect(await offer.count()).toBe(0);
    await page.close();
  });
});

describe('the editor trusts the shared geometry module in the browser', () => {
  it('sends no layout or Scala request while typing, loading a .scl file and downloading the fret table', async () => {
    const context = await browser.newContext({ viewport: { width: 1400, height: 1000 }, acceptDownloads: true });
    const page = await context.newPage();
    const apiCalls: string[] = [];
    page.on('request', (request) => {
      const path = new URL(request.url()).pathname;
      if (path === '/api/layout' || path === '/api/scala') apiCalls.push(`${request.method()} ${path}`);
    });
    await page.goto(`${BASE_URL}/layout`, { waitUntil: 'networkidle' });
    await typeFannedSevenString(page, 'Wrenfield seven-string fan');
    await waitUntilFannedSevenStringKept(page, 'Wrenfield seven-string fan');

    // Twelve equal steps written as a Scala file (the .scl format's own example layout).
    await page.getByLabel('Scala scale file (.scl)').check();
    // Before a file is chosen the box asks for one; it shows no error yet.
    await page.getByText('Choose a .scl file').waitFor();
    expect(await page.locator('[id="error-temperament.scl"]').count()).toBe(0);
    const scl = ['! twelve.scl', 'Twelve equal steps, written out', ' 12', '!', ...Array.from({ length: 11 }, (_, i) => ` ${(i + 1) * 100}.0`), ' 2/1', ''].join('\n');
    await page.getByLabel('Scala file (.scl)').setInputFiles({ name: 'twelve.scl', mimeType: 'text/plain', buffer: Buffer.from(scl) });
    await page.getByText('Twelve equal steps, written out').waitFor();
    await page.getByText('1200.000 cents').waitFor();

    const download = page.waitForEvent('download');
    await page.getByRole('tab', { name: 'Fret table' }).click();
    await page.getByRole('button', { name: 'Download CSV' }).click();
    const file = await download;
    expect(file.suggestedFilename()).toBe('wrenfield-seven-string-fan-fret-table.csv');
    const csv = readFileSync((await file.path()) ?? '', 'utf8');
    expect(csv.split('\n')[0]).toBe('fret,string,scale_length,from_nut,from_previous,x,y');
    expect(csv.trim().split('\n').length).toBe(1 + 7 * 24);
    expect(apiCalls).toEqual([]);
    await context.close();
  });
});

/** Same header, same rows, same non-numeric cells, and numeric cells within `toleranceMm`. */
function expectSameCsv(actual: string, expected: string, toleranceMm: number): void {
  const rows = (text: string) => text.trim().split('\n').map((line) => line.split(','));
  const [got, want] = [rows(actual), rows(expected)];
  expect(got.length).toBe(want.length);
  expect(got[0]).toEqual(want[0]);
  got.forEach((cells, r) => {
    expect(cells.length).toBe(want[r]!.length);
    cells.forEach((cell, c) => {
      const wanted = want[r]![c]!;
      if (r === 0 || Number.isNaN(Number(wanted))) expect(cell).toBe(wanted);
      else expectNear(Number(cell), Number(wanted), toleranceMm);
    });
  });
}

function formatMm(value: number): string {
  return (Math.round(value * 100) / 100).toFixed(2);
}
