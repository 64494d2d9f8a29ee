import type { LengthUnit } from '~/lib/format/units.ts';
import type { Design } from '~/lib/schemas/design.ts';

export type ScaleConvention = Design['scaleAlong'];
import { acrossBoard, boardOutline, minimumOverrun, stopShortOfEdges } from './board-outline.ts';
import { layoutMarkers, type LayoutMarker } from './markers.ts';
import { layoutWarnings, type ClosestGap, type LayoutWarning } from './layout-warnings.ts';
import { extendBothEnds, intersectLines, lerpPoint, moveToward, type Point, type Segment } from './plane.ts';
import { remainingFraction } from './temperament.ts';

export type { LayoutMarker } from './markers.ts';
export type { LayoutWarning, LayoutWarningCode } from './layout-warnings.ts';
export type { Point, Segment } from './plane.ts';

export interface LayoutString {
  /** 1 = treble .. N = bass. */
  index: number;
  /** Uncompensated string ends: where its scale length starts and ends. */
  nut: Point;
  saddle: Point;
  /** Straight nut-to-saddle length (the given scale for strings 1 and N). */
  scaleLength: number;
}

export interface FretPoint {
  /** String index, 1 = treble. */
  string: number;
  x: number;
  y: number;
  /** Along the string from its (uncompensated) nut end. */
  fromNut: number;
  /** Along the string from the previous fret (from the nut for fret 1). */
  fromPrevious: number;
}

export interface FretLine {
  /** The fret line from the treble edge of the board to the bass edge. */
  line: Segment;
  /** The slot to cut: the full line plus the design's overrun, or stopped short of both edges. */
  slot: Segment;
}

export interface LayoutFret extends FretLine {
  number: number;
  /** One point per string, string 1 first. */
  points: FretPoint[];
}

/**
 * A computed fret layout: plain, serialisable data in the design's units and board coordinates
 * (+x from the nut toward the bridge along the centre line, +y toward the bass side, origin where
 * the uncompensated nut line crosses the centre line).
 */
export interface Layout {
  name: string;
  units: LengthUnit;
  /** How the design's scale lengths were given: along each outer string, or as its run along the centre line. */
  scaleAlong: ScaleConvention;
  slotWidth: number;
  /**
   * The least `slot.overrun` at which every through slot's whole width clears both board edges
   * (0 when every slot is square to the edges).
   */
  minimumOverrun: number;
  /** The fret square to the centre line, and its x. */
  perpendicularFret: { fret: number; x: number };
  strings: LayoutString[];
  frets: LayoutFret[];
  /** The zero fret (at the compensated nut position) when the design has one. */
  zeroFret: FretLine | null;
  /** Drawn nut line, edge to edge: compensated, and moved behind the zero fret if there is one. */
  nutLine: Segment;
  /** Drawn saddle line from string 1 to string N, compensated. */
  saddleLine: Segment;
  /** Nut and saddle lines through the strings' uncompensated ends (string 1 to string N). */
  uncompensated: { nutLine: Segment; saddleLine: Segment };
  boardEnd: Segment;
  edges: { treble: Segment; bass: Segment };
  /** Board corners in order: nut treble, end treble, end bass, nut bass. */
  outline: Point[];
  /** From the drawn nut line to the drawn saddle line, along y = 0. */
  centreLine: Segment;
  markers: LayoutMarker[];
  /** Face dot and side dot diameters, in the design's units. */
  dotDiameters: { face: number; side: number };
  warnings: LayoutWarning[];
}

/**
 * Where each fret lies along every string: index n holds 1 - r(n), the fraction of a string's
 * length from its nut end (index 0 is the nut, 0). r comes from the design's temperament.
 */
export function fretFractions(temperament: Design['temperament'], frets: number): number[] {
  const r = remainingFraction(temperament);
  const fractions: number[] = [0];
  for (let n = 1; n <= frets; n++) fractions.push(1 - r(n));
  return fractions;
}

/**
 * The point of a fret on one string, at `fraction` of the string's length from its
 * (uncompensated) nut end; `previous` is the previous fret's fraction (0 for fret 1). Lengths in
 * the design's units. The one rule computeLayout and the compact layout answer share, so a
 * point rebuilt from the answer is the same double the server computed.
 */
