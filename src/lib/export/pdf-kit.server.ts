/**
 * PDF set-up shared by every PDF export (paper template, index template strip, template label):
 * the embedded monospace font, the calibration bars and the PDF response. PostScript points:
 * 72 pt = 1 in = 25.4 mm (ISO 32000-1); the conversions live in paper-sizes.ts.
 */
import { readFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import fontkit from '@pdf-lib/fontkit';
import {
  beginMarkedContent,
  endMarkedContent,
  lineTo,
  moveTo,
  rgb,
  setDashPattern,
  setLineWidth,
  setStrokingRgbColor,
  stroke,
  type PDFDocument,
  type PDFFont,
  type PDFPage,
} from 'pdf-lib';
import { mmToPt, PT_PER_IN } from './paper-sizes.ts';
import { woffToSfnt } from './woff-to-sfnt.server.ts';

/** Ink of the index template strip and its label. */
export const INK = rgb(0.12, 0.14, 0.16);
export const FAINT = rgb(0.55, 0.57, 0.6);

/** JetBrains Mono as woff: the woff2 file subsets to blank glyphs. */
const FONT_FILE = '@fontsource/jetbrains-mono/files/jetbrains-mono-latin-400-normal.woff';
let fontBytes: Promise<Uint8Array> | undefined;

/** The font file is read and unpacked once per process. */
function loadFont(): Promise<Uint8Array> {
  fontBytes ??= readFile(createRequire(import.meta.url).resolve(FONT_FILE)).then(woffToSfnt);
  return fontBytes;
}

/** JetBrains Mono, subset into `doc`. */
export async function embedMonoFont(doc: PDFDocument): Promise<PDFFont> {
  doc.registerFontkit(fontkit);
  // No contextual alternates or ligatures: printed numbers and words show exactly as written.
  return memoiseEncoding(await doc.embedFont(await loadFont(), { subset: true, features: { calt: false, liga: false } }));
}

/**
 * fontkit shapes each string anew (about half a millisecond each); a template repeats the same
 * few strings on every page, so each document remembers its encodings.
 */
function memoiseEncoding(font: PDFFont): PDFFont {
  const encode = font.encodeText.bind(font);
  const cache = new Map<string, ReturnType<PDFFont['encodeText']>>();
  font.encodeText = (text: string) => {
    const known = cache.get(text);
    if (known) return known;
    const encoded = encode(text);
    cache.set(text, encoded);
    return encoded;
  };
  return font;
}

/** How far the calibration bars reach above their `start`, pt (the 100 mm bar's end ticks). */
export const CALIBRATION_BARS_TOP_PT = mmToPt(13 + 3);

/**
 * The 100 mm and 4 in calibration bars, to measure after printing. `start` (pt) is the left end of
 * the 4 in bar; the 100 mm bar sits 13 mm above it. The bars themselves are marked content tagged
 * CalibrationBar100mm and CalibrationBar4in, so a test can find them.
 */
export function drawCalibrationBars(page: PDFPage, font: PDFFont, start: { x: number; y: number }): void {
  drawBar(page, font, { x: start.x, y: start.y + mmToPt(13) }, 100, 10, 'mm', 'CalibrationBar100mm');
  drawBar(page, font, start, 4, 1, 'in', 'CalibrationBar4in');
}

/**
 * A calibration bar `length` units long from `start`, with tall end ticks and short ticks every
 * `step`, labelled with its length.
 */
function drawBar(page: PDFPage, font: PDFFont, start: { x: number; y: number }, length: number, step: number, unit: 'mm' | 'in', tag: string): void {
  const toPt = (value: number) => (unit === 'mm' ? mmToPt(value) : value * PT_PER_IN);
  const end = start.x + toPt(length);
  const tall = mmToPt(3);
  const short = mmToPt(1.5);
  page.pushOperators(
    beginMarkedContent(tag),
    setLineWidth(0.5),
    setDashPattern([], 0),
    setStrokingRgbColor(0, 0, 0),
    moveTo(start.x, start.y),
    lineTo(end, start.y),
    stroke(),
    endMarkedContent(),
    moveTo(start.x, start.y - tall),
    lineTo(start.x, start.y + tall),
    moveTo(end, start.y - tall),
    lineTo(end, start.y + tall),
  );
  for (let at = step; at < length - step / 2; at += step) {
    const x = start.x + toPt(at);
    page.pushOperators(moveTo(x, start.y), lineTo(x, start.y + short));
  }
  page.pushOperators(stroke());
  page.drawText(`${length} ${unit}`, { x: end + mmToPt(2), y: start.y - 2.5, size: 8, font });
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
