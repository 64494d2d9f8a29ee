import { describe, expect, it } from 'vitest';
import { layoutExportCost, layoutExportRefusal, refuseOverCap, type ExportCost } from '~/lib/export/export-cost.ts';
import { exportDesign } from '~/lib/export/export-design.server.ts';
import { EXPORT_LIMITS } from '~/lib/export/export-limits.ts';
import { sheetDrawing } from '~/lib/export/sheet-drawing.ts';
import { planTiles } from '~/lib/export/tile-pages.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { DESIGN_LIMITS, type Design } from '~/lib/schemas/design.ts';
import { validateExportOptions, type ExportOptions } from '~/lib/schemas/export-options.ts';
import { designOf } from '../../support/design-builders.ts';
import { readPdf } from '../../support/pdf-readback.ts';

/** ISO 32000-1 annex C: a page is at most 14,400 units (200 in) on a side. */
const ISO_MAX_PAGE_SIDE_PT = 14_400;
const PT_PER_MM = 72 / 25.4;
const TOLERANCE_PT = 0.01;

/** The board sizes below were chosen for templates drawn on to the saddle (`toSaddle`). */
function options(input: Record<string, unknown>): ExportOptions {
  const result = validateExportOptions({ format: 'pdf', toSaddle: true, ...input });
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.options;
}

/** The largest design validateDesign takes: 16 strings, 36 frets, 5000 mm scale, `spacingMm` string spacing. */
function largest(spacingMm: number = DESIGN_LIMITS.mm.length): Design {
  const scale = DESIGN_LIMITS.mm.length;
  return designOf({
    strings: DESIGN_LIMITS.maxStrings,
    frets: DESIGN_LIMITS.maxFrets,
    scale: { treble: scale, bass: scale },
    stringSpacing: { nut: spacingMm, bridge: spacingMm },
  });
}

function pages(design: Design, chosen: ExportOptions): number {
  return planTiles(sheetDrawing(computeLayout(design), chosen).bounds, chosen).tiles.length;
}

describe('export caps, checked from the plan before anything is drawn', () => {
  it('refuses the largest design on Letter with 99.9 mm overlap (the largest the schema takes), naming paper and the page count', () => {
    const chosen = options({ paper: 'letter', overlap: 99.9 });
    const design = largest();
    const expected = pages(design, chosen);
    expect(expected).toBeGreaterThan(2000);
    const refusal = layoutExportRefusal(computeLayout(design), chosen, design);
    expect(refusal?.field).toBe('paper');
    expect(refusal?.message).toBe(
      `this paper template would print ${expected.toLocaleString('en-US')} pages; the most is 200: use a larger paper, less overlap or paper "fit"`,
    );
    // 100 mm is the first overlap the schema refuses on Letter (half the 199.9 mm window, less 0.05).
    expect(validateExportOptions({ format: 'pdf', paper: 'letter', overlap: 100 }).ok).toBe(false);
  });

  it('names overlap when less overlap alone brings the pages under the cap', () => {
    const design = largest(600);
    const chosen = options({ paper: 'letter', overlap: 99.9 });
    expect(pages(design, chosen)).toBeGreaterThan(EXPORT_LIMITS.maxPages);
    expect(pages(design, { ...chosen, overlap: 0 })).toBeLessThanOrEqual(EXPORT_LIMITS.maxPages);
    expect(layoutExportRefusal(computeLayout(design), chosen, design)?.field).toBe('overlap');
  });

  it('lets the same board through at exactly the cap, and on `fit` whatever its size', () => {
    const design = largest(500);
    const chosen = options({ paper: 'letter', overlap: 99.9 });
    expect(pages(design, chosen)).toBe(EXPORT_LIMITS.maxPages);
    expect(layoutExportRefusal(computeLayout(design), chosen, design)).toBeNull();
    expect(layoutExportRefusal(computeLayout(largest()), options({ paper: 'fit' }), largest())).toBeNull();
  });

  it('never refuses slot paths, fret tables or layouts of the largest valid design (the design limits bound them)', () => {
    const design = designOf({ ...largest(500), zeroFret: true });
    const layout = computeLayout(design);
    for (const format of ['dxf', 'svg', 'csv', 'json'] as const) {
      for (const slots of ['lines', 'outlines'] as const) {
        expect(layoutExportRefusal(layout, options({ format, slots }), design), `${format} ${slots}`).toBeNull();
      }
    }
  });

  it('refuses each cap with its own message, naming the given field', () => {
    const within: ExportCost = { pages: 1, largestPageSidePt: 612, primitives: 10, estimatedBytes: 1000 };
    const refuse = (cost: Partial<ExportCost>) => refuseOverCap({ ...within, ...cost }, 'this file', 'format', 'try DXF');
    expect(refuse({})).toBeNull();
    expect(refuse({ pages: 201 })).toEqual({ field: 'format', message: 'this file would print 201 pages; the most is 200: try DXF' });
    // 14,500 pt = 5,115.3 mm, rounded up.
    expect(refuse({ largestPageSidePt: 14_500 })?.message).toBe('this file needs a page 5,116 mm long; a PDF page may be at most 5,080 mm (14,400 pt, ISO 32000-1): try DXF');
    expect(refuse({ primitives: 250_001 })?.message).toBe('this file would draw 250,001 lines and shapes; the most is 250,000: try DXF');
    expect(refuse({ estimatedBytes: 40 * 1024 * 1024 })?.message).toBe('this file would be about 40.0 MiB; the most is 32.0 MiB: try DXF');
  });
});

