/**
 * The paper template's drawing as plain primitives in sheet coordinates (millimetres, +x from the
 * nut toward the bridge, +y up the page = the bass side, or the treble side when mirrored).
 * The PDF writer draws these 1:1; nothing here knows about pages.
 */
import { formatLength, toMm } from '~/lib/format/units.ts';
import type { Layout, Point, Segment } from '~/lib/geometry/layout.ts';
import { distance, intersectLines } from '~/lib/geometry/plane.ts';
import { measureLineLabel } from '~/lib/templates/check/measure-lines.ts';
import { boardPicture, boundsOf, fretNumbersApart, MONO_ADVANCE_EM, partsOn, type BoardPicture, type Box } from '~/lib/picture/board-picture.ts';
import type { ExportOptions } from '~/lib/schemas/export-options.ts';
import { kerfOutline } from './kerf-outline.ts';
import { ptToMm } from './paper-sizes.ts';

export type LineStyle =
  | 'outline'
  | 'centre-line'
  | 'nut'
  | 'nut-uncompensated'
  | 'saddle'
  | 'saddle-uncompensated'
  | 'string'
  | 'fret'
  | 'marker'
  | 'saddle-mark';

export type SheetItem =
  /** `fret` is set on fret lines (0 for a zero fret). */
  | { kind: 'line'; style: LineStyle; start: Point; end: Point; fret?: number }
  | { kind: 'polygon'; style: 'outline' | 'kerf'; points: Point[] }
  | { kind: 'circle'; style: 'marker'; dot: 'face' | 'side'; centre: Point; radiusMm: number }
  | { kind: 'label'; text: string; centre: Point; sizePt: number };

export interface SheetDrawing {
  items: SheetItem[];
  bounds: Box;
}

/** Fret numbers sit this far beyond the treble edge (mm). */
const LABEL_OFFSET_MM = 4;
const LABEL_SIZE_PT = 7;

/** How far the saddle marks run past the board end along the outer strings (mm). */
const SADDLE_MARK_MM = 12;
/** The side names sit this far outside the board edges (mm), clear of the fret numbers. */
const SIDE_LABEL_OFFSET_MM = 10;

/**
 * Builds the drawing of a computed layout for the paper template: the board from the nut to its
 * end (or on to the saddle with `toSaddle`), string numbers at the nut, the measuring lines named
 * as the Template check names them ("treble edge", "bass edge", "centre line"), and, when the saddle is not drawn, a saddle mark on each outer
 * string with the saddle's distance from the nut along that string.
 */
export function sheetDrawing(
  layout: Layout,
  options: Pick<ExportOptions, 'strings' | 'kerf' | 'mirror' | 'toSaddle'>,
): SheetDrawing {
  const flip = options.mirror ? -1 : 1;
  const sheet = (p: Point): Point => ({ x: toMm(p.x, layout.units), y: flip * toMm(p.y, layout.units) });
  const picture = boardPicture(layout, { to: options.toSaddle ? 'saddle' : 'board-end' });
  const slotWidthMm = toMm(layout.slotWidth, layout.units);
  const items: SheetItem[] = [];
  for (const part of picture.parts) {
    if (part.kind === 'text') continue; // fret numbers: below, thinned where they would crowd
    if (part.kind === 'polygon') items.push({ kind: 'polygon', style: 'outline', points: part.points.map(sheet) });
    else if (part.kind === 'circle') items.push({ kind: 'circle', style: 'marker', dot: part.layer === 'face-dots' ? 'face' : 'side', centre: sheet(part.centre), radiusMm: toMm(part.diameter, layout.units) / 2 });
    else if (part.role === 'slot') {
      if (options.kerf) items.push({ kind: 'polygon', style: 'kerf', points: kerfOutline({ start: sheet(part.segment.start), end: sheet(part.segment.end) }, slotWidthMm) });
    } else if (part.role !== 'string' || options.strings) {
      items.push({ kind: 'line', style: part.role, start: sheet(part.segment.start), end: sheet(part.segment.end), ...(part.fret === undefined ? {} : { fret: part.fret }) });
    }
  }
  items.push(...fretNumbers(picture, sheet));
  if (!options.toSaddle) items.push(...saddleMarks(layout, sheet));
  items.push(...stringNumbers(layout, sheet), ...sideNames(layout, sheet));
  items.push(endLabel('nut', sheet(layout.nutLine.end), sheet(layout.nutLine.start)));
  if (options.toSaddle) items.push(endLabel('saddle', sheet(layout.saddleLine.end), sheet(layout.saddleLine.start)));
  return { items, bounds: drawingBounds(items) };
}

/**
 * On each outer string: a short line from the board end toward the saddle and the saddle's
 * distance from the nut along that string (from the drawn nut line to the drawn saddle line).
 */
function saddleMarks(layout: Layout, sheet: (p: Point) => Point): SheetItem[] {
  const outer = [
    { string: layout.strings[0]!, saddle: layout.saddleLine.start },
    { string: layout.strings.at(-1)!, saddle: layout.saddleLine.end },
  ];
  return outer.flatMap(({ string, saddle }) => {
    const nut = intersectLines(string.nut, string.saddle, layout.nutLine.start, layout.nutLine.end);
    const atEnd = sheet(intersectLines(string.nut, string.saddle, layout.boardEnd.start, layout.boardEnd.end));
    const toward = sheet(string.saddle);
    const span = distance(atEnd, toward);
    const tip = { x: atEnd.x + ((toward.x - atEnd.x) / span) * SADDLE_MARK_MM, y: atEnd.y + ((toward.y - atEnd.y) / span) * SADDLE_MARK_MM };
    const text = `saddle ${formatLength(distance(nut, saddle), layout.units, true)} from nut, string ${string.index}`;
    const halfWidth = labelHalfWidthMm(text, LABEL_SIZE_PT);
    return [
      { kind: 'line', style: 'saddle-mark', start: atEnd, end: tip } satisfies SheetItem,
      { kind: 'label', text, centre: { x: tip.x + 2 + halfWidth, y: tip.y }, sizePt: LABEL_SIZE_PT } satisfies SheetItem,
    ];
  });
}

