import type { Marker } from '~/lib/schemas/design.ts';
import { lerpPoint, type Point, type Segment } from './plane.ts';

export interface LayoutMarker {
  fret: number;
  kind: Marker['kind'];
  /** Face inlay centres: one on the middle of the string span, or two at its quarter points. */
  dots: Point[];
  /** Side dot on the bass edge (the edge the player looks down on), midway between the frets. */
  side: Point;
}

/** Positions across the string span (0 = string 1, 1 = string N) used for face dots. */
const DOT_POSITIONS: Readonly<Record<Marker['kind'], readonly number[]>> = {
  single: [0.5],
  double: [0.25, 0.75],
};

/**
 * Marker positions, each midway between fret k-1 and fret k.
 * @param spans for every fret 0..F, its points on string 1 and string N
 * @param edgeLines for every fret 0..F, its line from the treble edge to the bass edge
 */
export function layoutMarkers(
  markers: readonly Marker[],
  spans: readonly Segment[],
  edgeLines: readonly Segment[],
): LayoutMarker[] {
  const placed: LayoutMarker[] = [];
  for (const marker of markers) {
    const before = spans[marker.fret - 1];
    const after = spans[marker.fret];
    const edgeBefore = edgeLines[marker.fret - 1];
    const edgeAfter = edgeLines[marker.fret];
    if (!before || !after || !edgeBefore || !edgeAfter) continue;
    const dots = DOT_POSITIONS[marker.kind].map((t) =>
      lerpPoint(lerpPoint(before.start, before.end, t), lerpPoint(after.start, after.end, t), 0.5),
    );
    placed.push({ fret: marker.fret, kind: marker.kind, dots, side: lerpPoint(edgeBefore.end, edgeAfter.end, 0.5) });
  }
  return placed;
}
