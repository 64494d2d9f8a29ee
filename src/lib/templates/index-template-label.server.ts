/**
 * The label stuck on a physical index template: name, scale length(s) in mm and in, frets, slot
 * width, made-on date and a QR code that opens the template's page. One label on a page of the
 * label's own size, or a full A4 / Letter sheet of identical labels.
 */
import { PDFDocument, type PDFFont, type PDFPage } from 'pdf-lib';
import QRCode from 'qrcode';
import { convertLength, formatLength } from '~/lib/format/units.ts';
import type { TemplateSpec } from '~/lib/schemas/template.ts';
import { PT_PER_IN, PT_PER_MM } from '~/lib/export/paper-sizes.ts';
import { embedMonoFont, INK } from '~/lib/export/pdf-kit.server.ts';

interface SheetLayout {
  page: [number, number];
  columns: number;
  rows: number;
  /** Gap between labels, pt. */
  gapX: number;
  gapY: number;
}

export interface LabelSize {
  id: string;
  description: string;
  /** Label width and height, pt. */
  width: number;
  height: number;
  sheet?: SheetLayout;
}

const mm = (value: number) => value * PT_PER_MM;

/** A few common label sizes (common practice for small label printers and label sheets). */
export const LABEL_SIZES: readonly LabelSize[] = [
  { id: '89x36', description: '89 × 36 mm roll label', width: mm(89), height: mm(36) },
  { id: '62x29', description: '62 × 29 mm roll label', width: mm(62), height: mm(29) },
  { id: '100x50', description: '100 × 50 mm roll label', width: mm(100), height: mm(50) },
  {
    id: 'a4-sheet',
    description: 'A4 sheet, 2 × 7 labels of 99.1 × 38.1 mm',
    width: mm(99.1),
    height: mm(38.1),
    sheet: { page: [595.2756, 841.8898], columns: 2, rows: 7, gapX: mm(2.5), gapY: 0 },
  },
  {
    id: 'letter-sheet',
    description: 'Letter sheet, 2 × 5 labels of 4 × 2 in',
    width: 4 * PT_PER_IN,
    height: 2 * PT_PER_IN,
    sheet: { page: [612, 792], columns: 2, rows: 5, gapX: 0.1875 * PT_PER_IN, gapY: 0 },
  },
];

export type LabelSizeId = string;

export function labelSize(id: string): LabelSize | undefined {
  return LABEL_SIZES.find((size) => size.id === id);
}

export interface LabelContent extends TemplateSpec {
  /** YYYY-MM-DD or null. */
  madeOn: string | null;
  /** The template's page, opened by the QR code. */
  url: string;
  /** The board revision the template was made from, and its fingerprint (null: typed scale lengths). */
  revision?: number | null;
  fingerprint?: string | null;
}

/** Scale length(s) in both units, e.g. "650.00 mm / 25.591 in". */
export function scaleInBothUnits(content: Pick<LabelContent, 'units' | 'trebleScale' | 'bassScale'>): string {
  const both = (length: number) => ({ mm: convertLength(length, content.units, 'mm'), in: convertLength(length, content.units, 'in') });
  const treble = both(content.trebleScale);
  if (content.trebleScale === content.bassScale) return `${formatLength(treble.mm, 'mm', true)} / ${formatLength(treble.in, 'in', true)}`;
  const bass = both(content.bassScale);
  return `${formatLength(treble.mm, 'mm')}-${formatLength(bass.mm, 'mm', true)} / ${formatLength(treble.in, 'in')}-${formatLength(bass.in, 'in', true)}`;
}

export function labelLines(content: LabelContent): string[] {
  return [
    content.name,
    `Scale ${scaleInBothUnits(content)}`,
    `${content.frets} frets · slot ${formatLength(content.slotWidth, content.units, true)}`,
    `Made ${content.madeOn ?? 'date not recorded'}`,
    ...(content.revision != null && content.fingerprint ? [`Board rev ${content.revision} · ${content.fingerprint}`] : []),
  ];
}

/** The QR code as filled squares, runs of dark modules merged, with a 4-module quiet zone. */
function drawQr(page: PDFPage, url: string, x: number, y: number, side: number): void {
  const qr = QRCode.create(url, { errorCorrectionLevel: 'M' });
  const count = qr.modules.size;
  const quiet = 4;
  const cell = side / (count + 2 * quiet);
  for (let row = 0; row < count; row++) {
    let runStart = -1;
    for (let col = 0; col <= count; col++) {
      const dark = col < count && qr.modules.get(row, col) === 1;
      if (dark && runStart < 0) runStart = col;
      if (!dark && runStart >= 0) {
        page.drawRectangle({
          x: x + (quiet + runStart) * cell,
          y: y + side - (quiet + row + 1) * cell,
          width: (col - runStart) * cell,
          height: cell,
          color: INK,
        });
        runStart = -1;
      }
    }
  }
}

/** The largest size (pt, at most `max`) at which `text` fits in `width`. */
function fitSize(font: PDFFont, text: string, width: number, max: number): number {
  return Math.min(max, width / Math.max(font.widthOfTextAtSize(text, 1), 1e-6));
}

function drawLabel(page: PDFPage, font: PDFFont, content: LabelContent, x: number, y: number, size: LabelSize): void {
  const pad = Math.min(size.height * 0.08, mm(3));
  const qrSide = size.height - 2 * pad;
  drawQr(page, content.url, x + size.width - pad - qrSide, y + pad, qrSide);
  const textWidth = size.width - 3 * pad - qrSide;
  const lines = labelLines(content);
  const lineStep = (size.height - 2 * pad) / lines.length;
  lines.forEach((text, i) => {
    const max = i === 0 ? lineStep * 0.8 : lineStep * 0.62;
    const fontSize = fitSize(font, text, textWidth, max);
    page.drawText(text, { x: x + pad, y: y + size.height - pad - lineStep * (i + 1) + lineStep * 0.25, size: fontSize, font, color: INK });
  });
}

/** The label PDF in `size`; a sheet size repeats the label in every position. */
export async function templateLabelPdf(content: LabelContent, size: LabelSize): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.setTitle(`Template label: ${content.name}`);
  doc.setCreator('Kerfline');
  const font = await embedMonoFont(doc);
  if (!size.sheet) {
    drawLabel(doc.addPage([size.width, size.height]), font, content, 0, 0, size);
    return doc.save();
  }
  const { page: pageSize, columns, rows, gapX, gapY } = size.sheet;
  const page = doc.addPage(pageSize);
  const left = (pageSize[0] - columns * size.width - (columns - 1) * gapX) / 2;
  const bottom = (pageSize[1] - rows * size.height - (rows - 1) * gapY) / 2;
  for (let row = 0; row < rows; row++) {
    for (let col = 0; col < columns; col++) {
      drawLabel(page, font, content, left + col * (size.width + gapX), bottom + row * (size.height + gapY), size);
    }
  }
  return doc.save();
}
