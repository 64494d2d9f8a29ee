/**
 * Finding what the pointer is on, in board coordinates: the nearest fret line for the readouts,
 * and the nearest fret/string intersection for the measure tool's snapping.
 */
import type { Layout } from '~/lib/geometry/layout.ts';
import { distance, type Point, type Segment } from '~/lib/geometry/plane.ts';

/** Shortest distance from `point` to the segment (not the infinite line). */
export function distanceToSegment(point: Point, segment: Segment): number {
  const dx = segment.end.x - segment.start.x;
  const dy = segment.end.y - segment.start.y;
  const lengthSquared = dx * dx + dy * dy;
  const t =
    lengthSquared === 0
      ? 0
      : Math.min(1, Math.max(0, ((point.x - segment.start.x) * dx + (point.y - segment.start.y) * dy) / lengthSquared));
  return distance(point, { x: segment.start.x + dx * t, y: segment.start.y + dy * t });
}

/** The number of the fret whose line passes closest to `point`, if within `reach` board units. */
export function nearestFret(layout: Layout, point: Point, reach: number): number | null {
  let best: number | null = null;
  let bestDistance = reach;
  for (const fret of layout.frets) {
    const gap = distanceToSegment(point, fret.line);
    if (gap <= bestDistance) {
      best = fret.number;
      bestDistance = gap;
    }
  }
  return best;
}

/** Points the measure tool snaps to: every string's nut and saddle end and every fret crossing. */
export function snapTargets(layout: Layout): Point[] {
  const targets: Point[] = [];
  for (const string of layout.strings) targets.push(string.nut, string.saddle);
  for (const fret of layout.frets) for (const point of fret.points) targets.push({ x: point.x, y: point.y });
  return targets;
}

/** The target closest to `point` if within `reach` board units, otherwise `point` itself. */
export function snapPoint(targets: readonly Point[], point: Point, reach: number): { point: Point; snapped: boolean } {
  let best: Point | null = null;
  let bestDistance = reach;
  for (const target of targets) {
    const gap = distance(point, target);
    if (gap <= bestDistance) {
      best = target;
      bestDistance = gap;
    }
  }
  return best ? { point: { x: best.x, y: best.y }, snapped: true } : { point, snapped: false };
}
