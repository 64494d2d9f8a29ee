/**
 * The compact layout answer of POST /api/layout (docs/api.md): every value a client needs, once.
 * The full Layout repeats derived data: each fret's point on each string follows from the
 * string's ends and the fret's fraction (`fretPoint`), the board's edges, end and nut line are its
 * four corners paired up, the uncompensated nut and saddle lines are the outer strings' ends.
 * `expandLayout` rebuilds the full Layout from the compact one with the same arithmetic the
 * server used, so every number comes back as the same double.
 *
 * Conventions: lengths in the layout's `units`, board coordinates as in Layout; a point is
 * `[x, y]`, a segment `[startX, startY, endX, endY]`.
 */
import { fretPoint, type FretLine, type Layout, type LayoutFret, type LayoutMarker, type LayoutString, type LayoutWarning } from './layout.ts';
import type { Point, Segment } from './plane.ts';

export type CompactPoint = [x: number, y: number];
export type CompactSegment = [startX: number, startY: number, endX: number, endY: number];

export interface CompactString {
  nut: CompactPoint;
  saddle: CompactPoint;
  scaleLength: number;
}

export interface CompactFret {
  /** 1 - r(n): where the fret lies along every string, as a fraction of its length from the nut end. */
  fraction: number;
  line: CompactSegment;
  slot: CompactSegment;
}

export interface CompactMarker {
  fret: number;
  kind: LayoutMarker['kind'];
  dots: CompactPoint[];
  side: CompactPoint;
}

export interface CompactLayout {
  name: string;
  units: Layout['units'];
  scaleAlong: Layout['scaleAlong'];
  slotWidth: number;
  minimumOverrun: number;
  perpendicularFret: { fret: number; x: number };
  /** String 1 (treble) first. */
  strings: CompactString[];
  /** Fret 1 first. */
  frets: CompactFret[];
  zeroFret: { line: CompactSegment; slot: CompactSegment } | null;
  saddleLine: CompactSegment;
  /** Board corners: nut treble, end treble, end bass, nut bass. */
  outline: [CompactPoint, CompactPoint, CompactPoint, CompactPoint];
  centreLine: CompactSegment;
  markers: CompactMarker[];
  dotDiameters: { face: number; side: number };
  warnings: LayoutWarning[];
}

const point = (p: Point): CompactPoint => [p.x, p.y];
const segment = (s: Segment): CompactSegment => [s.start.x, s.start.y, s.end.x, s.end.y];
const toPoint = ([x, y]: CompactPoint): Point => ({ x, y });
const toSegment = ([x1, y1, x2, y2]: CompactSegment): Segment => ({ start: { x: x1, y: y1 }, end: { x: x2, y: y2 } });
const fretLine = (f: FretLine) => ({ line: segment(f.line), slot: segment(f.slot) });

/**
 * The compact form of `layout`. `fractions` are the design's fret fractions (`fretFractions`,
 * index 0 = the nut), the values `computeLayout` placed the frets with.
 */
export function compactLayout(layout: Layout, fractions: readonly number[]): CompactLayout {
  const [nutTreble, endTreble, endBass, nutBass] = layout.outline;
  if (!nutTreble || !endTreble || !endBass || !nutBass) throw new Error('a layout outline has four corners');
  return {
    name: layout.name,
    units: layout.units,
    scaleAlong: layout.scaleAlong,
    slotWidth: layout.slotWidth,
    minimumOverrun: layout.minimumOverrun,
    perpendicularFret: { fret: layout.perpendicularFret.fret, x: layout.perpendicularFret.x },
    strings: layout.strings.map((s) => ({ nut: point(s.nut), saddle: point(s.saddle), scaleLength: s.scaleLength })),
    frets: layout.frets.map((f) => ({ fraction: fractionOf(fractions, f.number), ...fretLine(f) })),
    zeroFret: layout.zeroFret ? fretLine(layout.zeroFret) : null,
    saddleLine: segment(layout.saddleLine),
    outline: [point(nutTreble), point(endTreble), point(endBass), point(nutBass)],
    centreLine: segment(layout.centreLine),
    markers: layout.markers.map((m) => ({ fret: m.fret, kind: m.kind, dots: m.dots.map(point), side: point(m.side) })),
    dotDiameters: { face: layout.dotDiameters.face, side: layout.dotDiameters.side },
    warnings: layout.warnings.map((w) => ({ code: w.code, message: w.message, fret: w.fret })),
  };
}

function fractionOf(fractions: readonly number[], fret: number): number {
  const fraction = fractions[fret];
  if (fraction === undefined) throw new Error(`no fraction for fret ${fret}`);
  return fraction;
}

/** The full Layout a compact answer stands for (what `computeLayout` returned on the server). */
export function expandLayout(compact: CompactLayout): Layout {
  const strings: LayoutString[] = compact.strings.map((s, i) => ({ index: i + 1, nut: toPoint(s.nut), saddle: toPoint(s.saddle), scaleLength: s.scaleLength }));
  const frets: LayoutFret[] = compact.frets.map((f, i) => {
    const previous = i === 0 ? 0 : compact.frets[i - 1]!.fraction;
    return { line: toSegment(f.line), slot: toSegment(f.slot), number: i + 1, points: strings.map((s) => fretPoint(s, f.fraction, previous)) };
  });
  const [nutTreble, endTreble, endBass, nutBass] = compact.outline.map(toPoint) as [Point, Point, Point, Point];
  const first = strings[0];
  const last = strings[strings.length - 1];
  if (!first || !last) throw new Error('a layout has strings');
  return {
    name: compact.name,
    units: compact.units,
    scaleAlong: compact.scaleAlong,
    slotWidth: compact.slotWidth,
    minimumOverrun: compact.minimumOverrun,
    perpendicularFret: { ...compact.perpendicularFret },
    strings,
    frets,
    zeroFret: compact.zeroFret ? { line: toSegment(compact.zeroFret.line), slot: toSegment(compact.zeroFret.slot) } : null,
    nutLine: { start: nutTreble, end: nutBass },
    saddleLine: toSegment(compact.saddleLine),
    uncompensated: {
      nutLine: { start: first.nut, end: last.nut },
      saddleLine: { start: first.saddle, end: last.saddle },
    },
    boardEnd: { start: endTreble, end: endBass },
    edges: { treble: { start: nutTreble, end: endTreble }, bass: { start: nutBass, end: endBass } },
    outline: [nutTreble, endTreble, endBass, nutBass],
    centreLine: toSegment(compact.centreLine),
    markers: compact.markers.map((m) => ({ fret: m.fret, kind: m.kind, dots: m.dots.map(toPoint), side: toPoint(m.side) })),
    dotDiameters: { ...compact.dotDiameters },
    warnings: compact.warnings.map((w) => ({ ...w })),
  };
}
