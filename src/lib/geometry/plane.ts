/**
 * Points and straight lines in board coordinates (+x from the nut toward the bridge along the
 * centre line, +y toward the bass side). Units are whatever the caller's design uses.
 */

export interface Point {
  x: number;
  y: number;
}

/** A straight piece of line from `start` to `end`. */
export interface Segment {
  start: Point;
  end: Point;
}

/**
 * The point at fraction `t` from `a` (t = 0) to `b` (t = 1). Weighted form: exact at both ends and
 * symmetric, so strings placed symmetrically about the centre line get mirrored coordinates.
 */
export function lerpPoint(a: Point, b: Point, t: number): Point {
  const s = 1 - t;
  return { x: a.x * s + b.x * t, y: a.y * s + b.y * t };
}

export function distance(a: Point, b: Point): number {
  return Math.hypot(b.x - a.x, b.y - a.y);
}

/** `point` moved by `length` in the direction from `from` to `to`. */
export function moveToward(point: Point, from: Point, to: Point, length: number): Point {
  const span = distance(from, to);
  return {
    x: point.x + ((to.x - from.x) / span) * length,
    y: point.y + ((to.y - from.y) / span) * length,
  };
}

/**
 * Where the infinite line through a1, a2 meets the infinite line through b1, b2.
 * @throws RangeError for parallel lines (never the case for the board's edges and fret lines).
 */
export function intersectLines(a1: Point, a2: Point, b1: Point, b2: Point): Point {
  const ax = a2.x - a1.x;
  const ay = a2.y - a1.y;
  const bx = b2.x - b1.x;
  const by = b2.y - b1.y;
  const determinant = ax * by - ay * bx;
  if (determinant === 0) throw new RangeError('lines are parallel');
  const s = ((b1.x - a1.x) * by - (b1.y - a1.y) * bx) / determinant;
  return { x: a1.x + ax * s, y: a1.y + ay * s };
}

/** The segment made longer by `length` at both ends, along its own direction. */
export function extendBothEnds(segment: Segment, length: number): Segment {
  if (length === 0) return segment;
  return { start: moveToward(segment.start, segment.end, segment.start, length), end: moveToward(segment.end, segment.start, segment.end, length) };
}

/** sin of the angle between two segments' directions: 1 when square, near 0 when nearly parallel. */
export function sineBetween(a: Segment, b: Segment): number {
  const [ax, ay, bx, by] = [a.end.x - a.start.x, a.end.y - a.start.y, b.end.x - b.start.x, b.end.y - b.start.y];
  return Math.abs(ax * by - ay * bx) / Math.sqrt((ax * ax + ay * ay) * (bx * bx + by * by));
}

/** The angle between two lines, 0° to 90°. */
export function angleBetweenDeg(a: Segment, b: Segment): number {
  const [ax, ay, bx, by] = [a.end.x - a.start.x, a.end.y - a.start.y, b.end.x - b.start.x, b.end.y - b.start.y];
  const cosine = Math.abs(ax * bx + ay * by) / Math.sqrt((ax * ax + ay * ay) * (bx * bx + by * by));
  return (Math.acos(Math.min(1, cosine)) * 180) / Math.PI;
}
