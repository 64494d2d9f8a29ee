/**
 * The paper template's optional last page: the fret distances table (distance-table.ts), with the
 * same caution and title block as every other page. Portrait, on the template's sheet size (A4 for
 * a millimetre design and Letter for an inch design when the template is one sheet sized to the board).
 */
import type { PDFDocument, PDFFont } from 'pdf-lib';
import { formatLength } from '~/lib/format/units.ts';
import type { Layout } from '~/lib/geometry/layout.ts';
import { distanceRows } from './distance-table.ts';
import { PAGE_FRAME_MM } from './page-frame.ts';
import { PAPER_SIZES, mmToPt } from './paper-sizes.ts';
import { INK } from './pdf-kit.server.ts';
import { PRINT_CAUTION } from './safety-note.ts';
import type { TilePlan } from './tile-pages.ts';

const ROW_PT = 13;
const SIZE_PT = 9;
const COLUMNS_PT = [0, 60, 190, 320] as const;

/** Adds the distances page; `drawFooter` puts the calibration bars and title block on it. */
export function addDistancePage(document: PDFDocument, font: PDFFont, layout: Layout, plan: TilePlan, drawFooter: (page: ReturnType<PDFDocument['addPage']>) => void): void {
  const paper = plan.paper === 'fit' ? (layout.units === 'mm' ? PAPER_SIZES.a4 : PAPER_SIZES.letter) : PAPER_SIZES[plan.paper];
  const page = document.addPage([paper.widthPt, paper.heightPt]);
  const left = mmToPt(PAGE_FRAME_MM.margin);
  let y = paper.heightPt - mmToPt(PAGE_FRAME_MM.margin) - 12;
  const write = (text: string, x: number, size = SIZE_PT) => page.drawText(text, { x: left + x, y, size, font, color: INK });
  write(PRINT_CAUTION, 0, 10);
  y -= 20;
  write(`Fret distances (${layout.units}) from the ${layout.zeroFret ? 'zero fret' : 'nut line'} as printed, along each line`, 0, 10);
  y -= ROW_PT * 1.5;
  ['fret', 'treble edge', 'bass edge', 'centre line'].forEach((heading, i) => write(heading, COLUMNS_PT[i]!));
  y -= ROW_PT;
  for (const row of distanceRows(layout)) {
    [String(row.fret), row.trebleEdge, row.bassEdge, row.centreLine].forEach((cell, i) =>
      write(typeof cell === 'string' ? cell : formatLength(cell, layout.units), COLUMNS_PT[i]!),
    );
    y -= ROW_PT;
  }
  drawFooter(page);
}
