import { formatLength } from '~/lib/format/units.ts';
import type { Layout, Segment } from '~/lib/geometry/layout.ts';
import { boardPicture, fretNumbersApart, MONO_ADVANCE_EM, partsOn, pictureBounds, type LineRole, type PictureLayer } from '~/lib/picture/board-picture.ts';

/**
 * A read-only drawing of a computed layout for the proof page, as plain data an SVG template
 * renders. Coordinates are the layout's own (design units); the SVG flips y for display only
 * (`transform="scale(1,-1)"` inside the viewBox), so the bass side is drawn at the top.
 */
export interface DrawingLine {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

export interface DrawingFret {
  number: number;
  line: DrawingLine;
  /** Hover readout: the fret's distance from the nut on the outer strings. */
  readout: string;
}

export interface ProofDrawing {
  /** SVG viewBox in display coordinates (y already flipped), with a margin around the board. */
  viewBox: string;
  /** Width and height of the viewBox in design units, for the aspect ratio. */
  width: number;
  height: number;
  outline: string;
  strings: DrawingLine[];
  /** Every fret line, the zero fret first as fret 0 when the design has one. */
  frets: DrawingFret[];
  nut: DrawingLine;
  saddle: DrawingLine;
  /** The uncompensated nut and saddle lines, where compensation moves them. */
  references: DrawingLine[];
  centreLine: DrawingLine;
  /** Face dots and side dots at their real diameters (design units). */
  dots: { x: number; y: number; r: number; side: boolean }[];
  /** A thin stroke that reads at any zoom, in design units. */
  stroke: number;
  /** Size of the fret numbers, in design units. */
  fontSize: number;
  /**
   * The fret numbers to print, in display coordinates (y flipped; `y` is the baseline of text
   * centred on `x`), thinned by the picture's one rule where they would overprint.
   */
  numbers: { fret: number; text: string; x: number; y: number }[];
}

/** Fret numbers are this fraction of the drawing's width. */
const FONT_PER_WIDTH = 1 / 140;

function line(segment: Segment): DrawingLine {
  return { x1: segment.start.x, y1: segment.start.y, x2: segment.end.x, y2: segment.end.y };
}

function fretReadout(layout: Layout, number: number): string {
  const fret = layout.frets.find((f) => f.number === number);
  if (!fret) return 'Fret 0: the zero fret, where the nut would be';
  const first = fret.points[0];
  const last = fret.points[fret.points.length - 1];
  const along = (p: typeof first) => (p ? formatLength(p.fromNut, layout.units, true) : '');
  return first && last && first !== last
    ? `Fret ${fret.number}: ${along(first)} from the nut on string 1, ${along(last)} on string ${last.string}`
    : `Fret ${fret.number}: ${along(first)} from the nut`;
}

/** Builds the proof drawing of `layout` from its board picture; pure, no DOM. */
export function proofDrawing(layout: Layout): ProofDrawing {
  const picture = boardPicture(layout);
  const box = pictureBounds(picture, ['outline', 'strings', 'saddle', 'face-dots', 'side-dots']);
  const margin = (box.maxX - box.minX) * 0.02;
  const width = box.maxX - box.minX + 2 * margin;
  const height = box.maxY - box.minY + 2 * margin;
  const lines = (layer: PictureLayer, role: LineRole) => partsOn(picture, layer, 'line').filter((part) => part.role === role);
  const only = (layer: PictureLayer, role: LineRole) => line(lines(layer, role)[0]!.segment);
  const fontSize = width * FONT_PER_WIDTH;
  const numbers = lines('frets', 'fret').map((part) => ({ fret: part.fret!, text: String(part.fret), x: part.segment.start.x, y: -part.segment.start.y + fontSize * 1.3 }));
  return {
    viewBox: `${box.minX - margin} ${-(box.maxY + margin)} ${width} ${height}`,
    width,
    height,
    outline: layout.outline.map((p) => `${p.x},${p.y}`).join(' '),
    strings: lines('strings', 'string').map((part) => line(part.segment)),
    frets: lines('frets', 'fret').map((part) => ({ number: part.fret!, line: line(part.segment), readout: fretReadout(layout, part.fret!) })),
    nut: only('nut', 'nut'),
    saddle: only('saddle', 'saddle'),
    references: [...lines('nut', 'nut-uncompensated'), ...lines('saddle', 'saddle-uncompensated')].map((part) => line(part.segment)),
    centreLine: only('centre-line', 'centre-line'),
    dots: (['face-dots', 'side-dots'] as const).flatMap((layer) =>
      partsOn(picture, layer, 'circle').map((dot) => ({ x: dot.centre.x, y: dot.centre.y, r: dot.diameter / 2, side: layer === 'side-dots' })),
    ),
    stroke: width / 1500,
    fontSize,
    numbers: fretNumbersApart(numbers, (n) => ({
      minX: n.x - (n.text.length * MONO_ADVANCE_EM * fontSize) / 2,
      maxX: n.x + (n.text.length * MONO_ADVANCE_EM * fontSize) / 2,
      minY: n.y - fontSize,
      maxY: n.y,
    })),
  };
}
