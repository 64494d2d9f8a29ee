import { describe, expect, it } from 'vitest';
import { LABEL_SIZES, labelSize, scaleInBothUnits, templateLabelPdf, type LabelContent } from '~/lib/templates/index-template-label.server.ts';
import { expectNear } from '../../support/expect-near.ts';
import { decodeQr, readPdf } from '../../support/pdf-readback.ts';

const PT_PER_MM = 72 / 25.4; // ISO 32000-1: 72 pt = 1 in = 25.4 mm
const URL_OF_TEMPLATE = 'http://127.0.0.1:4321/templates/42';

const content: LabelContent = {
  name: 'Classical 650 master',
  units: 'mm',
  trebleScale: 650,
  bassScale: 650,
  frets: 19,
  slotWidth: 0.6,
  madeOn: '2026-01-15',
  url: URL_OF_TEMPLATE,
};

describe('template label PDF', () => {
  it('gives the scale in both units (1 in = 25.4 mm exactly)', () => {
    expect(scaleInBothUnits(content)).toBe('650.00 mm / 25.591 in');
    expect(scaleInBothUnits({ units: 'in', trebleScale: 13.5, bassScale: 13.5 })).toBe('342.90 mm / 13.500 in');
    expect(scaleInBothUnits({ units: 'mm', trebleScale: 648, bassScale: 686 })).toBe('648.00-686.00 mm / 25.512-27.008 in');
  });

  for (const [id, widthMm, heightMm] of [['89x36', 89, 36], ['62x29', 62, 29], ['100x50', 100, 50]] as const) {
    it(`${id}: page is ${widthMm} x ${heightMm} mm, carries name, scale, frets, slot width, date, and the QR code decodes to the template's URL`, async () => {
      const bytes = await templateLabelPdf(content, labelSize(id)!);
      const [page] = await readPdf(bytes);
      expectNear(page!.widthPt, widthMm * PT_PER_MM, 0.01); // pt
      expectNear(page!.heightPt, heightMm * PT_PER_MM, 0.01); // pt
      for (const text of ['Classical 650 master', 'Scale 650.00 mm / 25.591 in', '19 frets · slot 0.60 mm', 'Made 2026-01-15']) {
        expect(page!.text).toContain(text);
      }
      expect(decodeQr(bytes, 300)).toBe(URL_OF_TEMPLATE);
    });
  }

  it('A4 and Letter sheets: page sizes of ISO 216 A4 (210 x 297 mm) and US Letter (8.5 x 11 in), every label filled, QR readable', async () => {
    const a4 = labelSize('a4-sheet')!;
    const a4Bytes = await templateLabelPdf(content, a4);
    const [a4Page] = await readPdf(a4Bytes);
    expectNear(a4Page!.widthPt, 210 * PT_PER_MM, 0.01); // pt
    expectNear(a4Page!.heightPt, 297 * PT_PER_MM, 0.01); // pt
    expect(a4Page!.text.split('Classical 650 master').length - 1).toBe(14);
    const letterBytes = await templateLabelPdf(content, labelSize('letter-sheet')!);
    const [letterPage] = await readPdf(letterBytes);
    expectNear(letterPage!.widthPt, 8.5 * 72, 0.01); // pt
    expectNear(letterPage!.heightPt, 11 * 72, 0.01); // pt
    expect(letterPage!.text.split('Classical 650 master').length - 1).toBe(10);
    // Decode the top-left label of the A4 sheet: crop it at 200 dpi.
    const dpi = 200;
    const px = (pt: number) => Math.round((pt / 72) * dpi);
    const left = (a4Page!.widthPt - 2 * a4.width - a4.sheet!.gapX) / 2;
    const top = (a4Page!.heightPt - 7 * a4.height) / 2;
    expect(decodeQr(a4Bytes, dpi, { x: px(left), y: px(top), w: px(a4.width), h: px(a4.height) })).toBe(URL_OF_TEMPLATE);
  });

  it('offers roll sizes and sheets', () => {
    expect(LABEL_SIZES.map((s) => s.id)).toEqual(['89x36', '62x29', '100x50', 'a4-sheet', 'letter-sheet']);
  });
});
