/**
 * The shop cut sheet: two pages for the bench beside the machine. Page 1: the board's key numbers,
 * a small drawing of the board (the picture model, not to scale) and the slot table (fret, distance
 * from the nut along each edge, slot length, depth). Page 2: the fret wire cut list with its totals
 * and stock count, the chosen wire and its checks, the cautions and the revision fingerprint.
 * On the paper template's sheet size (A4 for `fit` and the sizes without a sheet).
 */
import { PDFDocument, rgb, type PDFFont, type PDFPage } from 'pdf-lib';
import { formatLength } from '~/lib/format/units.ts';
import type { Layout, Point } from '~/lib/geometry/layout.ts';
import { boardPicture, boundsOf, partsOn } from '~/lib/picture/board-picture.ts';
import type { Design } from '~/lib/schemas/design.ts';
import type { ExportOptions } from '~/lib/schemas/export-options.ts';
import { cutList } from './cut-list.ts';
import { designFingerprint } from '~/lib/boards/fingerprint.server.ts';
import { distanceRows } from './distance-table.ts';
import { PAGE_FRAME_MM } from './page-frame.ts';
import { PAPER_SIZES, mmToPt } from './paper-sizes.ts';
import { embedMonoFont, FAINT, INK } from './pdf-kit.server.ts';
import { DRY_RUN_NOTE, MACHINE_SAFETY_NOTES } from './safety-note.ts';
import { revisionWords, titleBlockLines, type ExportContext } from './title-block.ts';

const SIZE_PT = 8;
const ROW_PT = 10.5;
const DRAWING_HEIGHT_PT = 110;
const WARN = rgb(0.7, 0.1, 0.05);

export async function cutSheetPdf(design: Design, layout: Layout, options: Pick<ExportOptions, 'paper' | 'mirror'>, context: ExportContext): Promise<Uint8Array> {
  const paper = options.paper === 'letter' || options.paper === 'legal' ? PAPER_SIZES.letter : PAPER_SIZES.a4;
  const doc = await PDFDocument.create();
  doc.setTitle(`Cut sheet: ${design.name}`);
  doc.setCreator('Kerfline');
  const font = await embedMonoFont(doc);
  const units = design.units;
  const len = (value: number) => formatLength(value, units);
  const fingerprint = context.revision == null ? `Unsaved design · fingerprint ${designFingerprint(design)}` : `Board ${revisionWords(context)}`;
  const list = cutList(design, layout, context.wire ?? null, undefined);

  const first = new Writer(doc, font, paper.widthPt, paper.heightPt);
  first.line(`Shop cut sheet: ${design.name}`, 12);
  for (const text of titleBlockLines(design, { mirror: false }, context).slice(1)) first.line(text);
  first.line(
    design.radius.nut === 0
      ? 'Board flat (no radius)'
      : `Radius ${formatLength(design.radius.nut, units, true)} at the nut, ${formatLength(design.radius.end === 0 ? design.radius.nut : design.radius.end, units, true)} at the last fret`,
  );
  first.line(`Slot depth ${formatLength(design.slot.depth, units, true)} below the top · ${fingerprint}`);
  first.gap(4);
  drawBoard(first.page, layout, { x: first.left, y: first.y - DRAWING_HEIGHT_PT, width: first.width, height: DRAWING_HEIGHT_PT });
  first.gap(DRAWING_HEIGHT_PT + 6);
  first.line('Board drawing not to scale; use the paper template or the slot paths for positions.', SIZE_PT, FAINT);
  first.gap(4);
  first.line(`Slots (${units}): distances from the ${layout.zeroFret ? 'zero fret' : 'nut line'} along each edge`, 10);
  const slotLengths = new Map(list.rows.map((row) => [row.fret, row.slotLength]));
  first.row(['fret', 'treble edge', 'bass edge', 'slot length', 'depth']);
  for (const row of distanceRows(layout)) {
    first.row([String(row.fret), len(row.trebleEdge), len(row.bassEdge), len(slotLengths.get(row.fret) ?? 0), len(design.slot.depth)]);
  }

  const second = new Writer(doc, font, paper.widthPt, paper.heightPt);
  second.line(`Fret wire cut list: ${design.name}`, 12);
  second.line(`Wire length = arc length over the radius + 2 × ${formatLength(list.endAllowance, units, true)} end allowance`);
  second.row(['fret', 'slot length', 'arc length', 'wire length']);
  for (const row of list.rows) second.row([String(row.fret), len(row.slotLength), len(row.arcLength), len(row.wireLength)]);
  second.row(['total', len(list.totals.slotLength), len(list.totals.arcLength), len(list.totals.wireLength)]);
  second.gap(4);
  second.line(list.stock ? `Stock: ${list.stock.pieces} piece(s) of ${formatLength(list.stock.length, units, true)} (first-fit, longest piece first)` : 'Stock: no fret wire chosen for this board, so no stock count.');
  if (list.tooLong.length > 0) second.line(`Longer than the stock: fret ${list.tooLong.join(', ')}`, SIZE_PT, WARN);
  second.gap(4);
  if (list.wire) {
    const w = list.wire.wire;
    second.line(`Fret wire: ${w.name}${w.source ? ` (${w.source})` : ''}`, 10);
    second.line(`Crown ${w.crownWidthMm} × ${w.crownHeightMm} mm, tang ${w.tangWidthMm} mm wide × ${w.tangDepthMm} mm deep, barbs ${w.barbWidthMm} mm, stock ${w.stockLengthMm} mm`);
    for (const check of list.wire.checks) second.line(`${check.ok ? 'OK' : 'WARNING'}: ${check.message}`, SIZE_PT, check.ok ? INK : WARN);
  } else {
    second.line('Fret wire: none chosen (the shop\'s fret wire list; checks of slot width and depth need one).', 10);
  }
  second.gap(6);
  second.line('Cautions', 10);
  for (const note of [DRY_RUN_NOTE, ...MACHINE_SAFETY_NOTES]) second.wrapped(note);
  second.gap(4);
  second.line(fingerprint, SIZE_PT, FAINT);
  return doc.save();
}

