/**
 * How the paper template's drawing is spread over pages: which paper and orientation, how many
 * rows and columns, where each page's drawing window sits on the drawing, and the alignment marks
 * shared by overlapping pages. Pure: the PDF writer and the Export panel's preview both use it.
 *
 * "Sheet coordinates" are millimetres on the printed drawing: +x along the board from the nut,
 * +y up the page (the board's bass side, or its treble side when mirrored).
 */
import type { ExportOptions } from '~/lib/schemas/export-options.ts';
import { EXPORT_LIMITS } from './export-limits.ts';
import { drawingWindow, fitWindowLimit, PAGE_FRAME_MM } from './page-frame.ts';
import { PAPER_SIZES, mmToPt, type PaperName, type SheetPaperName } from './paper-sizes.ts';

import type { Box } from '~/lib/picture/board-picture.ts';

export type { Box };

export type Orientation = 'portrait' | 'landscape';

export interface Tile {
  /** 0-based page index; page 1 is the top-left tile, then left to right, top to bottom. */
  index: number;
  /** 1-based, row 1 at the top of the drawing. */
  row: number;
  /** 1-based, column 1 at the left (the nut end). */
  column: number;
  /** Sheet coordinates (mm) of the window's lower-left corner. */
  x0: number;
  y0: number;
}

export interface TilePlan {
  paper: PaperName;
  orientation: Orientation;
  pageWidthPt: number;
  pageHeightPt: number;
  /** The drawing window on every page: lower-left corner from the page's lower-left, and size (mm). */
  window: { xMm: number; yMm: number; widthMm: number; heightMm: number };
  overlapMm: number;
  rows: number;
  columns: number;
  tiles: Tile[];
  /** The drawing's extent in sheet coordinates (mm). */
  bounds: Box;
  /** Alignment mark centres (sheet mm), each inside the overlap of two or more pages. */
  marks: { x: number; y: number }[];
}

/** Clear space kept around the drawing inside the window (mm). */
export const DRAWING_PAD_MM = 4;

/**
 * Plans the pages for a drawing with extent `bounds` (sheet mm).
 * Sheets: tiles of the window size step by (window - overlap); orientation `auto` takes the one
 * needing fewer pages (landscape on a tie, as boards are long). `fit`: one page around the drawing,
 * or, when that page would be longer than a PDF page may be (EXPORT_LIMITS.maxPageSidePt), equal
 * pages no larger than that, overlapping by `overlap`.
 */
export function planTiles(
  bounds: Box,
  options: Pick<ExportOptions, 'paper' | 'orientation' | 'overlap'>,
): TilePlan {
  if (options.paper === 'fit') return fitPlan(bounds, options.overlap);
  const paper = options.paper;
  const candidates: Orientation[] =
    options.orientation === 'auto' ? ['landscape', 'portrait'] : [options.orientation];
  const plans = candidates.map((orientation) => sheetPlan(bounds, paper, orientation, options.overlap));
  return plans.reduce((best, plan) => (plan.tiles.length < best.tiles.length ? plan : best));
}

function sheetPlan(bounds: Box, paper: SheetPaperName, orientation: Orientation, overlapMm: number): TilePlan {
  const size = PAPER_SIZES[paper];
  const [pageWidthPt, pageHeightPt] =
    orientation === 'portrait' ? [size.widthPt, size.heightPt] : [size.heightPt, size.widthPt];
  const window = drawingWindow(paper, orientation);
  const span = padded(bounds);
  const columns = Math.max(1, Math.ceil((span.maxX - span.minX - overlapMm) / (window.widthMm - overlapMm)));
  const rows = Math.max(1, Math.ceil((span.maxY - span.minY - overlapMm) / (window.heightMm - overlapMm)));
  return gridPlan({ paper, orientation, pageWidthPt, pageHeightPt, window, overlapMm, rows, columns, bounds });
}

/**
 * `fit`: the drawing's own size plus the page furniture. A drawing longer or wider than the
 * largest window splits into the fewest equal windows, each just large enough, overlapping by
 * `overlapMm`.
 */
