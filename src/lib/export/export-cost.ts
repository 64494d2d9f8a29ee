/**
 * What an export will cost, worked out from its plan before anything is drawn: pages, drawn
 * primitives and an estimate of the file's bytes, and the refusal (naming the option to change)
 * when any of them passes a cap in export-limits.ts. Pure and quick: no PDF, DXF or SVG is built.
 *
 * Byte estimates are upper estimates: per-item sizes measured on this project's own writers
 * (pdf-lib, makerjs) with the largest valid designs, rounded up; tests check that real files
 * stay under them.
 */
import type { Layout } from '~/lib/geometry/layout.ts';
import type { Design } from '~/lib/schemas/design.ts';
import type { ExportOptions } from '~/lib/schemas/export-options.ts';
import { EXPORT_LIMITS } from './export-limits.ts';
import { designToolpath } from './gcode-checks.ts';
import type { IndexTemplateStrip } from '~/lib/templates/index-template.ts';
import type { LabelSize } from '~/lib/templates/index-template-label.server.ts';
import { sheetDrawing } from './sheet-drawing.ts';
import { slotPaths, SLOT_PATH_LAYERS } from './slot-paths.ts';
import { planTiles, type TilePlan } from './tile-pages.ts';

export interface ExportCost {
  /** PDF pages; 0 for text formats. */
  pages: number;
  /** Longest side of any page, pt; 0 for text formats. */
  largestPageSidePt: number;
  /** Lines, outlines, circles, labels and page-map cells drawn, over every page. */
  primitives: number;
  estimatedBytes: number;
}

/** What to tell the user when a cap is passed: the option to change and how. */
export interface ExportRefusal {
  field: string;
  message: string;
}

/** Measured upper sizes, bytes (see the file comment). */
const BYTES = {
  /** A PDF's fixed part: catalogue, fonts subset, document information. */
  pdfDocument: 16 * 1024,
  /** Per page: caution, page label, calibration bars, title block. */
  pdfPage: 2 * 1024,
  pdfPrimitive: 48,
  textHeader: 4 * 1024,
  /** One DXF entity or SVG path segment, written unrounded. */
  slotSegment: 160,
  csvRow: 128,
  jsonRow: 256,
  /** One G-code move: a G1 with X, Y, Z and F unrounded to 0.0001 mm (or 0.000001 in). */
  gcodeMove: 64,
} as const;

/**
 * The paper template's cost from its tile plan, the number of items in its drawing and its extra
 * pages (the distance table).
 */
export function paperTemplateCost(plan: TilePlan, drawingItems: number, extraPages = 0): ExportCost {
  const pages = plan.tiles.length + extraPages;
  // Upper bound: every item on every page (clipping draws fewer), plus every page's page map,
  // which shows every page, plus the alignment marks.
  const primitives = pages * drawingItems + pages * pages + plan.marks.length * 2;
  return {
    pages,
    largestPageSidePt: Math.max(plan.pageWidthPt, plan.pageHeightPt),
    primitives,
    estimatedBytes: BYTES.pdfDocument + pages * BYTES.pdfPage + primitives * BYTES.pdfPrimitive,
  };
}

/** Pages of the shop cut sheet: the key numbers, slot table and cut list, then the checks. */
const CUT_SHEET_PAGES = 2;
/** Per slot on the cut sheet: its table rows (text cells) and its line in the drawing. */
const CUT_SHEET_ITEMS_PER_SLOT = 12;

/** The cost of exporting a computed layout of `design` as `options.format`. */
export function layoutExportCost(layout: Layout, options: ExportOptions, design: Design): ExportCost {
  const rows = (layout.frets.length + (layout.zeroFret ? 1 : 0)) * layout.strings.length;
  switch (options.format) {
    case 'pdf': {
      const drawing = sheetDrawing(layout, options);
      return paperTemplateCost(planTiles(drawing.bounds, options), drawing.items.length, options.distances ? 1 : 0);
    }
    case 'dxf':
    case 'svg': {
      const paths = slotPaths(layout, options);
      const primitives = SLOT_PATH_LAYERS.reduce(
        (sum, layer) => sum + paths.layers[layer].lines.length + paths.layers[layer].closed.reduce((edges, outline) => edges + outline.length, 0),
        0,
      );
      return text(primitives, BYTES.textHeader + primitives * BYTES.slotSegment);
    }
    case 'csv':
      return text(rows, BYTES.textHeader + rows * BYTES.csvRow);
    case 'json':
      return text(rows, BYTES.textHeader + rows * BYTES.jsonRow);
    case 'gcode': {
      const planned = designToolpath(design, layout, options);
      const moves = planned.ok ? planned.plan.moves.length : 0;
      return text(moves, BYTES.textHeader + moves * BYTES.gcodeMove);
    }
    case 'cutlist':
      return text(layout.frets.length + 1, BYTES.textHeader + (layout.frets.length + 1) * BYTES.csvRow);
    case 'cutsheet': {
      const primitives = (layout.frets.length + 1) * CUT_SHEET_ITEMS_PER_SLOT + layout.outline.length;
      return { pages: CUT_SHEET_PAGES, largestPageSidePt: 842, primitives, estimatedBytes: BYTES.pdfDocument + CUT_SHEET_PAGES * BYTES.pdfPage + primitives * BYTES.pdfPrimitive };
    }
  }
}