/** Writes lines and table rows down a page from the top margin. */
class Writer {
  readonly page: PDFPage;
  readonly left = mmToPt(PAGE_FRAME_MM.margin);
  readonly width: number;
  y: number;

  constructor(doc: PDFDocument, private readonly font: PDFFont, widthPt: number, heightPt: number) {
    this.page = doc.addPage([widthPt, heightPt]);
    this.width = widthPt - 2 * this.left;
    this.y = heightPt - this.left - 12;
  }

  line(text: string, size = SIZE_PT, color = INK): void {
    this.page.drawText(text, { x: this.left, y: this.y, size, font: this.font, color });
    this.y -= size * 1.45;
  }

  /** A line broken at spaces to the page width. */
  wrapped(text: string, size = SIZE_PT): void {
    const perLine = Math.floor(this.width / (size * 0.6));
    let line = '';
    for (const word of text.split(' ')) {
      if (line && line.length + 1 + word.length > perLine) {
        this.line(line, size);
        line = word;
      } else line = line ? `${line} ${word}` : word;
    }
    if (line) this.line(line, size);
  }

  row(cells: readonly string[]): void {
    cells.forEach((cell, i) => this.page.drawText(cell, { x: this.left + i * 95, y: this.y, size: SIZE_PT, font: this.font, color: INK }));
    this.y -= ROW_PT;
  }

  gap(pt: number): void {
    this.y -= pt;
  }
}

/** The board's outline, slots, centre line and nut from the picture, fitted into `box` (pt, y up). */
function drawBoard(page: PDFPage, layout: Layout, box: { x: number; y: number; width: number; height: number }): void {
  const picture = boardPicture(layout, { to: 'board-end' });
  const bounds = boundsOf(layout.outline);
  const scale = Math.min(box.width / (bounds.maxX - bounds.minX), box.height / (bounds.maxY - bounds.minY));
  // Bass side (+y) up the page, as the paper template draws it.
  const at = (p: Point) => ({ x: box.x + (p.x - bounds.minX) * scale, y: box.y + (p.y - bounds.minY) * scale });
  for (const polygon of partsOn(picture, 'outline', 'polygon')) {
    polygon.points.forEach((p, i) => page.drawLine({ start: at(p), end: at(polygon.points[(i + 1) % polygon.points.length]!), thickness: 0.6, color: INK }));
  }
  for (const layer of ['slots', 'centre-line', 'nut'] as const) {
    for (const line of partsOn(picture, layer, 'line')) {
      page.drawLine({ start: at(line.segment.start), end: at(line.segment.end), thickness: layer === 'slots' ? 0.4 : 0.3, color: layer === 'slots' ? WARN : FAINT });
    }
  }
}
