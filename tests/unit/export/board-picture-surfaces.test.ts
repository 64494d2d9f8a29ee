/**
 * One picture of the board on every surface: the picture the editor draws from, the proof
 * drawing, the Boards thumbnail, the paper template PDF (read back with pdfjs-dist), and the slot
 * paths as SVG and DXF (read back with dxf-parser) all show the same parts: every fret including
 * the zero fret, face and side dots at the design's diameters, nut, saddle (where the surface
 * draws it), outline and centre line.
 */
import DxfParser from 'dxf-parser';
import { describe, expect, it } from 'vitest';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { boardThumbnailSvg } from '~/lib/export/board-thumbnail.ts';
import { exportDesign } from '~/lib/export/export-design.server.ts';
import { exportFileName } from '~/lib/export/file-name.ts';
import { proofDrawing } from '~/lib/export/proof-drawing.ts';
import { toMm } from '~/lib/format/units.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { boardPicture, partsOn } from '~/lib/picture/board-picture.ts';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';
import { validateExportOptions } from '~/lib/schemas/export-options.ts';
import { readPdf } from '../../support/pdf-readback.ts';

/** What a surface shows. Dot diameters in mm, rounded to 0.1 mm; frets by number. */
interface Shown {
  frets: number[];
  faceDotsMm: number[];
  sideDotsMm: number[];
  nut: boolean;
  saddle: boolean;
  outline: boolean;
  centreLine: boolean;
}

/** Dot diameters survive every surface within 0.03 mm (the thumbnail rounds to 0.001 design units). */
const DOT_TOLERANCE_MM = 0.03;
const PT_PER_MM = 72 / 25.4;

function demo(id: string): Design {
  const found = DEMO_DESIGNS.find((d) => d.id === id);
  if (!found) throw new Error(`no demo design ${id}`);
  return found.design;
}

function expectDots(actualMm: number[], expectedMm: number[], what: string): void {
  expect(actualMm.length, `${what}: count`).toBe(expectedMm.length);
  const sorted = [...actualMm].sort((a, b) => a - b);
  [...expectedMm].sort((a, b) => a - b).forEach((expected, index) => {
    const actual = sorted[index]!;
    if (!(Math.abs(actual - expected) <= DOT_TOLERANCE_MM)) throw new Error(`${what}: dot of ${actual} mm is not within ${DOT_TOLERANCE_MM} mm of ${expected} mm`);
  });
}

function expectShows(shown: Shown, expected: Shown, what: string): void {
  expect(shown.frets, `${what}: frets`).toEqual(expected.frets);
  expectDots(shown.faceDotsMm, expected.faceDotsMm, `${what}: face dots`);
  expectDots(shown.sideDotsMm, expected.sideDotsMm, `${what}: side dots`);
  expect({ nut: shown.nut, saddle: shown.saddle, outline: shown.outline, centreLine: shown.centreLine }, what).toEqual({
    nut: expected.nut,
    saddle: expected.saddle,
    outline: expected.outline,
    centreLine: expected.centreLine,
  });
}

async function exported(design: Design, input: Record<string, unknown>): Promise<Uint8Array> {
  const options = validateExportOptions(input);
  if (!options.ok) throw new Error(JSON.stringify(options.issues));
  return (await exportDesign(design, options.options)).bytes;
}

/** The `<g data-layer|id="layer">` group's inner text of an SVG. */
function svgGroup(svg: string, attribute: 'data-layer' | 'id', layer: string): string {
  return new RegExp(`<g ${attribute}="${layer}">([\\s\\S]*?)</g>`).exec(svg)?.[1] ?? '';
}

function svgRadii(group: string): number[] {
  return [...group.matchAll(/<circle [^>]*r="([^"]+)"/g)].map((m) => Number(m[1]));
}

/** Fret numbers whose fret (or slot) line's treble-end x matches a drawn line's x1 within `tolerance` (design units). */
function fretsAt(xs: number[], design: Design, tolerance: number, role: 'fret' | 'slot'): number[] {
  const layout = computeLayout(design);
  const lines = boardPicture(layout).parts.filter((p) => p.kind === 'line' && p.role === role);
  return lines
    .filter((p) => p.kind === 'line' && xs.some((x) => Math.abs(x - p.segment.start.x) <= tolerance))
    .map((p) => (p.kind === 'line' ? p.fret! : -1));
}