/** The string numbers just before the nut line, 1 = treble. */
function stringNumbers(layout: Layout, sheet: (p: Point) => Point): SheetItem[] {
  return layout.strings.map((string) => {
    const atNut = sheet(intersectLines(string.nut, string.saddle, layout.nutLine.start, layout.nutLine.end));
    return { kind: 'label', text: String(string.index), centre: { x: atNut.x - LABEL_OFFSET_MM, y: atNut.y }, sizePt: LABEL_SIZE_PT };
  });
}

/**
 * The lines a template is measured along, named as the Template check names them: "treble edge"
 * and "bass edge" outside the edges halfway along, "centre line" on the centre line before the nut.
 */
function sideNames(layout: Layout, sheet: (p: Point) => Point): SheetItem[] {
  const strings = layout.strings.length;
  const beside = (edge: Segment, otherEdge: Segment, text: string): SheetItem => {
    const middle = sheet({ x: (edge.start.x + edge.end.x) / 2, y: (edge.start.y + edge.end.y) / 2 });
    const across = sheet({ x: (otherEdge.start.x + otherEdge.end.x) / 2, y: (otherEdge.start.y + otherEdge.end.y) / 2 });
    const outward = Math.sign(middle.y - across.y) || 1;
    return { kind: 'label', text, centre: { x: middle.x, y: middle.y + outward * SIDE_LABEL_OFFSET_MM }, sizePt: LABEL_SIZE_PT };
  };
  const centreText = measureLineLabel('centre-line', strings);
  const nutOnCentre = sheet(layout.centreLine.start);
  const centre: SheetItem = {
    kind: 'label',
    text: centreText,
    centre: { x: nutOnCentre.x - 2 * LABEL_OFFSET_MM - labelHalfWidthMm(centreText, LABEL_SIZE_PT), y: nutOnCentre.y },
    sizePt: LABEL_SIZE_PT,
  };
  return [
    beside(layout.edges.treble, layout.edges.bass, measureLineLabel('treble-edge', strings)),
    beside(layout.edges.bass, layout.edges.treble, measureLineLabel('bass-edge', strings)),
    centre,
  ];
}

/** The fret numbers, thinned by the picture's one rule where they would overprint at 1:1. */
function fretNumbers(picture: BoardPicture, sheet: (p: Point) => Point): SheetItem[] {
  const labels = partsOn(picture, 'labels', 'text').map((part) => ({ fret: part.fret, item: fretNumber(part.text, sheet(part.at), sheet(part.away)) }));
  return fretNumbersApart(labels, (label) => labelBox(label.item)).map((label) => label.item);
}

/** A label's printed box in sheet mm. */
function labelBox(label: { text: string; centre: Point; sizePt: number }): Box {
  const half = { x: labelHalfWidthMm(label.text, label.sizePt), y: ptToMm(label.sizePt) / 2 };
  return { minX: label.centre.x - half.x, maxX: label.centre.x + half.x, minY: label.centre.y - half.y, maxY: label.centre.y + half.y };
}

/** Fret number beyond the treble end of the fret line; `away` is the picture's direction in board units. */
function fretNumber(text: string, treble: Point, away: Point): Extract<SheetItem, { kind: 'label' }> {
  const origin = { x: treble.x - away.x, y: treble.y - away.y };
  return { kind: 'label', text, centre: beyond(treble, origin, LABEL_OFFSET_MM), sizePt: LABEL_SIZE_PT };
}

/** A word beyond the `outer` end of a line, away from `inner`. */
function endLabel(text: string, outer: Point, inner: Point): SheetItem {
  return { kind: 'label', text, centre: beyond(outer, inner, LABEL_OFFSET_MM), sizePt: LABEL_SIZE_PT };
}

function beyond(outer: Point, inner: Point, distanceMm: number): Point {
  const dx = outer.x - inner.x;
  const dy = outer.y - inner.y;
  const length = Math.hypot(dx, dy);
  return { x: outer.x + (dx / length) * distanceMm, y: outer.y + (dy / length) * distanceMm };
}

/** Half the printed width of a monospaced label, in mm. */
export function labelHalfWidthMm(text: string, sizePt: number): number {
  return ptToMm(text.length * MONO_ADVANCE_EM * sizePt) / 2;
}

/** Every item's extent in sheet mm, a label's from its printed size, through the picture's one box. */
function drawingBounds(items: readonly SheetItem[]): Box {
  return boundsOf(
    items.flatMap((item): Point[] => {
      if (item.kind === 'line') return [item.start, item.end];
      if (item.kind === 'polygon') return item.points;
      const half = item.kind === 'circle' ? { x: item.radiusMm, y: item.radiusMm } : { x: labelHalfWidthMm(item.text, item.sizePt), y: ptToMm(item.sizePt) / 2 };
      return [
        { x: item.centre.x - half.x, y: item.centre.y - half.y },
        { x: item.centre.x + half.x, y: item.centre.y + half.y },
      ];
    }),
  );
}
