import { formatLength } from '~/lib/format/units';
import type { Layout, Point, Segment } from '~/lib/geometry/layout';

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
  frets: DrawingFret[];
  nut: DrawingLine;
  saddle: DrawingLine;
  centreLine: DrawingLine;
  dots: { x: number; y: number; r: number }[];
  /** A thin stroke that reads at any zoom, in design units. */
  stroke: number;
}

function line(segment: Segment): DrawingLine {
  return { x1: segment.start.x, y1: segment.start.y, x2: segment.end.x, y2: segment.end.y };
}

function fretReadout(layout: Layout, fret: Layout['frets'][number]): string {
  const first = fret.points[0];
  const last = fret.points[fret.points.length - 1];
  const along = (p: typeof first) => (p ? formatLength(p.fromNut, layout.units, true) : '');
  return first && last && first !== last
    ? `Fret ${fret.number}: ${along(first)} from the nut on string 1, ${along(last)} on string ${last.string}`
    : `Fret ${fret.number}: ${along(first)} from the nut`;
}

/** Builds the proof drawing of `layout`; pure, no DOM. */
export function proofDrawing(layout: Layout): ProofDrawing {
  const corners: Point[] = [...layout.outline, layout.saddleLine.start, layout.saddleLine.end, ...layout.strings.flatMap((s) => [s.nut, s.saddle])];
  const xs = corners.map((p) => p.x);
  const ys = corners.map((p) => p.y);
  const minX = Math.min(...xs);
  const maxX = Math.max(...xs);
  const minY = Math.min(...ys);
  const maxY = Math.max(...ys);
  const margin = (maxX - minX) * 0.02;
  const width = maxX - minX + 2 * margin;
  const height = maxY - minY + 2 * margin;
  const stroke = width / 1500;
  return {
    viewBox: `${minX - margin} ${-(maxY + margin)} ${width} ${height}`,
    width,
    height,
    outline: layout.outline.map((p) => `${p.x},${p.y}`).join(' '),
    strings: layout.strings.map((s) => line({ start: s.nut, end: s.saddle })),
    frets: layout.frets.map((fret) => ({ number: fret.number, line: line(fret.line), readout: fretReadout(layout, fret) })),
    nut: line(layout.nutLine),
    saddle: line(layout.saddleLine),
    centreLine: line(layout.centreLine),
    dots: layout.markers.flatMap((m) => m.dots.map((d) => ({ x: d.x, y: d.y, r: stroke * 6 }))),
    stroke,
  };
}
