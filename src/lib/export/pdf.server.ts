/**
 * The paper template as PDF (pdf-lib): the sheet drawing at exactly 1:1 (72 pt = 1 in = 25.4 mm,
 * ISO 32000-1) on one page or tiled over several, each page with the caution, two calibration
 * bars, a title block and the page map. Text uses the shipped JetBrains Mono, embedded as a subset.
 *
 * Lines a test or a person may want to find are wrapped in marked content (BMC) with plain tags:
 * Fret<n>, CalibrationBar100mm, CalibrationBar4in, AlignmentMark, and for the board's other parts
 * Outline, CentreLine, Nut, Saddle, FaceDot and SideDot.
 */
import {
  beginMarkedContent,
  clip,
  closePath,
  endMarkedContent,
  endPath,
  fill,
  lineTo,
  moveTo,
  PDFDocument,
  popGraphicsState,
  pushGraphicsState,
  rectangle,
  rgb,
  setDashPattern,
  setFillingRgbColor,
  setLineWidth,
  setStrokingRgbColor,
  stroke,
  type PDFFont,
  type PDFPage,
} from 'pdf-lib';
import type { Layout, Point } from '~/lib/geometry/layout.ts';
import type { Design } from '~/lib/schemas/design.ts';
import type { ExportOptions } from '~/lib/schemas/export-options.ts';
import { PAGE_FRAME_MM } from './page-frame.ts';
import { PAPER_LABELS, mmToPt } from './paper-sizes.ts';
import { addDistancePage } from './distance-table-page.server.ts';
import { drawCalibrationBars, embedMonoFont } from './pdf-kit.server.ts';
import { PRINT_CAUTION } from './safety-note.ts';
import { sheetDrawing, type LineStyle, type SheetItem } from './sheet-drawing.ts';
import { planTiles, type Tile, type TilePlan } from './tile-pages.ts';
import { provenanceLine, revisionWords, titleBlockLines, type ExportContext } from './title-block.ts';

type Rgb = [number, number, number];
export interface Pen {
  widthPt: number;
  dashPt?: number[];
  colour: Rgb;
}

const BLACK: Rgb = [0, 0, 0];
const GREY: Rgb = [0.45, 0.45, 0.45];
const LIGHT: Rgb = [0.78, 0.78, 0.78];
const CAUTION: Rgb = [0.54, 0.35, 0];

const PENS: Record<LineStyle, Pen> = {
  outline: { widthPt: 0.6, colour: BLACK },
  'centre-line': { widthPt: 0.3, dashPt: [6, 2, 1, 2], colour: GREY },
  nut: { widthPt: 0.8, colour: BLACK },
  'nut-uncompensated': { widthPt: 0.4, dashPt: [2, 2], colour: GREY },
  saddle: { widthPt: 0.8, colour: BLACK },
  'saddle-uncompensated': { widthPt: 0.4, dashPt: [2, 2], colour: GREY },
  string: { widthPt: 0.3, colour: LIGHT },
  /** Thin, so a knife or saw lines up on the line's centre. */
  fret: { widthPt: 0.25, colour: BLACK },
  marker: { widthPt: 0.3, colour: BLACK },
  'saddle-mark': { widthPt: 0.8, colour: BLACK },
};
/** Marked-content tags of the board's lines that are not frets. */
const PART_TAGS: Partial<Record<LineStyle, string>> = { 'centre-line': 'CentreLine', nut: 'Nut', saddle: 'Saddle' };
/**
 * The slot-width band: grey level 0.55 (sRGB), contrast 3.4:1 against white paper by the WCAG 2
 * relative-luminance formula, so it shows on a 600 dpi laser print; the black fret line on top
 * stays 6:1 against it.
 */
export const KERF_FILL: Rgb = [0.55, 0.55, 0.55];
/** Where to trim overlapping tiles: dashed, 0.5 pt, grey level 0.3 (contrast 8:1 on white). */
export const TRIM_LINE: Pen = { widthPt: 0.5, dashPt: [3, 2], colour: [0.3, 0.3, 0.3] };

/** Alignment mark: a circle of 3 mm radius with a cross 8 mm long. */
const MARK = { radiusMm: 3, armMm: 4 } as const;

export interface PaperTemplate {
  bytes: Uint8Array;
  plan: TilePlan;
}

/** Builds the paper template of a validated design and its computed layout. */
export async function paperTemplatePdf(
  design: Design,
  layout: Layout,
  options: ExportOptions,
  context: ExportContext = {},
): Promise<PaperTemplate> {
  const drawing = sheetDrawing(layout, options);
  const plan = planTiles(drawing.bounds, options);
  const document = await PDFDocument.create();
  const font = await embedMonoFont(document);
  document.setTitle(`${design.name} (paper template)`);
  document.setSubject(`${PRINT_CAUTION} ${provenanceLine(design, context)}`);
  document.setKeywords([revisionWords(context)]);
  document.setCreator('Kerfline');
  const titleLines = titleBlockLines(design, options, context);
  const outline = drawing.items.find((item) => item.kind === 'polygon' && item.style === 'outline');

  for (const tile of plan.tiles) {
    const page = document.addPage([plan.pageWidthPt, plan.pageHeightPt]);
    const toPage = (p: Point) => ({
      x: mmToPt(plan.window.xMm + p.x - tile.x0),
      y: mmToPt(plan.window.yMm + p.y - tile.y0),
    });
    drawTile(page, font, plan, tile, drawing.items, toPage);
    drawHeader(page, font, plan, tile, outline?.kind === 'polygon' ? outline.points : []);
    drawFooter(page, font, titleLines);
  }
  if (options.distances) addDistancePage(document, font, layout, plan, (page) => drawFooter(page, font, titleLines));
  return { bytes: await document.save({ useObjectStreams: false }), plan };
}