for (const id of ['tenor-ukulele', 'seven-string-fan']) {
  describe(`${id}: every surface shows the same board`, () => {
    const design = demo(id);
    const layout = computeLayout(design);
    const mm = (value: number) => toMm(value, layout.units);
    const faceCount = layout.markers.reduce((n, m) => n + m.dots.length, 0);
    const expected: Shown = {
      frets: [...(design.zeroFret ? [0] : []), ...layout.frets.map((f) => f.number)],
      faceDotsMm: Array.from({ length: faceCount }, () => 6), // the design default, common practice (from memory)
      sideDotsMm: Array.from({ length: layout.markers.length }, () => 2),
      nut: true,
      saddle: true,
      outline: true,
      centreLine: true,
    };

    it('the design carries the zero fret (ukulele) and dots of 6 mm and 2 mm by default', () => {
      expect(expected.frets.length).toBe(design.frets + (id === 'tenor-ukulele' ? 1 : 0));
      expect(mm(design.faceDotDiameter)).toBeCloseTo(6, 9);
      expect(mm(design.sideDotDiameter)).toBeCloseTo(2, 9);
    });

    it('the picture the editor draws from', () => {
      const picture = boardPicture(layout);
      const lines = (layer: Parameters<typeof partsOn>[1]) => partsOn(picture, layer, 'line');
      expectShows(
        {
          frets: lines('frets').map((p) => p.fret!),
          faceDotsMm: partsOn(picture, 'face-dots', 'circle').map((d) => mm(d.diameter)),
          sideDotsMm: partsOn(picture, 'side-dots', 'circle').map((d) => mm(d.diameter)),
          nut: lines('nut').some((p) => p.role === 'nut'),
          saddle: lines('saddle').some((p) => p.role === 'saddle'),
          outline: partsOn(picture, 'outline', 'polygon').length === 1,
          centreLine: lines('centre-line').length === 1,
        },
        expected,
        'picture',
      );
      // Fret numbers label every fret, the zero fret too.
      expect(partsOn(picture, 'labels', 'text').map((t) => t.text)).toEqual(expected.frets.map(String));
    });

    it('the proof drawing', () => {
      const d = proofDrawing(layout);
      expectShows(
        {
          frets: d.frets.map((f) => f.number),
          faceDotsMm: d.dots.filter((dot) => !dot.side).map((dot) => mm(2 * dot.r)),
          sideDotsMm: d.dots.filter((dot) => dot.side).map((dot) => mm(2 * dot.r)),
          nut: d.nut.x1 !== d.nut.x2 || d.nut.y1 !== d.nut.y2,
          saddle: d.saddle.y1 !== d.saddle.y2,
          outline: d.outline.split(' ').length === layout.outline.length,
          centreLine: d.centreLine.x2 > d.centreLine.x1,
        },
        expected,
        'proof',
      );
    });

    it('the Boards thumbnail (to the board end: no saddle)', () => {
      const svg = boardThumbnailSvg(layout);
      const fretXs = [...svgGroup(svg, 'data-layer', 'frets').matchAll(/<line x1="([^"]+)"/g)].map((m) => Number(m[1]));
      expectShows(
        {
          frets: fretsAt(fretXs, design, 0.0006, 'fret'),
          faceDotsMm: svgRadii(svgGroup(svg, 'data-layer', 'face-dots')).map((r) => mm(2 * r)),
          sideDotsMm: svgRadii(svgGroup(svg, 'data-layer', 'side-dots')).map((r) => mm(2 * r)),
          nut: svgGroup(svg, 'data-layer', 'nut').includes('<line '),
          saddle: svg.includes('data-layer="saddle"'),
          outline: svgGroup(svg, 'data-layer', 'outline').includes('<polygon '),
          centreLine: svgGroup(svg, 'data-layer', 'centre-line').includes('<line '),
        },
        { ...expected, saddle: false },
        'thumbnail',
      );
      expect(fretXs).toHaveLength(expected.frets.length);
    });

    it('the paper template PDF on one fitted sheet, read back with pdfjs-dist (to the saddle)', async () => {
      const [page] = await readPdf(await exported(design, { format: 'pdf', paper: 'fit', toSaddle: true }));
      const tags = page!.tagged;
      const diametersMm = (tag: string) => (page!.taggedCurves.get(tag) ?? []).map((box) => (box.maxX - box.minX) / PT_PER_MM);
      const frets = [...tags.keys()].filter((tag) => /^Fret\d+$/.test(tag)).map((tag) => Number(tag.slice(4)));
      expectShows(
        {
          frets: frets.sort((a, b) => a - b),
          faceDotsMm: diametersMm('FaceDot'),
          sideDotsMm: diametersMm('SideDot'),
          nut: (tags.get('Nut') ?? []).length > 0,
          saddle: (tags.get('Saddle') ?? []).length > 0,
          // The read-back counts line segments; the closing edge is a closePath.
          outline: (tags.get('Outline') ?? []).length === layout.outline.length - 1,
          centreLine: (tags.get('CentreLine') ?? []).length > 0,
        },
        expected,
        'PDF',
      );
    });

    it('the slot paths SVG', async () => {
      const svg = new TextDecoder().decode(await exported(design, { format: 'svg' }));
      const slotXs = [...svgGroup(svg, 'id', 'slots').matchAll(/<line x1="([^"]+)"/g)].map((m) => Number(m[1]));
      const dots = svgRadii(svgGroup(svg, 'id', 'markers')).map((r) => mm(2 * r));
      expectShows(
        {
          frets: fretsAt(slotXs, design, 1e-9, 'slot'),
          faceDotsMm: dots.filter((d) => d > 4),
          sideDotsMm: dots.filter((d) => d <= 4),
          nut: svgGroup(svg, 'id', 'nut').includes('<line '),
          saddle: svgGroup(svg, 'id', 'saddle').includes('<line '),
          outline: svgGroup(svg, 'id', 'outline').includes('<path '),
          centreLine: svgGroup(svg, 'id', 'centre-line').includes('<line '),
        },
        expected,
        'slot-path SVG',
      );
      expect(slotXs).toHaveLength(expected.frets.length);
    });

    it('the slot paths DXF, read back with dxf-parser: dots are CIRCLEs of their diameter, no TEXT', async () => {
      const parsed = new DxfParser().parseSync(new TextDecoder().decode(await exported(design, { format: 'dxf' })))!;
      const entities = parsed.entities as unknown as { type: string; layer: string; radius?: number; shape?: boolean; vertices?: { x: number }[] }[];
      const on = (layer: string) => entities.filter((e) => e.layer === layer);
      const dots = on('markers').map((e) => {
        expect(e.type).toBe('CIRCLE');
        return mm(2 * e.radius!);
      });
      const slotXs = on('slots').map((e) => e.vertices![0]!.x);
      expectShows(
        {
          frets: fretsAt(slotXs, design, 1e-9, 'slot'),
          faceDotsMm: dots.filter((d) => d > 4),
          sideDotsMm: dots.filter((d) => d <= 4),
          nut: on('nut').length === 1,
          saddle: on('saddle').length === 1,
          outline: on('outline').length === 1 && on('outline')[0]!.shape === true,
          centreLine: on('centre-line').length === 1,
        },
        expected,
        'DXF',
      );
      expect(entities.filter((e) => e.type === 'TEXT')).toEqual([]);
    });
  });
}