describe('size estimates are upper estimates of the real files', () => {
  const cases: [string, Design, Record<string, unknown>][] = [
    ...DEMO_DESIGNS.flatMap((demo): [string, Design, Record<string, unknown>][] => [
      [`${demo.id} on Letter`, demo.design, { paper: 'letter' }],
      [`${demo.id} fit`, demo.design, { paper: 'fit', strings: true }],
      [`${demo.id} DXF outlines`, demo.design, { format: 'dxf', slots: 'outlines' }],
      [`${demo.id} SVG`, demo.design, { format: 'svg' }],
      [`${demo.id} CSV`, demo.design, { format: 'csv' }],
      [`${demo.id} JSON`, demo.design, { format: 'json' }],
    ]),
    ['largest design, 80 Letter pages', largest(500), { paper: 'letter' }],
    ['largest design, DXF outlines', largest(500), { format: 'dxf', slots: 'outlines' }],
  ];

  it.each(cases)('%s: the real file is no larger than the estimate, and at least a fifth of it', async (_name, design, input) => {
    const chosen = options(input);
    const cost = layoutExportCost(computeLayout(design), chosen, design);
    const file = await exportDesign(design, chosen);
    expect(file.bytes.byteLength).toBeLessThanOrEqual(cost.estimatedBytes);
    expect(file.bytes.byteLength * 5).toBeGreaterThan(cost.estimatedBytes);
    if (chosen.format === 'pdf') expect((await readPdf(file.bytes)).length).toBe(cost.pages);
  });
});

describe('`fit` pages stay within ISO 32000-1 annex C (14,400 pt a side)', () => {
  it('tiles the largest board onto equal pages of at most 14,400 pt, read back from the PDF, still 1:1', async () => {
    const design = largest();
    const chosen = options({ paper: 'fit', overlap: 10 });
    const layout = computeLayout(design);
    const plan = planTiles(sheetDrawing(layout, chosen).bounds, chosen);
    expect(plan.rows * plan.columns).toBeGreaterThan(1);
    const read = await readPdf((await exportDesign(design, chosen)).bytes);
    expect(read.length).toBe(plan.tiles.length);
    for (const page of read) {
      expect(page.widthPt).toBeLessThanOrEqual(ISO_MAX_PAGE_SIDE_PT);
      expect(page.heightPt).toBeLessThanOrEqual(ISO_MAX_PAGE_SIDE_PT);
      expect(Math.abs(page.widthPt - plan.pageWidthPt)).toBeLessThan(TOLERANCE_PT);
      expect(Math.abs(page.heightPt - plan.pageHeightPt)).toBeLessThan(TOLERANCE_PT);
    }
    // 1:1: the last fret's treble end, after undoing each page's tile offset, is the geometry's point.
    const fret = layout.frets[layout.frets.length - 1]!;
    let seen = 0;
    read.forEach((page, index) => {
      const tile = plan.tiles[index]!;
      for (const segment of page.tagged.get(`Fret${fret.number}`) ?? []) {
        const x = segment.x1 - (plan.window.xMm - tile.x0) * PT_PER_MM;
        const y = segment.y1 - (plan.window.yMm - tile.y0) * PT_PER_MM;
        expect(Math.abs(x - fret.line.start.x * PT_PER_MM)).toBeLessThan(TOLERANCE_PT);
        expect(Math.abs(y - fret.line.start.y * PT_PER_MM)).toBeLessThan(TOLERANCE_PT);
        seen++;
      }
    });
    expect(seen).toBeGreaterThan(0);
  });

  it('keeps a board that fits on one page of at most 14,400 pt as one sheet sized to it', () => {
    const chosen = options({ paper: 'fit' });
    const plan = planTiles(sheetDrawing(computeLayout(largest(60)), chosen).bounds, chosen);
    expect(plan.tiles.length).toBe(1);
    expect(plan.pageWidthPt).toBeLessThanOrEqual(ISO_MAX_PAGE_SIDE_PT);
    expect(plan.pageWidthPt).toBeGreaterThan(5000 * PT_PER_MM);
  });

  it('refuses an overlap of half the largest fit window or more, naming overlap', () => {
    const result = validateExportOptions({ format: 'pdf', paper: 'fit', overlap: 2600 });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues[0]?.path).toBe('overlap');
  });
});
