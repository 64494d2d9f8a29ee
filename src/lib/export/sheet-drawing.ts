/**
 * The paper template's drawing as plain primitives in sheet coordinates (millimetres, +x from the
 * nut toward the bridge, +y up the page = the bass side, or the treble side when mirrored).
 * The PDF writer draws these 1:1; nothing here knows about pages.
 */
import { fromMm, toMm } from '~/lib/format/units';
import type { Layout, Point, Segment } from '~/lib/geometry/layout';
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
  | 'marker';

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

/** Builds the drawing of a computed layout for the paper template. */
export function sheetDrawing(
  layout: Layout,
  options: Pick<ExportOptions, 'strings' | 'kerf' | 'mirror'>,
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
  if (options.strings) {
    for (const string of layout.strings) items.push(line('string', { start: string.nut, end: string.saddle }));
  }
  items.push(line('centre-line', layout.centreLine));
  items.push(line('nut', layout.nutLine));
  if (differs(layout.nutLine, layout.uncompensated.nutLine, layout)) {
    items.push(line('nut-uncompensated', layout.uncompensated.nutLine));
  }
  items.push(line('saddle', layout.saddleLine));
  if (differs(layout.saddleLine, layout.uncompensated.saddleLine, layout)) {
    items.push(line('saddle-uncompensated', layout.uncompensated.saddleLine));
  }
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
  items.push(endLabel('saddle', sheet(layout.saddleLine.end), sheet(layout.saddleLine.start)));
  return { items, bounds: drawingBounds(items) };
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
