/**
 * The fixed furniture of every paper template page, in millimetres: a margin most printers can
 * print into, a header (caution, page label, page map) and a footer (calibration bars, title
 * block). What is left is the drawing window, where the board is drawn 1:1.
 */
import { EXPORT_LIMITS } from './export-limits.ts';
import { PAPER_SIZES, ptToMm, type PaperName, type SheetPaperName } from './paper-sizes.ts';

export const PAGE_FRAME_MM = {
  /** Unprinted edge on every side; 8 mm suits common office printers (common practice). */
  margin: 8,
  header: 18,
  footer: 31,
  /** The footer needs this width for the two calibration bars and a narrow title block. */
  minWidth: 190,
} as const;

export interface WindowSize {
  widthMm: number;
  heightMm: number;
}

/** The drawing window of a sheet of `paper` in the given orientation. */
export function drawingWindow(paper: SheetPaperName, orientation: 'portrait' | 'landscape'): WindowSize {
  const [width, height] = pageSizeMm(paper, orientation);
  return {
    widthMm: width - 2 * PAGE_FRAME_MM.margin,
    heightMm: height - 2 * PAGE_FRAME_MM.margin - PAGE_FRAME_MM.header - PAGE_FRAME_MM.footer,
  };
}

/** Page width and height in millimetres for the orientation. */
export function pageSizeMm(paper: SheetPaperName, orientation: 'portrait' | 'landscape'): [number, number] {
  const size = PAPER_SIZES[paper];
  const [width, height] = [ptToMm(size.widthPt), ptToMm(size.heightPt)];
  return orientation === 'portrait' ? [width, height] : [height, width];
}

/** The largest drawing window of a `fit` page: the page at EXPORT_LIMITS.maxPageSidePt a side. */
export function fitWindowLimit(): WindowSize {
  const side = ptToMm(EXPORT_LIMITS.maxPageSidePt);
  return {
    widthMm: side - 2 * PAGE_FRAME_MM.margin,
    heightMm: side - 2 * PAGE_FRAME_MM.margin - PAGE_FRAME_MM.header - PAGE_FRAME_MM.footer,
  };
}

/**
 * The largest overlap allowed on `paper`: under half the window's shorter side, so every page
 * still adds new board to the stack (for `fit`, the largest window's).
 */
export function maxOverlapMm(paper: PaperName): number {
  const window = paper === 'fit' ? fitWindowLimit() : drawingWindow(paper, 'portrait');
  return Math.min(window.widthMm, window.heightMm) / 2;
}