function penOps(pen: Pen) {
  return [setLineWidth(pen.widthPt), setDashPattern(pen.dashPt ?? [], 0), setStrokingRgbColor(...pen.colour)];
}

function drawTile(
  page: PDFPage,
  font: PDFFont,
  plan: TilePlan,
  tile: Tile,
  items: readonly SheetItem[],
  toPage: (p: Point) => Point,
): void {
  const window = {
    x: mmToPt(plan.window.xMm),
    y: mmToPt(plan.window.yMm),
    width: mmToPt(plan.window.widthMm),
    height: mmToPt(plan.window.heightMm),
  };
  page.pushOperators(pushGraphicsState(), rectangle(window.x, window.y, window.width, window.height), clip(), endPath());
  const visible = (points: Point[]) => overlapsWindow(plan, tile, points);
  for (const item of items) {
    if (item.kind === 'polygon' && visible(item.points)) {
      const [first, ...rest] = item.points.map(toPage);
      if (!first) continue;
      const path = [moveTo(first.x, first.y), ...rest.map((p) => lineTo(p.x, p.y)), closePath()];
      if (item.style === 'kerf') {
        page.pushOperators(setFillingRgbColor(...KERF_FILL), ...path, fill());
      } else {
        page.pushOperators(beginMarkedContent('Outline'), ...penOps(PENS.outline), ...path, stroke(), endMarkedContent());
      }
    } else if (item.kind === 'line' && visible([item.start, item.end])) {
      const start = toPage(item.start);
      const end = toPage(item.end);
      const tag = item.fret !== undefined ? `Fret${item.fret}` : PART_TAGS[item.style];
      const tagged = tag !== undefined;
      page.pushOperators(
        ...(tagged ? [beginMarkedContent(tag)] : []),
        ...penOps(PENS[item.style]),
        moveTo(start.x, start.y),
        lineTo(end.x, end.y),
        stroke(),
        ...(tagged ? [endMarkedContent()] : []),
      );
    } else if (item.kind === 'circle' && visible([item.centre])) {
      const centre = toPage(item.centre);
      page.pushOperators(beginMarkedContent(item.dot === 'face' ? 'FaceDot' : 'SideDot'));
      page.drawCircle({ x: centre.x, y: centre.y, size: mmToPt(item.radiusMm), borderWidth: PENS.marker.widthPt, borderColor: rgb(0, 0, 0) });
      page.pushOperators(endMarkedContent());
    } else if (item.kind === 'label' && visible([item.centre])) {
      const centre = toPage(item.centre);
      const width = monoWidth(item.text, item.sizePt);
      page.drawText(item.text, { x: centre.x - width / 2, y: centre.y - item.sizePt * 0.36, size: item.sizePt, font });
    }
  }
  for (const mark of plan.marks) {
    const near = [
      { x: mark.x - MARK.armMm, y: mark.y - MARK.armMm },
      { x: mark.x + MARK.armMm, y: mark.y + MARK.armMm },
    ];
    if (!overlapsWindow(plan, tile, near)) continue;
    const centre = toPage(mark);
    const arm = mmToPt(MARK.armMm);
    page.pushOperators(
      beginMarkedContent('AlignmentMark'),
      ...penOps(PENS.marker),
      moveTo(centre.x - arm, centre.y),
      lineTo(centre.x + arm, centre.y),
      moveTo(centre.x, centre.y - arm),
      lineTo(centre.x, centre.y + arm),
      stroke(),
      endMarkedContent(),
    );
    page.drawCircle({ x: centre.x, y: centre.y, size: mmToPt(MARK.radiusMm), borderWidth: 0.3, borderColor: rgb(0, 0, 0) });
  }
  page.pushOperators(popGraphicsState());
  if (plan.tiles.length > 1) {
    page.pushOperators(
      ...penOps(TRIM_LINE),
      rectangle(window.x, window.y, window.width, window.height),
      stroke(),
    );
  }
}

/** Whether the box around `points` touches the tile's window. */
function overlapsWindow(plan: TilePlan, tile: Tile, points: readonly Point[]): boolean {
  const xs = points.map((p) => p.x);
  const ys = points.map((p) => p.y);
  return (
    Math.max(...xs) >= tile.x0 &&
    Math.min(...xs) <= tile.x0 + plan.window.widthMm &&
    Math.max(...ys) >= tile.y0 &&
    Math.min(...ys) <= tile.y0 + plan.window.heightMm
  );
}