function text(primitives: number, estimatedBytes: number): ExportCost {
  return { pages: 0, largestPageSidePt: 0, primitives, estimatedBytes };
}

/**
 * The index template strip: one PDF page of `pageSizePt`, or DXF entities (`pageSizePt` null);
 * the strip's outlines, slot centre lines, engraving and notes.
 */
export function indexTemplateCost(strip: IndexTemplateStrip, pageSizePt: readonly [number, number] | null): ExportCost {
  const slotEdges = [strip.nutSlot, ...strip.slots].reduce((sum, slot) => sum + slot.outline.length + 1, 0);
  const primitives = strip.outline.length + slotEdges + strip.engraving.length + strip.notes.length;
  if (!pageSizePt) return text(primitives, BYTES.textHeader + primitives * BYTES.slotSegment);
  return {
    pages: 1,
    largestPageSidePt: Math.max(...pageSizePt),
    primitives,
    estimatedBytes: BYTES.pdfDocument + BYTES.pdfPage + primitives * BYTES.pdfPrimitive,
  };
}

/** Most dark-module runs a label's QR code draws (version 4, 33 x 33 modules, a run per two). */
const QR_RUNS = 33 * 17;

/** A template label: one page, one label or a sheet of them, each with its QR code and four lines. */
export function labelCost(size: LabelSize): ExportCost {
  const labels = size.sheet ? size.sheet.columns * size.sheet.rows : 1;
  const [width, height] = size.sheet?.page ?? [size.width, size.height];
  const primitives = labels * (QR_RUNS + 4);
  return { pages: 1, largestPageSidePt: Math.max(width, height), primitives, estimatedBytes: BYTES.pdfDocument + BYTES.pdfPage + primitives * BYTES.pdfPrimitive };
}

const count = (n: number) => Math.ceil(n).toLocaleString('en-US');
const mmFromPt = (pt: number) => (pt * 25.4) / 72;

/**
 * The first cap `cost` passes, as a refusal naming `field` with `advice` (what to change), or
 * null when the export may go ahead. `what` names the file, e.g. "this paper template".
 */
export function refuseOverCap(cost: ExportCost, what: string, field: string, advice: string): ExportRefusal | null {
  const caps = EXPORT_LIMITS;
  if (cost.pages > caps.maxPages) {
    return { field, message: `${what} would print ${count(cost.pages)} pages; the most is ${count(caps.maxPages)}: ${advice}` };
  }
  if (cost.largestPageSidePt > caps.maxPageSidePt) {
    return {
      field,
      message:
        `${what} needs a page ${count(mmFromPt(cost.largestPageSidePt))} mm long; a PDF page may be at most ` +
        `${count(mmFromPt(caps.maxPageSidePt))} mm (${count(caps.maxPageSidePt)} pt, ISO 32000-1): ${advice}`,
    };
  }
  if (cost.primitives > caps.maxPrimitives) {
    return { field, message: `${what} would draw ${count(cost.primitives)} lines and shapes; the most is ${count(caps.maxPrimitives)}: ${advice}` };
  }
  if (cost.estimatedBytes > caps.maxBytes) {
    const mib = (bytes: number) => (bytes / 1024 / 1024).toFixed(1);
    return { field, message: `${what} would be about ${mib(cost.estimatedBytes)} MiB; the most is ${mib(caps.maxBytes)} MiB: ${advice}` };
  }
  return null;
}

/**
 * The refusal for exporting `layout` as `options`, or null. A paper template with too many
 * pages names `overlap` when less overlap alone would be enough, else `paper`.
 */
export function layoutExportRefusal(layout: Layout, options: ExportOptions, design: Design): ExportRefusal | null {
  const cost = layoutExportCost(layout, options, design);
  if (options.format !== 'pdf') {
    return refuseOverCap(cost, `this ${options.format.toUpperCase()} file`, 'format', 'export a smaller design or another format');
  }
  const advice = 'use a larger paper, less overlap or paper "fit"';
  const refusal = refuseOverCap(cost, 'this paper template', 'paper', advice);
  if (!refusal || options.paper === 'fit' || options.overlap === 0) return refusal;
  const withoutOverlap = layoutExportCost(layout, { ...options, overlap: 0 }, design);
  return refuseOverCap(withoutOverlap, 'this paper template', 'paper', advice) ? refusal : { ...refusal, field: 'overlap' };
}
