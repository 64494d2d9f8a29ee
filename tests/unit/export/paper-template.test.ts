import { mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { PNG } from 'pngjs';
import { describe, expect, it } from 'vitest';
import { exportDesign } from '~/lib/export/export-design.server.ts';
import { sheetDrawing } from '~/lib/export/sheet-drawing.ts';
import { planTiles, type TilePlan } from '~/lib/export/tile-pages.ts';
import { computeLayout, type Layout } from '~/lib/geometry/layout.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import type { Design } from '~/lib/schemas/design.ts';
import { validateExportOptions, type ExportOptions } from '~/lib/schemas/export-options.ts';
import { referenceLine } from '~/lib/templates/check/reference.ts';
import { pageText, pdfFonts, readPdf, renderPage, type PageSegment, type ReadPage } from '../../support/pdf-readback.ts';

/** ISO 32000-1: PDF user space units are 1/72 in; 1 in = 25.4 mm exactly. */
const PT_PER_MM = 72 / 25.4;
const TOLERANCE_PT = 0.01;

function expectNearPt(actual: number, expected: number, what: string): void {
  if (Math.abs(actual - expected) > TOLERANCE_PT) {
    throw new Error(`${what}: ${actual} pt is not within ${TOLERANCE_PT} pt of ${expected} pt`);
  }
}

function demo(id: string): Design {
  const found = DEMO_DESIGNS.find((d) => d.id === id);
  if (!found) throw new Error(`no demo design ${id}`);
  return found.design;
}

function options(input: Record<string, unknown>): ExportOptions {
  const result = validateExportOptions({ format: 'pdf', ...input });
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.options;
}

async function template(design: Design, input: Record<string, unknown>) {
  const chosen = options(input);
  const file = await exportDesign(design, chosen, { revision: 2, shopName: 'Wrenfield Instrument Co.' });
  const layout = computeLayout(design);
  const plan = planTiles(sheetDrawing(layout, chosen).bounds, chosen);
  return { bytes: file.bytes, pages: await readPdf(file.bytes), plan, layout };
}

function length(s: PageSegment): number {
  return Math.hypot(s.x2 - s.x1, s.y2 - s.y1);
}

/** Sheet millimetres of a board point, as the paper template draws it. */
function sheetMm(layout: Layout, point: { x: number; y: number }, mirror: boolean) {
  const scale = layout.units === 'in' ? 25.4 : 1;
  return { x: point.x * scale, y: (mirror ? -1 : 1) * point.y * scale };
}

/** A page point with the tile's offset undone, in points from the board origin. */
function undoTile(plan: TilePlan, pageIndex: number, x: number, y: number) {
  const tile = plan.tiles[pageIndex]!;
  return {
    x: x - (plan.window.xMm - tile.x0) * PT_PER_MM,
    y: y - (plan.window.yMm - tile.y0) * PT_PER_MM,
  };
}

function fretSegments(page: ReadPage, fret: number): PageSegment[] {
  return page.tagged.get(`Fret${fret}`) ?? [];
}

describe('paper template PDF read back with pdfjs-dist and poppler', () => {
  it('tiles the seven-string fan over Letter landscape pages of 792 x 612 pt (ANSI Letter 11 x 8.5 in)', async () => {
    const { pages, plan } = await template(demo('seven-string-fan'), { paper: 'letter' });
    expect(plan.orientation).toBe('landscape');
    expect(pages.length).toBe(plan.tiles.length);
    expect(pages.length).toBeGreaterThan(1);
    for (const page of pages) {
      expectNearPt(page.widthPt, 792, 'Letter width');
      expectNearPt(page.heightPt, 612, 'Letter height');
    }
  });

  it('uses A4 pages of 595.28 x 841.89 pt when asked for portrait (ISO 216: 210 x 297 mm)', async () => {
    const { pages } = await template(demo('classical-650'), { paper: 'a4', orientation: 'portrait' });
    for (const page of pages) {
      expectNearPt(page.widthPt, 595.28, 'A4 width');
      expectNearPt(page.heightPt, 841.89, 'A4 height');
    }
  });

  it('picks the orientation needing fewer pages, and a single page sized to the board for "fit"', async () => {
    const design = demo('seven-string-fan');
    const auto = await template(design, { paper: 'letter' });
    const portrait = await template(design, { paper: 'letter', orientation: 'portrait' });
    expect(portrait.pages.length).toBeGreaterThanOrEqual(auto.pages.length);
    const fit = await template(design, { paper: 'fit' });
    expect(fit.pages.length).toBe(1);
    // By default the template stops at the board end (fret 24 is under 3/4 of 686 mm from the nut):
    // the page is narrower than the bass string. Drawn on to the saddle it is wider.
    expect(fit.pages[0]!.widthPt).toBeLessThan(686 * PT_PER_MM);
    const toSaddle = await template(design, { paper: 'fit', toSaddle: true });
    expect(toSaddle.pages.length).toBe(1);
    expect(toSaddle.pages[0]!.widthPt).toBeGreaterThan(686 * PT_PER_MM);
  });

  it('draws a 100 mm bar of 283.465 pt and a 4 in bar of 288 pt on every page (ISO 32000-1 units)', async () => {
    const { pages } = await template(demo('seven-string-fan'), { paper: 'a4' });
    for (const page of pages) {
      const [mm] = page.tagged.get('CalibrationBar100mm') ?? [];
      const [inch] = page.tagged.get('CalibrationBar4in') ?? [];
      expect(mm && inch).toBeTruthy();
      expectNearPt(length(mm!), 283.465, '100 mm bar');
      expectNearPt(length(inch!), 288, '4 in bar');
    }
  });

  it('places every fret line at the geometry x 72/25.4 after undoing the tile offset, and overlapping tiles agree', async () => {
    const { pages, plan, layout } = await template(demo('seven-string-fan'), { paper: 'letter', overlap: 20 });
    const seenOn = new Map<number, number>();
    for (const fret of layout.frets) {
      const start = sheetMm(layout, fret.line.start, false);
      const end = sheetMm(layout, fret.line.end, false);
      pages.forEach((page, index) => {
        for (const segment of fretSegments(page, fret.number)) {
          const a = undoTile(plan, index, segment.x1, segment.y1);
          const b = undoTile(plan, index, segment.x2, segment.y2);
          expectNearPt(a.x, start.x * PT_PER_MM, `fret ${fret.number} treble x, page ${index + 1}`);
          expectNearPt(a.y, start.y * PT_PER_MM, `fret ${fret.number} treble y, page ${index + 1}`);
          expectNearPt(b.x, end.x * PT_PER_MM, `fret ${fret.number} bass x, page ${index + 1}`);
          expectNearPt(b.y, end.y * PT_PER_MM, `fret ${fret.number} bass y, page ${index + 1}`);
          seenOn.set(fret.number, (seenOn.get(fret.number) ?? 0) + 1);
        }
      });
    }
    for (const fret of layout.frets) expect(seenOn.get(fret.number) ?? 0).toBeGreaterThan(0);
    // With a 20 mm overlap some frets fall where two pages overlap; they were checked on both.
    expect([...seenOn.values()].some((count) => count >= 2)).toBe(true);
  });

  it('puts each alignment mark on every page that shares its overlap, at the same board position', async () => {
    const { pages, plan } = await template(demo('seven-string-fan'), { paper: 'a4', orientation: 'portrait' });
    expect(plan.marks.length).toBeGreaterThan(0);
    const centres: { x: number; y: number }[] = [];
    pages.forEach((page, index) => {
      const lines = page.tagged.get('AlignmentMark') ?? [];
      for (let i = 0; i + 1 < lines.length; i += 2) {
        const across = lines[i]!;
        centres.push(undoTile(plan, index, (across.x1 + across.x2) / 2, (across.y1 + across.y2) / 2));
      }
    });
    for (const mark of plan.marks) {
      const matches = centres.filter(
        (c) => Math.abs(c.x - mark.x * PT_PER_MM) <= TOLERANCE_PT && Math.abs(c.y - mark.y * PT_PER_MM) <= TOLERANCE_PT,
      );
      expect(matches.length).toBeGreaterThanOrEqual(2);
    }
  });

  it('mirrors the drawing across the centre line for templates glued face-down', async () => {
    const { pages, plan, layout } = await template(demo('classical-650'), { paper: 'fit', mirror: true });
    const fret = layout.frets[11]!;
    const [segment] = fretSegments(pages[0]!, fret.number);
    const start = sheetMm(layout, fret.line.start, true);
    const a = undoTile(plan, 0, segment!.x1, segment!.y1);
    expectNearPt(a.y, start.y * PT_PER_MM, 'mirrored treble y');
    expect(start.y).toBeGreaterThan(0);
  });

  it('draws a design in inches at 72 pt per inch', async () => {
    const { pages, plan, layout } = await template(demo('mandolin'), { paper: 'letter' });
    expect(layout.units).toBe('in');
    const fret = layout.frets[6]!;
    const index = pages.findIndex((page) => fretSegments(page, fret.number).length > 0);
    const segment = fretSegments(pages[index]!, fret.number)[0]!;
    const a = undoTile(plan, index, segment.x1, segment.y1);
    expectNearPt(a.x, fret.line.start.x * 72, 'fret 7 x in points');
  });

  it('prints the caution and the title block on every page, with the font embedded (pdffonts)', async () => {
    const design = demo('seven-string-fan');
    const { bytes, pages } = await template(design, { paper: 'letter' });
    for (let page = 1; page <= pages.length; page++) {
      const text = pageText(bytes, page);
      expect(text).toContain('Print at 100 % / actual size. Measure both bars before cutting.');
      expect(text).toContain(design.name);
      expect(text).toContain('Perpendicular fret 8');
      expect(text).toContain('revision 2');
      expect(text).toContain(`of ${pages.length}`);
    }
    const fonts = pdfFonts(bytes);
    expect(fonts.length).toBe(1);
    expect(fonts[0]!.name).toMatch(/JetBrainsMono/);
    expect(fonts[0]!.embedded).toBe(true);
  });

  it('renders a tiled page to PNG (test-results/paper-template-page-2.png) with the drawing on it', async () => {
    const { bytes } = await template(demo('seven-string-fan'), { paper: 'letter', strings: true });
    const dir = process.env.ARTIFACTS_DIR ?? 'test-results';
    mkdirSync(dir, { recursive: true });
    const path = renderPage(bytes, 2, join(dir, 'paper-template-page-2'));
    const png = PNG.sync.read(readFileSync(path));
    // Letter landscape at 100 dpi: 1100 x 850 pixels.
    expect(png.width).toBe(1100);
    expect(png.height).toBe(850);
    let dark = 0;
    for (let i = 0; i < png.data.length; i += 4) if (png.data[i]! < 100) dark++;
    expect(dark).toBeGreaterThan(1000);
  });
});

/** WCAG 2.x relative luminance of an sRGB colour with channels 0..255, and the contrast ratio. */
function luminance([r, g, b]: readonly number[]): number {
  const linear = (c: number) => {
    const s = c / 255;
    return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
  };
  return 0.2126 * linear(r!) + 0.7152 * linear(g!) + 0.0722 * linear(b!);
}
const contrast = (a: readonly number[], b: readonly number[]) => {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi! + 0.05) / (lo! + 0.05);
};