function fitPlan(bounds: Box, overlapMm: number): TilePlan {
  const span = padded(bounds);
  const frame = PAGE_FRAME_MM;
  const limit = fitWindowLimit();
  const drawnWidth = span.maxX - span.minX;
  const drawnHeight = span.maxY - span.minY;
  const count = (drawn: number, most: number) => (drawn <= most ? 1 : Math.ceil((drawn - overlapMm) / (most - overlapMm)));
  const columns = count(drawnWidth, limit.widthMm);
  const rows = count(drawnHeight, limit.heightMm);
  // n windows of size w overlapping by o cover n (w - o) + o.
  const window = {
    widthMm: Math.max((drawnWidth - overlapMm) / columns + overlapMm, frame.minWidth),
    heightMm: (drawnHeight - overlapMm) / rows + overlapMm,
  };
  const pageWidthMm = window.widthMm + 2 * frame.margin;
  const pageHeightMm = window.heightMm + 2 * frame.margin + frame.header + frame.footer;
  // Rounding in the mm-to-pt conversion must not push a page past the limit.
  const side = (mm: number) => Math.min(mmToPt(mm), EXPORT_LIMITS.maxPageSidePt);
  return gridPlan({
    paper: 'fit',
    orientation: pageWidthMm >= pageHeightMm ? 'landscape' : 'portrait',
    pageWidthPt: side(pageWidthMm),
    pageHeightPt: side(pageHeightMm),
    window,
    overlapMm: rows * columns > 1 ? overlapMm : 0,
    rows,
    columns,
    bounds,
  });
}

interface GridSpec extends Pick<TilePlan, 'paper' | 'orientation' | 'pageWidthPt' | 'pageHeightPt' | 'overlapMm' | 'rows' | 'columns' | 'bounds'> {
  window: { widthMm: number; heightMm: number };
}

/** Rows x columns of windows stepping by (window - overlap), the grid centred over the drawing. */
function gridPlan(spec: GridSpec): TilePlan {
  const { window, overlapMm, rows, columns } = spec;
  const span = padded(spec.bounds);
  const stepX = window.widthMm - overlapMm;
  const stepY = window.heightMm - overlapMm;
  const coveredX = columns * stepX + overlapMm;
  const coveredY = rows * stepY + overlapMm;
  const left = span.minX - (coveredX - (span.maxX - span.minX)) / 2;
  const top = span.maxY + (coveredY - (span.maxY - span.minY)) / 2;
  const tiles: Tile[] = [];
  for (let row = 1; row <= rows; row++) {
    for (let column = 1; column <= columns; column++) {
      tiles.push({
        index: tiles.length,
        row,
        column,
        x0: left + (column - 1) * stepX,
        y0: top - window.heightMm - (row - 1) * stepY,
      });
    }
  }
  return {
    ...spec,
    window: { xMm: PAGE_FRAME_MM.margin, yMm: PAGE_FRAME_MM.margin + PAGE_FRAME_MM.footer, ...window },
    tiles,
    marks: alignmentMarks(tiles, rows, columns, window.widthMm, window.heightMm, overlapMm),
  };
}

function padded(bounds: Box): Box {
  return {
    minX: bounds.minX - DRAWING_PAD_MM,
    minY: bounds.minY - DRAWING_PAD_MM,
    maxX: bounds.maxX + DRAWING_PAD_MM,
    maxY: bounds.maxY + DRAWING_PAD_MM,
  };
}

/**
 * Marks in the middle of every overlap band, at a fifth and four fifths of the neighbouring
 * window's length, so two stacked pages line up on two marks per shared edge.
 */
function alignmentMarks(
  tiles: readonly Tile[],
  rows: number,
  columns: number,
  widthMm: number,
  heightMm: number,
  overlapMm: number,
): { x: number; y: number }[] {
  const marks: { x: number; y: number }[] = [];
  for (const tile of tiles) {
    if (tile.column < columns) {
      const x = tile.x0 + widthMm - overlapMm / 2;
      marks.push({ x, y: tile.y0 + heightMm / 5 }, { x, y: tile.y0 + (4 * heightMm) / 5 });
    }
    if (tile.row < rows) {
      const y = tile.y0 + overlapMm / 2;
      marks.push({ x: tile.x0 + widthMm / 5, y }, { x: tile.x0 + (4 * widthMm) / 5, y });
    }
  }
  return marks;
}

/** Whether a sheet point lies in a tile's window (edges included). */
export function inWindow(plan: TilePlan, tile: Tile, point: { x: number; y: number }): boolean {
  return (
    point.x >= tile.x0 &&
    point.x <= tile.x0 + plan.window.widthMm &&
    point.y >= tile.y0 &&
    point.y <= tile.y0 + plan.window.heightMm
  );
}

/** Page coordinates (pt from the page's lower-left) of a sheet point on a tile. */
export function sheetToPage(plan: TilePlan, tile: Tile, point: { x: number; y: number }): { x: number; y: number } {
  return {
    x: mmToPt(plan.window.xMm + point.x - tile.x0),
    y: mmToPt(plan.window.yMm + point.y - tile.y0),
  };
}
