/**
 * One picture of the board for every surface: the editor, the proof page, the Boards thumbnail,
 * the paper template and the slot paths all draw these parts, so they show the same frets (the
 * zero fret as fret 0), the same dots at the same diameters and the same nut and saddle lines.
 *
 * Parts are in board units (the design's mm or in, +x from the nut toward the bridge, +y toward
 * the bass side); a surface only maps them into its own space and style. Pure, no DOM.
 */
import { fromMm } from '~/lib/format/units.ts';
import type { FretLine, Layout, Point, Segment } from '~/lib/geometry/layout.ts';
import { intersectLines } from '~/lib/geometry/plane.ts';

/** The layers a picture is grouped into, in drawing order (later layers on top). */
export const PICTURE_LAYERS = [
  'outline',
  'face-dots',
  'side-dots',
  'strings',
  'centre-line',
  'slots',
  'frets',
  'nut',
  'saddle',
  'labels',
] as const;
export type PictureLayer = (typeof PICTURE_LAYERS)[number];

/** What a line stands for, so a surface can style it (uncompensated lines are references). */
export type LineRole =
  | 'string'
  | 'centre-line'
  | 'fret'
  | 'slot'
  | 'nut'
  | 'nut-uncompensated'
  | 'saddle'
  | 'saddle-uncompensated';

export type PicturePart =
  /** `fret` on fret and slot lines (0 = the zero fret); `string` on string lines (1 = treble). */
  | { kind: 'line'; layer: PictureLayer; role: LineRole; segment: Segment; fret?: number; string?: number }
  | { kind: 'polygon'; layer: 'outline'; points: Point[] }
  /** A dot of its real diameter (board units); `fret` is the marker's fret. */
  | { kind: 'circle'; layer: 'face-dots' | 'side-dots'; centre: Point; diameter: number; fret: number }
  /**
   * A fret number at the treble end of its fret line; `away` is the unit direction (board
   * units) in which the surface sets it off from the line, by its own distance.
   */
  | { kind: 'text'; layer: 'labels'; role: 'fret-number'; text: string; at: Point; away: Point; fret: number };

export interface BoardPicture {
  units: Layout['units'];
  parts: PicturePart[];
}

export interface PictureOptions {
  /**
   * `saddle` (the default): strings and centre line run on to the saddle and the saddle lines are
   * drawn. `board-end`: they stop at the board end and no saddle line is drawn.
   */
  to?: 'saddle' | 'board-end';
}

/** JetBrains Mono, the shipped font for numbers, advances 0.6 em per character. */
export const MONO_ADVANCE_EM = 0.6;

/** Nut or saddle lines count as the same line (not compensated) within this distance (mm). */
const SAME_LINE_MM = 1e-6;

