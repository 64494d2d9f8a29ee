/**
 * The paper template's drawing as plain primitives in sheet coordinates (millimetres, +x from the
 * nut toward the bridge, +y up the page = the bass side, or the treble side when mirrored).
 * The PDF writer draws these 1:1; nothing here knows about pages.
 */
import { formatLength, fromMm, toMm } from '~/lib/format/units';
import type { Layout, Point, Segment } from '~/lib/geometry/layout';
import { distance, intersectLines } from '~/lib/geometry/plane';
import type { ExportOptions } from '~/lib/schemas/export-options';
import { kerfOutline } from './kerf-outline';
import { ptToMm } from './paper-sizes';
import type { Box } from './tile-pages';

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
  | { kind: 'circle'; style: 'marker'; centre: Point; radiusMm: number }
  | { kind: 'label'; text: string; centre: Point; sizePt: number };

export interface SheetDrawing {
  items: SheetItem[];
  bounds: Box;
}

/** Face dot and side dot marks (mm): position marks, not inlay sizes. */
const MARKER_RADIUS_MM = { face: 2, side: 0.8 } as const;
/** Fret numbers sit this far beyond the treble edge (mm). */
const LABEL_OFFSET_MM = 4;
const LABEL_SIZE_PT = 7;
/** JetBrains Mono advances 0.6 em per character. */
const MONO_ADVANCE_EM = 0.6;

/** Distinct nut/saddle lines are drawn only when compensation moves them further than this (mm). */
const SAME_LINE_MM = 1e-6;

/** How far the saddle marks run past the board end along the outer strings (mm). */
const SADDLE_MARK_MM = 12;
/** The side names sit this far outside the board edges (mm), clear of the fret numbers. */
const SIDE_LABEL_OFFSET_MM = 10;

/**
 * Builds the drawing of a computed layout for the paper template: the board from the nut to its
 * end (or on to the saddle with `toSaddle`), string numbers at the nut, "treble side" and
 * "bass side" beside the edges, and, when the saddle is not drawn, a saddle mark on each outer
 * string with the saddle's distance from the nut along that string.
 */
