/**
 * Where a template's slots should be, along each line a person can measure: the treble edge, the
 * bass edge, the centre line and each string, every distance taken from the nut reference the
 * printed template marks (the zero fret where the design has one, else the drawn nut line).
 * Everything comes from computeLayout; here we only find where its lines cross.
 */
import { computeLayout, type Layout, type Point, type Segment } from '~/lib/geometry/layout.ts';
import { intersectLines } from '~/lib/geometry/plane.ts';
import type { LengthUnit } from '~/lib/format/units.ts';
import type { Design } from '~/lib/schemas/design.ts';
import { measureLines, type MeasureLine } from '~/lib/templates/check/measure-lines.ts';

/** One expected slot position along one line, in the design's units. */
export interface ReferenceSlot {
  fret: number;
  /** From the nut reference along the line, toward the bridge. */
  fromNut: number;
}

/** One line a template can be measured along. */
export interface ReferenceLine {
  along: MeasureLine;
  /**
   * From the nut reference to the (uncompensated) saddle line along this line: the length the fret
   * positions divide. On a string without nut compensation or zero fret it is the string's scale.
   */
  length: number;
  /** Fret 1 first. */
  slots: ReferenceSlot[];
}

export interface CheckReference {
  name: string;
  units: LengthUnit;
  frets: number;
  strings: number;
  /** Whether the outer strings have different scale lengths. */
  fanned: boolean;
  lines: ReferenceLine[];
}

/** The nut reference the printed template marks: the zero fret where there is one, else the drawn nut. */
export function nutReference(layout: Layout): Segment {
  return layout.zeroFret?.line ?? layout.nutLine;
}

/** The infinite line each measure line lies on, pointing from the nut toward the bridge. */
function lineOf(layout: Layout, along: MeasureLine): Segment {
  if (along === 'treble-edge') return layout.edges.treble;
  if (along === 'bass-edge') return layout.edges.bass;
  if (along === 'centre-line') return { start: { x: 0, y: 0 }, end: { x: 1, y: 0 } };
  const string = layout.strings[Number(along.slice('string-'.length)) - 1]!;
  return { start: string.nut, end: string.saddle };
}

/** Where fret `index` (0-based) meets the line: fret lines cross edges and the centre line; strings carry fret points. */
function fretCrossing(layout: Layout, along: MeasureLine, line: Segment, index: number): Point {
  const fret = layout.frets[index]!;
  if (along.startsWith('string-')) return fret.points[Number(along.slice('string-'.length)) - 1]!;
  return cross(fret.line, line);
}

function cross(a: Segment, b: Segment): Point {
  return intersectLines(a.start, a.end, b.start, b.end);
}

/** Expected positions along one line of a computed layout. */
export function referenceLine(layout: Layout, along: MeasureLine): ReferenceLine {
  const line = lineOf(layout, along);
  const origin = cross(nutReference(layout), line);
  const span = Math.hypot(line.end.x - line.start.x, line.end.y - line.start.y);
  const ux = (line.end.x - line.start.x) / span;
  const uy = (line.end.y - line.start.y) / span;
  // Signed, so a nut set back past a fret (never sensible, but allowed) reads as negative.
  const fromNut = (p: Point) => (p.x - origin.x) * ux + (p.y - origin.y) * uy;
  return {
    along,
    length: fromNut(cross(layout.uncompensated.saddleLine, line)),
    slots: layout.frets.map((fret, index) => ({ fret: fret.number, fromNut: fromNut(fretCrossing(layout, along, line, index)) })),
  };
}

/** The expected slot positions of every fret along every line of a validated design. */
export function checkReference(design: Design): CheckReference {
  const layout = computeLayout(design);
  return {
    name: design.name,
    units: design.units,
    frets: design.frets,
    strings: design.strings,
    fanned: design.scale.treble !== design.scale.bass,
    lines: measureLines(design.strings).map((along) => referenceLine(layout, along)),
  };
}

/** The reference along `along`, if the design has that line. */
export function referenceAlong(reference: CheckReference, along: MeasureLine): ReferenceLine | undefined {
  return reference.lines.find((line) => line.along === along);
}
