/**
 * The index template strip as a 1:1 PDF on one page sized to fit it (for a roll or large-format
 * printer, or to glue onto template stock), with the calibration bars, the print-at-100 % caution
 * and the machine cautions. The strip is drawn in board coordinates with y (bass side) down.
 */
import { PDFDocument, degrees, rgb, type PDFPage } from 'pdf-lib';
import type { Point } from '~/lib/geometry/plane.ts';
import { CALIBRATION_BARS_TOP_PT, drawCalibrationBars, embedMonoFont, FAINT, INK } from '~/lib/export/pdf-kit.server.ts';
import { PRINT_CAUTION } from '~/lib/export/safety-note.ts';
import type { IndexTemplateStrip } from '~/lib/templates/index-template.ts';
import { indexTemplatePage, STRIP_PAGE_PT, type StripPlacement } from '~/lib/templates/index-template-page.ts';

export async function indexTemplatePdf(strip: IndexTemplateStrip): Promise<{ bytes: Uint8Array; placement: StripPlacement; pageSize: [number, number] }> {
  const { pageSize, placement } = indexTemplatePage(strip);
  const [width, height] = pageSize;
  const { scale } = placement;
  const margin = STRIP_PAGE_PT.margin;
  const at = (p: Point) => ({ x: placement.originX + p.x * scale, y: placement.originY - p.y * scale });

  const doc = await PDFDocument.create();
  doc.setTitle(`Index template: ${strip.name}`);
  doc.setCreator('Kerfline');
  const font = await embedMonoFont(doc);
  const page = doc.addPage([width, height]);

  const polygon = (points: readonly Point[], thickness: number, target: PDFPage = page) => {
    points.forEach((p, i) => {
      target.drawLine({ start: at(p), end: at(points[(i + 1) % points.length]!), thickness, color: INK });
    });
  };
  polygon(strip.outline, 0.6);
  for (const slot of [strip.nutSlot, ...strip.slots]) {
    polygon(slot.outline, 0.3);
    // Hairline on the slot's centre line: the exact fret position.
    page.drawLine({ start: at(slot.cut.start), end: at(slot.cut.end), thickness: 0.1, color: rgb(0.75, 0.1, 0.1) });
  }
  for (const text of strip.engraving) {
    const size = text.height * scale;
    const start = at(text.start);
    const end = at(text.end);
    const angle = Math.atan2(end.y - start.y, end.x - start.x);
    const textWidth = font.widthOfTextAtSize(text.text, size);
    const midX = (start.x + end.x) / 2 - (Math.cos(angle) * textWidth) / 2;
    const midY = (start.y + end.y) / 2 - (Math.sin(angle) * textWidth) / 2;
    page.drawText(text.text, { x: midX, y: midY, size, font, color: INK, rotate: degrees((angle * 180) / Math.PI) });
  }

  let line = height - margin;
  const write = (text: string, size: number, color = INK) => {
    line -= size * 1.5;
    page.drawText(text, { x: margin, y: line, size, font, color });
  };
  write(`Index template: ${strip.name}`, 11);
  write(PRINT_CAUTION, 9);
  for (const note of strip.notes) write(note, 7, FAINT);
  drawCalibrationBars(page, font, { x: margin, y: line - 10 - CALIBRATION_BARS_TOP_PT });

  return { bytes: await doc.save(), placement, pageSize };
}