export function sheetDrawing(
  layout: Layout,
  options: Pick<ExportOptions, 'strings' | 'kerf' | 'mirror' | 'toSaddle'>,
): SheetDrawing {
  const flip = options.mirror ? -1 : 1;
  const sheet = (p: Point): Point => ({ x: toMm(p.x, layout.units), y: flip * toMm(p.y, layout.units) });
  const line = (style: LineStyle, segment: Segment, fret?: number): SheetItem => ({
    kind: 'line',
    style,
    start: sheet(segment.start),
    end: sheet(segment.end),
    ...(fret === undefined ? {} : { fret }),
  });
  const slotWidthMm = toMm(layout.slotWidth, layout.units);
  const items: SheetItem[] = [{ kind: 'polygon', style: 'outline', points: layout.outline.map(sheet) }];

  const fretLines: { number: number; line: Segment; slot: Segment }[] = layout.frets.map((fret) => ({
    number: fret.number,
    line: fret.line,
    slot: fret.slot,
  }));
  if (layout.zeroFret) fretLines.unshift({ number: 0, ...layout.zeroFret });
  if (options.kerf) {
    for (const fret of fretLines) {
      const slot = { start: sheet(fret.slot.start), end: sheet(fret.slot.end) };
      items.push({ kind: 'polygon', style: 'kerf', points: kerfOutline(slot, slotWidthMm) });
    }
  }
  // Without the saddle, strings and the centre line stop at the board end.
  const endOf = (from: Point, to: Point): Point =>
    options.toSaddle ? to : intersectLines(from, to, layout.boardEnd.start, layout.boardEnd.end);
  if (options.strings) {
    for (const string of layout.strings) items.push(line('string', { start: string.nut, end: endOf(string.nut, string.saddle) }));
  }
  items.push(line('centre-line', { start: layout.centreLine.start, end: endOf(layout.centreLine.start, layout.centreLine.end) }));
  items.push(line('nut', layout.nutLine));
  if (differs(layout.nutLine, layout.uncompensated.nutLine, layout)) {
    items.push(line('nut-uncompensated', layout.uncompensated.nutLine));
  }
  if (options.toSaddle) {
    items.push(line('saddle', layout.saddleLine));
    if (differs(layout.saddleLine, layout.uncompensated.saddleLine, layout)) {
      items.push(line('saddle-uncompensated', layout.uncompensated.saddleLine));
    }
  } else {
    items.push(...saddleMarks(layout, sheet));
  }
  items.push(...stringNumbers(layout, sheet), ...sideNames(layout, sheet));
  for (const fret of fretLines) {
    const drawn = line('fret', fret.line, fret.number);
    items.push(drawn);
    if (drawn.kind === 'line') items.push(fretNumber(String(fret.number), drawn.start, drawn.end));
  }
  for (const marker of layout.markers) {
    for (const dot of marker.dots) items.push({ kind: 'circle', style: 'marker', centre: sheet(dot), radiusMm: MARKER_RADIUS_MM.face });
    items.push({ kind: 'circle', style: 'marker', centre: sheet(marker.side), radiusMm: MARKER_RADIUS_MM.side });
  }
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

/** "treble side" below the treble edge and "bass side" beyond the bass edge, halfway along. */
function sideNames(layout: Layout, sheet: (p: Point) => Point): SheetItem[] {
  const beside = (edge: Segment, otherEdge: Segment, text: string): SheetItem => {
    const middle = sheet({ x: (edge.start.x + edge.end.x) / 2, y: (edge.start.y + edge.end.y) / 2 });
    const across = sheet({ x: (otherEdge.start.x + otherEdge.end.x) / 2, y: (otherEdge.start.y + otherEdge.end.y) / 2 });
    const outward = Math.sign(middle.y - across.y) || 1;
    return { kind: 'label', text, centre: { x: middle.x, y: middle.y + outward * SIDE_LABEL_OFFSET_MM }, sizePt: LABEL_SIZE_PT };
  };
  return [beside(layout.edges.treble, layout.edges.bass, 'treble side'), beside(layout.edges.bass, layout.edges.treble, 'bass side')];
}

/** Whether `other`'s end points lie off the infinite line through `drawn` (compared in mm). */
function differs(drawn: Segment, other: Segment, layout: Layout): boolean {
  const dx = drawn.end.x - drawn.start.x;
  const dy = drawn.end.y - drawn.start.y;
  const length = Math.hypot(dx, dy);
  const offLine = (p: Point) => Math.abs((p.x - drawn.start.x) * dy - (p.y - drawn.start.y) * dx) / length;
  return Math.max(offLine(other.start), offLine(other.end)) > fromMm(SAME_LINE_MM, layout.units);
}

/** Fret number just beyond the treble end of the fret line (`start` is the treble edge). */
function fretNumber(text: string, treble: Point, bass: Point): SheetItem {
  return { kind: 'label', text, centre: beyond(treble, bass, LABEL_OFFSET_MM), sizePt: LABEL_SIZE_PT };
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

function drawingBounds(items: readonly SheetItem[]): Box {
  const box: Box = { minX: Infinity, minY: Infinity, maxX: -Infinity, maxY: -Infinity };
  const add = (x: number, y: number) => {
    box.minX = Math.min(box.minX, x);
    box.minY = Math.min(box.minY, y);
    box.maxX = Math.max(box.maxX, x);
    box.maxY = Math.max(box.maxY, y);
  };
  for (const item of items) {
    if (item.kind === 'line') {
      add(item.start.x, item.start.y);
      add(item.end.x, item.end.y);
    } else if (item.kind === 'polygon') {
      for (const point of item.points) add(point.x, point.y);
    } else if (item.kind === 'circle') {
      add(item.centre.x - item.radiusMm, item.centre.y - item.radiusMm);
      add(item.centre.x + item.radiusMm, item.centre.y + item.radiusMm);
    } else {
      const halfWidth = labelHalfWidthMm(item.text, item.sizePt);
      const halfHeight = ptToMm(item.sizePt) / 2;
      add(item.centre.x - halfWidth, item.centre.y - halfHeight);
      add(item.centre.x + halfWidth, item.centre.y + halfHeight);
    }
  }
  return box;
}
