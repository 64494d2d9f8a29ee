/**
 * PDF set-up shared by the index template strip and its label: the embedded monospace font, the
 * point conversions and the calibration bar. PostScript points: 72 pt = 1 in = 25.4 mm
 * (ISO 32000-1).
 */
import { readFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import fontkit from '@pdf-lib/fontkit';
import { rgb, type PDFDocument, type PDFFont, type PDFPage } from 'pdf-lib';
import type { LengthUnit } from '~/lib/format/units';

export const PT_PER_IN = 72;
export const PT_PER_MM = 72 / 25.4;

export function ptPerUnit(units: LengthUnit): number {
  return units === 'mm' ? PT_PER_MM : PT_PER_IN;
}

export const INK = rgb(0.12, 0.14, 0.16);
export const FAINT = rgb(0.55, 0.57, 0.6);

let fontBytes: Promise<Uint8Array> | undefined;

/** JetBrains Mono (woff; the woff2 subsets to blank glyphs), subset into the document. */
export async function embedMonoFont(doc: PDFDocument): Promise<PDFFont> {
  fontBytes ??= readFile(createRequire(import.meta.url).resolve('@fontsource/jetbrains-mono/files/jetbrains-mono-latin-400-normal.woff'));
  doc.registerFontkit(fontkit);
  return doc.embedFont(await fontBytes, { subset: true });
}

/** A 100 mm bar and a 4 in bar with ticks, to measure after printing. `x`, `y` in pt (bottom left). */
export function drawCalibrationBars(page: PDFPage, font: PDFFont, x: number, y: number): void {
  const bar = (top: number, length: number, step: number, label: string) => {
    page.drawLine({ start: { x, y: top }, end: { x: x + length, y: top }, thickness: 0.6, color: INK });
    for (let at = 0; at <= length + 1e-6; at += step) {
      page.drawLine({ start: { x: x + at, y: top }, end: { x: x + at, y: top + 5 }, thickness: 0.4, color: INK });
    }
    page.drawText(label, { x: x + length + 6, y: top, size: 7, font, color: INK });
  };
  bar(y + 16, 100 * PT_PER_MM, 10 * PT_PER_MM, '100 mm (ticks 10 mm)');
  bar(y, 4 * PT_PER_IN, PT_PER_IN, '4 in (ticks 1 in)');
}

/** PDF bytes wrapped for a Response body. */
export function pdfResponse(bytes: Uint8Array, fileName: string): Response {
  return new Response(new Uint8Array(bytes), {
    status: 200,
    headers: {
      'content-type': 'application/pdf',
      'content-disposition': `inline; filename="${fileName}"`,
      'cache-control': 'no-store',
    },
  });
}