export function fretPoint(string: LayoutString, fraction: number, previous: number): FretPoint {
  const { index, nut, saddle, scaleLength } = string;
  return {
    string: index,
    x: nut.x + (saddle.x - nut.x) * fraction,
    y: nut.y + (saddle.y - nut.y) * fraction,
    fromNut: fraction * scaleLength,
    fromPrevious: (fraction - previous) * scaleLength,
  };
}

/**
 * Computes the fret layout of a validated design.
 *
 * Model: the outer strings are symmetric about the centre line (y = ∓nut/2 at the nut,
 * ∓bridge/2 at the saddle). Each is as long as its scale (`scaleAlong: 'strings'`), or runs its
 * scale along the centre line, nut to saddle square to the nut (`'centreLine'`: a single-scale
 * board then has every fret n at x = L (1 - r(n)) on every string). Their nut ends are offset along x so that
 * the perpendicular fret p has the same x on string 1 and string N. Inner strings are spaced
 * equally along the nut and saddle lines. Fret n lies on each string at the fraction 1 - r(n)
 * from its nut end (r from the temperament), so every fret line is straight.
 * Compensation moves only the drawn nut and saddle lines, never the frets.
 * With a zero fret, the zero fret sits at the (compensated) nut position and the drawn nut, which
 * then only guides the strings, sits `zeroFretNutGap` behind it along the outer strings.
 */