/** The fill colours a page sets (pdfjs reads `rg` operators back as #rrggbb). */
async function fillColours(bytes: Uint8Array, pageNumber: number): Promise<number[][]> {
  const pdfjs = await import('pdfjs-dist/legacy/build/pdf.mjs');
  const document = await pdfjs.getDocument({ data: new Uint8Array(bytes) }).promise;
  const page = await document.getPage(pageNumber);
  const list = await page.getOperatorList();
  const colours: number[][] = [];
  list.fnArray.forEach((fn, i) => {
    if (fn !== pdfjs.OPS.setFillRGBColor) return;
    const [hex] = list.argsArray[i] as [string];
    colours.push([1, 3, 5].map((at) => parseInt(hex.slice(at, at + 2), 16)));
  });
  return colours;
}

describe('a paper template a bench can work from', () => {
  it('stops at the board end by default, with a saddle mark and its distance from the nut on each outer string', async () => {
    const fan = demo('seven-string-fan');
    const { bytes } = await template(fan, { paper: 'fit' });
    const text = pageText(bytes, 1);
    // No nut setback on the demo fan: the drawn saddle lies its scale plus its saddle setback from
    // the nut along each outer string (648 + 1.5 and 686 + 4 mm, the demo's own numbers).
    expect(fan.compensation.nut).toBe(0);
    expect(text).toContain(`saddle ${(648 + fan.compensation.saddleTreble).toFixed(2)} mm from nut, string 1`);
    expect(text).toContain(`saddle ${(686 + fan.compensation.saddleBass).toFixed(2)} mm from nut, string 7`);
    const drawnToSaddle = pageText((await template(demo('seven-string-fan'), { paper: 'fit', toSaddle: true })).bytes, 1);
    expect(drawnToSaddle).not.toContain('from nut, string');
    expect(drawnToSaddle).toMatch(/\bsaddle\b/);
  });

  it('numbers the strings at the nut and names the lines to measure along as the Template check does, mirrored or not', async () => {
    for (const mirror of [false, true]) {
      const { bytes } = await template(demo('seven-string-fan'), { paper: 'fit', mirror });
      const words = pageText(bytes, 1).split(/\s+/);
      for (const n of ['1', '2', '3', '4', '5', '6', '7']) expect(words).toContain(n);
      expect(pageText(bytes, 1)).toMatch(/treble edge/);
      expect(pageText(bytes, 1)).toMatch(/bass edge/);
      expect(pageText(bytes, 1)).toMatch(/centre line/);
    }
  });

  it('prints the slot-width band dark enough for a laser print: at least 3:1 against white paper (WCAG 2 contrast), read back from the PDF', async () => {
    const { bytes } = await template(demo('classical-650'), { paper: 'fit', kerf: true });
    const greys = (await fillColours(bytes, 1)).filter(([r, g, b]) => r === g && g === b && r! > 0 && r! < 255);
    expect(greys.length).toBeGreaterThan(0);
    for (const grey of greys) expect(contrast(grey, [255, 255, 255])).toBeGreaterThanOrEqual(3);
    // The black fret line on top of the band still stands out from it.
    for (const grey of greys) expect(contrast(grey, [0, 0, 0])).toBeGreaterThanOrEqual(3);
  });
});

describe('the table of fret distances on the last page', () => {
  it('lists each fret along the treble edge, bass edge and centre line, the numbers the Template check compares with', async () => {
    const design = demo('seven-string-fan');
    const plain = await template(design, { paper: 'letter' });
    const withTable = await template(design, { paper: 'letter', distances: true });
    expect(withTable.pages.length).toBe(plain.pages.length + 1);
    const text = pageText(withTable.bytes, withTable.pages.length);
    expect(text).toMatch(/fret\s+treble edge\s+bass edge\s+centre line/);
    const layout = computeLayout(design);
    for (const along of ['treble-edge', 'bass-edge', 'centre-line'] as const) {
      const twelfth = referenceLine(layout, along).slots[11]!.fromNut;
      expect(text).toContain(twelfth.toFixed(2));
    }
    // 12-TET on a string without compensation: the 12th fret halves string 1 (648 mm), 324.00 mm.
    expect(Math.abs(referenceLine(layout, 'string-1').slots[11]!.fromNut - 324)).toBeLessThan(1e-9); // mm
  });
});