/** Header: the caution, the page label and the page map. */
function drawHeader(page: PDFPage, font: PDFFont, plan: TilePlan, tile: Tile, outline: readonly Point[]): void {
  const { margin, header } = PAGE_FRAME_MM;
  const top = plan.pageHeightPt - mmToPt(margin);
  const left = mmToPt(margin);
  page.drawText(PRINT_CAUTION, { x: left, y: top - mmToPt(4.5), size: 10, font, color: rgb(...CAUTION) });
  // A `fit` board too large for one PDF page is on several sheets, each sized to its part.
  const sheets = plan.paper === 'fit' ? 'sheets sized to the board' : `${PAPER_LABELS[plan.paper]} ${plan.orientation}`;
  const pageLabel =
    plan.tiles.length > 1
      ? `Page ${tile.index + 1} of ${plan.tiles.length} · row ${tile.row}, column ${tile.column} · ${sheets} · overlap ${plan.overlapMm} mm`
      : `Page 1 of 1 · ${PAPER_LABELS[plan.paper]} ${plan.paper === 'fit' ? '' : plan.orientation}`.trim();
  page.drawText(pageLabel, { x: left, y: top - mmToPt(10), size: 7, font });
  if (plan.tiles.length > 1) {
    page.drawText('Overlap pages on the round marks; trim along the dashed edge.', { x: left, y: top - mmToPt(14.5), size: 7, font });
  }
  drawPageMap(page, font, plan, tile, outline, {
    right: plan.pageWidthPt - mmToPt(margin),
    top: top - mmToPt(1),
    width: mmToPt(55),
    height: mmToPt(header - 3),
  });
}

/** A small drawing of the whole board with the page grid; this page is shaded. */
function drawPageMap(
  page: PDFPage,
  font: PDFFont,
  plan: TilePlan,
  current: Tile,
  outline: readonly Point[],
  box: { right: number; top: number; width: number; height: number },
): void {
  const minX = Math.min(...plan.tiles.map((t) => t.x0));
  const minY = Math.min(...plan.tiles.map((t) => t.y0));
  const spanX = Math.max(...plan.tiles.map((t) => t.x0)) + plan.window.widthMm - minX;
  const spanY = Math.max(...plan.tiles.map((t) => t.y0)) + plan.window.heightMm - minY;
  const scale = Math.min(box.width / spanX, box.height / spanY);
  const left = box.right - spanX * scale;
  const bottom = box.top - spanY * scale;
  const at = (p: Point) => ({ x: left + (p.x - minX) * scale, y: bottom + (p.y - minY) * scale });
  for (const tile of plan.tiles) {
    const corner = at({ x: tile.x0, y: tile.y0 });
    const width = plan.window.widthMm * scale;
    const height = plan.window.heightMm * scale;
    page.drawRectangle({
      x: corner.x,
      y: corner.y,
      width,
      height,
      borderWidth: 0.4,
      borderColor: rgb(...GREY),
      ...(tile.index === current.index ? { color: rgb(0.88, 0.93, 0.91) } : {}),
    });
    page.drawText(String(tile.index + 1), { x: corner.x + 1.5, y: corner.y + height - 5.5, size: 5, font });
  }
  const [first, ...rest] = outline.map(at);
  if (first) {
    page.pushOperators(
      ...penOps({ widthPt: 0.5, colour: BLACK }),
      moveTo(first.x, first.y),
      ...rest.map((p) => lineTo(p.x, p.y)),
      closePath(),
      stroke(),
    );
  }
}

/** Footer: the 100 mm and 4 in calibration bars with end ticks, and the title block. */
function drawFooter(page: PDFPage, font: PDFFont, titleLines: readonly string[]): void {
  const { margin, footer } = PAGE_FRAME_MM;
  const left = mmToPt(margin + 1);
  drawCalibrationBars(page, font, { x: left, y: mmToPt(margin + 7) });
  const textLeft = mmToPt(margin + 126);
  const size = 6.5;
  const maxChars = Math.floor((page.getWidth() - mmToPt(margin) - textLeft) / (size * 0.6));
  titleLines.forEach((line, index) => {
    const text = line.length > maxChars ? `${line.slice(0, Math.max(1, maxChars - 1))}…` : line;
    page.drawText(fitsFont(font, text), {
      x: textLeft,
      y: mmToPt(margin + footer - 4) - index * mmToPt(3.4),
      size: index === 0 ? size + 1 : size,
      font,
    });
  });
}

/** Characters the font lacks become "?" instead of blank boxes. */
function fitsFont(font: PDFFont, text: string): string {
  const supported = characterSets.get(font) ?? new Set(font.getCharacterSet());
  characterSets.set(font, supported);
  return [...text].map((char) => (supported.has(char.codePointAt(0) ?? 0) ? char : '?')).join('');
}
const characterSets = new WeakMap<PDFFont, Set<number>>();

/** JetBrains Mono advances every character 600/1000 em. */
function monoWidth(text: string, sizePt: number): number {
  return [...text].length * 0.6 * sizePt;
}
