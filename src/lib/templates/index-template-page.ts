/**
 * The page the index template strip PDF is drawn on: the strip 1:1 with a margin, a header for
 * the caution and notes, at least wide enough for the calibration bars. Pure, so the export's
 * cost is known before the PDF is built.
 */
import { PT_PER_MM, ptPerUnit } from '~/lib/export/paper-sizes.ts';
import type { IndexTemplateStrip } from '~/lib/templates/index-template.ts';
import { boundsOf } from '~/lib/picture/board-picture.ts';

export const STRIP_PAGE_PT = {
  margin: 15 * PT_PER_MM,
  header: 68 * PT_PER_MM,
  minWidth: 200 * PT_PER_MM,
} as const;

/** Where board point (0, 0) lands on the page and how many points one design unit is. */
export interface StripPlacement {
  originX: number;
  originY: number;
  scale: number;
}

/** Page size (pt, width then height) and placement of `strip`; board y (bass side) runs down the page. */
export function indexTemplatePage(strip: IndexTemplateStrip): { pageSize: [number, number]; placement: StripPlacement } {
  const scale = ptPerUnit(strip.units);
  const { minX, minY, maxX, maxY } = boundsOf(strip.outline);
  const { margin, header, minWidth } = STRIP_PAGE_PT;
  const width = Math.max((maxX - minX) * scale + 2 * margin, minWidth);
  const height = (maxY - minY) * scale + 2 * margin + header;
  return { pageSize: [width, height], placement: { originX: margin - minX * scale, originY: margin + maxY * scale, scale } };
}