export function computeLayout(design: Design): Layout {
  const r = remainingFraction(design.temperament);
  const stringCount = design.strings;
  const fretCount = design.frets;

  const spread = (design.stringSpacing.bridge - design.stringSpacing.nut) / 2;
  const alongCentre = design.scaleAlong === 'centreLine';
  const trebleRun = alongCentre ? design.scale.treble : Math.sqrt(design.scale.treble ** 2 - spread * spread);
  const bassRun = alongCentre ? design.scale.bass : Math.sqrt(design.scale.bass ** 2 - spread * spread);
  const trebleLength = alongCentre ? Math.hypot(trebleRun, spread) : design.scale.treble;
  const bassLength = alongCentre ? Math.hypot(bassRun, spread) : design.scale.bass;
  // Fret p at x_t + (1 - r(p)) * run_t on both outer strings; offsets ±shift keep the nut line
  // crossing the centre line at x = 0.
  const perpendicularFraction = 1 - r(design.perpendicularFret);
  const shift = (perpendicularFraction * (bassRun - trebleRun)) / 2;
  const halfNut = design.stringSpacing.nut / 2;
  const halfBridge = design.stringSpacing.bridge / 2;
  const nutTreble = { x: shift, y: -halfNut };
  const nutBass = { x: -shift, y: halfNut };
  const saddleTreble = { x: shift + trebleRun, y: -halfBridge };
  const saddleBass = { x: -shift + bassRun, y: halfBridge };

  const strings: LayoutString[] = [];
  for (let index = 1; index <= stringCount; index++) {
    const t = (index - 1) / (stringCount - 1);
    const nut = lerpPoint(nutTreble, nutBass, t);
    const saddle = lerpPoint(saddleTreble, saddleBass, t);
    const scaleLength =
      index === 1 ? trebleLength : index === stringCount ? bassLength : Math.hypot(saddle.x - nut.x, saddle.y - nut.y);
    strings.push({ index, nut, saddle, scaleLength });
  }

  const fractions = fretFractions(design.temperament, fretCount);

  const fretPoints: FretPoint[][] = [];
  const closestGaps: ClosestGap[] = [];
  for (let n = 1; n <= fretCount; n++) {
    const fraction = fractions[n] ?? 0;
    const previous = fractions[n - 1] ?? 0;
    const points: FretPoint[] = new Array<FretPoint>(stringCount);
    const closest = { gap: Number.POSITIVE_INFINITY, string: 1 };
    for (let i = 0; i < stringCount; i++) {
      const point = fretPoint(strings[i]!, fraction, previous);
      points[i] = point;
      if (point.fromPrevious < closest.gap) {
        closest.gap = point.fromPrevious;
        closest.string = point.string;
      }
    }
    fretPoints.push(points);
    closestGaps.push(closest);
  }

  const zeroFretPosition = design.compensation.nut;
  const nutSetback = design.zeroFret ? zeroFretPosition - design.zeroFretNutGap : zeroFretPosition;
  const drawnNutTreble = moveToward(nutTreble, nutTreble, saddleTreble, nutSetback);
  const drawnNutBass = moveToward(nutBass, nutBass, saddleBass, nutSetback);
  const drawnSaddleTreble = moveToward(saddleTreble, nutTreble, saddleTreble, design.compensation.saddleTreble);
  const drawnSaddleBass = moveToward(saddleBass, nutBass, saddleBass, design.compensation.saddleBass);

  const lastFret = fretPoints[fretCount - 1] ?? [];
  const board = boardOutline({
    nutTreble: drawnNutTreble,
    nutBass: drawnNutBass,
    trebleStringFar: saddleTreble,
    bassStringFar: saddleBass,
    lastFretTreble: lastFret[0] ?? nutTreble,
    lastFretBass: lastFret[stringCount - 1] ?? nutBass,
    overhangNut: design.overhang.nut,
    overhangEnd: design.overhang.end,
    endExtension: design.endExtension,
    endMarginAt: design.endMarginAt,
    endLine: design.endLine,
  });

  // Stopped slots end stopDistance short of each edge, square to the edge; through slots run
  // edge to edge and `overrun` past each edge along the slot.
  const cutSlot = (line: Segment): Segment =>
    design.slot.stopped ? stopShortOfEdges(line, board.edges, design.slot.stopDistance) : extendBothEnds(line, design.slot.overrun);

  const spans: Segment[] = [{ start: nutTreble, end: nutBass }];
  const edgeLines: Segment[] = [acrossBoard(board.edges, nutTreble, nutBass)];
  const frets: LayoutFret[] = fretPoints.map((points, index) => {
    const treble = points[0] ?? nutTreble;
    const bass = points[stringCount - 1] ?? nutBass;
    const line = acrossBoard(board.edges, treble, bass);
    spans.push({ start: treble, end: bass });
    edgeLines.push(line);
    return { number: index + 1, points, line, slot: cutSlot(line) };
  });

  let zeroFret: FretLine | null = null;
  if (design.zeroFret) {
    const line = acrossBoard(
      board.edges,
      moveToward(nutTreble, nutTreble, saddleTreble, zeroFretPosition),
      moveToward(nutBass, nutBass, saddleBass, zeroFretPosition),
    );
    zeroFret = { line, slot: cutSlot(line) };
  }

  const centreLine = {
    start: crossCentreLine(board.nutLine),
    end: crossCentreLine({ start: drawnSaddleTreble, end: drawnSaddleBass }),
  };

  return {
    name: design.name,
    units: design.units,
    scaleAlong: design.scaleAlong,
    slotWidth: design.slot.width,
    // Fret lines turn steadily from the nut to the last fret, so the sharpest angle to an edge is at
    // an end of the board: the first or last fret, or the zero fret.
    minimumOverrun: Math.max(
      0,
      ...[frets[0], frets[frets.length - 1], zeroFret].map((fret) => (fret ? minimumOverrun(fret.line, board.edges, design.slot.width) : 0)),
    ),
    perpendicularFret: {
      fret: design.perpendicularFret,
      x: (perpendicularFraction * (trebleRun + bassRun)) / 2,
    },
    strings,
    frets,
    zeroFret,
    nutLine: board.nutLine,
    saddleLine: { start: drawnSaddleTreble, end: drawnSaddleBass },
    uncompensated: {
      nutLine: { start: nutTreble, end: nutBass },
      saddleLine: { start: saddleTreble, end: saddleBass },
    },
    boardEnd: board.boardEnd,
    edges: board.edges,
    outline: board.outline,
    centreLine,
    markers: layoutMarkers(design.markers, spans, edgeLines),
    dotDiameters: { face: design.faceDotDiameter, side: design.sideDotDiameter },
    warnings: layoutWarnings({
      units: design.units,
      slotWidth: design.slot.width,
      zeroFret: design.zeroFret,
      stoppedSlots: design.slot.stopped,
      stopDistance: design.slot.stopDistance,
      nutCompensation: design.compensation.nut,
      closestGaps,
      frets,
      boardEndCentreX: crossCentreLine(board.boardEnd).x,
      saddleCentreX: centreLine.end.x,
    }),
  };
}

/** Where a (non-horizontal) line crosses the centre line y = 0. */
function crossCentreLine(segment: Segment): Point {
  return intersectLines(segment.start, segment.end, { x: 0, y: 0 }, { x: 1, y: 0 });
}