export interface Box {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/** The fret lines to draw, zero fret first as fret 0 when the design has one. */
export function fretsWithZero(layout: Layout): (FretLine & { number: number })[] {
  const frets = layout.frets.map((fret) => ({ number: fret.number, line: fret.line, slot: fret.slot }));
  return layout.zeroFret ? [{ number: 0, ...layout.zeroFret }, ...frets] : frets;
}

/** Whether `other`'s end points lie off the infinite line through `drawn` (compared in mm). */
export function differs(drawn: Segment, other: Segment, units: Layout['units']): boolean {
  const dx = drawn.end.x - drawn.start.x;
  const dy = drawn.end.y - drawn.start.y;
  const length = Math.hypot(dx, dy);
  const offLine = (p: Point) => Math.abs((p.x - drawn.start.x) * dy - (p.y - drawn.start.y) * dx) / length;
  return Math.max(offLine(other.start), offLine(other.end)) > fromMm(SAME_LINE_MM, units);
}

/** Builds the picture of a computed layout. */
export function boardPicture(layout: Layout, options: PictureOptions = {}): BoardPicture {
  const toSaddle = (options.to ?? 'saddle') === 'saddle';
  const endOf = (from: Point, to: Point): Point =>
    toSaddle ? to : intersectLines(from, to, layout.boardEnd.start, layout.boardEnd.end);
  const parts: PicturePart[] = [{ kind: 'polygon', layer: 'outline', points: layout.outline }];

  for (const marker of layout.markers) {
    for (const dot of marker.dots) parts.push({ kind: 'circle', layer: 'face-dots', centre: dot, diameter: layout.dotDiameters.face, fret: marker.fret });
    parts.push({ kind: 'circle', layer: 'side-dots', centre: marker.side, diameter: layout.dotDiameters.side, fret: marker.fret });
  }
  for (const string of layout.strings) {
    parts.push({ kind: 'line', layer: 'strings', role: 'string', string: string.index, segment: { start: string.nut, end: endOf(string.nut, string.saddle) } });
  }
  const centre = layout.centreLine;
  parts.push({ kind: 'line', layer: 'centre-line', role: 'centre-line', segment: { start: centre.start, end: endOf(centre.start, centre.end) } });

  for (const fret of fretsWithZero(layout)) {
    parts.push({ kind: 'line', layer: 'slots', role: 'slot', fret: fret.number, segment: fret.slot });
    parts.push({ kind: 'line', layer: 'frets', role: 'fret', fret: fret.number, segment: fret.line });
    parts.push({ kind: 'text', layer: 'labels', role: 'fret-number', text: String(fret.number), at: fret.line.start, away: unitFrom(fret.line.end, fret.line.start), fret: fret.number });
  }
  parts.push({ kind: 'line', layer: 'nut', role: 'nut', segment: layout.nutLine });
  if (differs(layout.nutLine, layout.uncompensated.nutLine, layout.units)) {
    parts.push({ kind: 'line', layer: 'nut', role: 'nut-uncompensated', segment: layout.uncompensated.nutLine });
  }
  if (toSaddle) {
    parts.push({ kind: 'line', layer: 'saddle', role: 'saddle', segment: layout.saddleLine });
    if (differs(layout.saddleLine, layout.uncompensated.saddleLine, layout.units)) {
      parts.push({ kind: 'line', layer: 'saddle', role: 'saddle-uncompensated', segment: layout.uncompensated.saddleLine });
    }
  }
  return { units: layout.units, parts };
}

/** The parts of one layer, narrowed by kind. */
export function partsOn<K extends PicturePart['kind']>(picture: BoardPicture, layer: PictureLayer, kind: K): Extract<PicturePart, { kind: K }>[] {
  return picture.parts.filter((part): part is Extract<PicturePart, { kind: K }> => part.layer === layer && part.kind === kind);
}

/** The corner points a part covers (a circle's box corners); text covers only its anchor. */
export function partExtent(part: PicturePart): Point[] {
  switch (part.kind) {
    case 'line':
      return [part.segment.start, part.segment.end];
    case 'polygon':
      return part.points;
    case 'circle': {
      const r = part.diameter / 2;
      return [
        { x: part.centre.x - r, y: part.centre.y - r },
        { x: part.centre.x + r, y: part.centre.y + r },
      ];
    }
    case 'text':
      return [part.at];
  }
}

/** The one bounding box: of any points, or of every part of a picture. */
export function boundsOf(points: Iterable<Point>): Box {
  const box: Box = { minX: Infinity, minY: Infinity, maxX: -Infinity, maxY: -Infinity };
  for (const p of points) {
    box.minX = Math.min(box.minX, p.x);
    box.minY = Math.min(box.minY, p.y);
    box.maxX = Math.max(box.maxX, p.x);
    box.maxY = Math.max(box.maxY, p.y);
  }
  return box;
}

export function pictureBounds(picture: BoardPicture, layers: readonly PictureLayer[] = PICTURE_LAYERS): Box {
  return boundsOf(picture.parts.filter((part) => layers.includes(part.layer)).flatMap(partExtent));
}

/** Whether two boxes share any area (touching edges do not count). */
export function boxesOverlap(a: Box, b: Box): boolean {
  return a.minX < b.maxX && b.minX < a.maxX && a.minY < b.maxY && b.minY < a.maxY;
}

/**
 * The one rule for crowded fret numbers, on every surface: the labels whose boxes (in the
 * surface's own units, from `boxOf`) touch no other label kept. The octaves (12, 24, 36) are kept
 * first, then the frets from the nut up, so as frets close in toward the body the numbers thin
 * out (13, 15, 17 ...) rather than overprint. Returns the kept labels in their given order.
 */
export function fretNumbersApart<T extends { fret: number }>(labels: readonly T[], boxOf: (label: T) => Box): T[] {
  const octave = (label: T) => label.fret > 0 && label.fret % 12 === 0;
  const byPriority = [...labels].sort((a, b) => Number(octave(b)) - Number(octave(a)) || a.fret - b.fret);
  const kept: { label: T; box: Box }[] = [];
  for (const label of byPriority) {
    const box = boxOf(label);
    if (!kept.some((other) => boxesOverlap(other.box, box))) kept.push({ label, box });
  }
  const keep = new Set(kept.map((k) => k.label));
  return labels.filter((label) => keep.has(label));
}

function unitFrom(from: Point, to: Point): Point {
  const length = Math.hypot(to.x - from.x, to.y - from.y);
  return { x: (to.x - from.x) / length, y: (to.y - from.y) / length };
}