describe('a settable dot diameter reaches every surface', () => {
  it('an 8 mm face dot and a 3 mm side dot draw at those sizes in the picture, proof, PDF and DXF', async () => {
    const result = validateDesign({ ...demo('seven-string-fan'), faceDotDiameter: 8, sideDotDiameter: 3 });
    if (!result.ok) throw new Error(JSON.stringify(result.issues));
    const layout = computeLayout(result.design);
    expect(partsOn(boardPicture(layout), 'face-dots', 'circle').every((d) => d.diameter === 8)).toBe(true);
    expect(proofDrawing(layout).dots.every((d) => d.r === (d.side ? 1.5 : 4))).toBe(true);
    const [page] = await readPdf(await exported(result.design, { format: 'pdf', paper: 'fit' }));
    expectDots(page!.taggedCurves.get('SideDot')!.map((b) => (b.maxX - b.minX) / PT_PER_MM), layout.markers.map(() => 3), 'PDF side dots');
    const parsed = new DxfParser().parseSync(new TextDecoder().decode(await exported(result.design, { format: 'dxf' })))!;
    const radii = (parsed.entities as unknown as { layer: string; radius: number }[]).filter((e) => e.layer === 'markers').map((e) => e.radius);
    expect(new Set(radii)).toEqual(new Set([4, 1.5]));
  });
});

describe('one download name for the same file', () => {
  it('names the fret table the same from the editor tab and from the export route, accents folded to ASCII', async () => {
    const design = { ...demo('tenor-ukulele'), name: 'Señor Ukulele' };
    const options = validateExportOptions({ format: 'csv' });
    if (!options.ok) throw new Error('options');
    // The editor's fret-table tab names its download with exportFileName(design.name, 'csv').
    expect((await exportDesign(design, options.options)).filename).toBe(exportFileName(design.name, 'csv'));
    expect(exportFileName(design.name, 'csv')).toBe('senor-ukulele-fret-table.csv');
    expect(exportFileName(design.name, { kind: 'board-file', revision: 2 })).toBe('senor-ukulele-r2-board.json');
    expect(exportFileName(design.name, { kind: 'index-template', templateId: 7, format: 'dxf' })).toBe('senor-ukulele-7-index-template.dxf');
  });
});
