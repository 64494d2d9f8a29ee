import { distance, intersectLines, lerpPoint, moveToward, type Point, type Segment } from './plane';

export interface BoardOutlineInput {
  /** Drawn nut line ends on string 1 (treble) and string N (bass); the board starts here. */
  nutTreble: Point;
  nutBass: Point;
  /** A second point on each outer string, giving its direction (e.g. its saddle point). */
  trebleStringFar: Point;
  bassStringFar: Point;
  /** Last fret's points on string 1 and string N. */
  lastFretTreble: Point;
  lastFretBass: Point;
  /** Edge beyond the outer strings at the nut and at the board end, square to the centre line. */
  overhangNut: number;
  overhangEnd: number;
  /** Board end = last fret line moved this far toward the bridge along the centre line. */
  endExtension: number;
}

export interface BoardOutline {
  edges: { treble: Segment; bass: Segment };
  /** The board end line, treble edge to bass edge, parallel to the last fret. */
  boardEnd: Segment;
  /** The drawn nut line, treble edge to bass edge. */
  nutLine: Segment;
  /** Corners: nut treble, end treble, end bass, nut bass (a closed polygon). */
  outline: Point[];
}

/**
 * The board's outline: straight edges that pass `overhangNut` outside the outer strings at the nut
 * line and `overhangEnd` outside them at the board end; the end is parallel to the last fret.
 */
export function boardOutline(input: BoardOutlineInput): BoardOutline {
  const endTreble = { x: input.lastFretTreble.x + input.endExtension, y: input.lastFretTreble.y };
  const endBass = { x: input.lastFretBass.x + input.endExtension, y: input.lastFretBass.y };
  const trebleAtEnd = intersectLines(input.nutTreble, input.trebleStringFar, endTreble, endBass);
  const bassAtEnd = intersectLines(input.nutBass, input.bassStringFar, endTreble, endBass);

  const trebleEdgeA = { x: input.nutTreble.x, y: input.nutTreble.y - input.overhangNut };
  const trebleEdgeB = { x: trebleAtEnd.x, y: trebleAtEnd.y - input.overhangEnd };
  const bassEdgeA = { x: input.nutBass.x, y: input.nutBass.y + input.overhangNut };
  const bassEdgeB = { x: bassAtEnd.x, y: bassAtEnd.y + input.overhangEnd };

  const nutTrebleCorner = intersectLines(trebleEdgeA, trebleEdgeB, input.nutTreble, input.nutBass);
  const nutBassCorner = intersectLines(bassEdgeA, bassEdgeB, input.nutTreble, input.nutBass);
  const endTrebleCorner = intersectLines(trebleEdgeA, trebleEdgeB, endTreble, endBass);
  const endBassCorner = intersectLines(bassEdgeA, bassEdgeB, endTreble, endBass);

  return {
    edges: {
      treble: { start: nutTrebleCorner, end: endTrebleCorner },
      bass: { start: nutBassCorner, end: endBassCorner },
    },
    boardEnd: { start: endTrebleCorner, end: endBassCorner },
    nutLine: { start: nutTrebleCorner, end: nutBassCorner },
    outline: [nutTrebleCorner, endTrebleCorner, endBassCorner, nutBassCorner],
  };
}

/** The line through `treble` and `bass`, extended or cut to run from edge to edge of the board. */
export function acrossBoard(
  edges: BoardOutline['edges'],
  treble: Point,
  bass: Point,
): Segment {
  return {
    start: intersectLines(edges.treble.start, edges.treble.end, treble, bass),
    end: intersectLines(edges.bass.start, edges.bass.end, treble, bass),
  };
}

/** sin of the angle between two segments' directions (1 when square, near 0 when nearly parallel). */
function sineBetween(a: Segment, b: Segment): number {
  const ax = a.end.x - a.start.x;
  const ay = a.end.y - a.start.y;
  const bx = b.end.x - b.start.x;
  const by = b.end.y - b.start.y;
  return Math.abs(ax * by - ay * bx) / (Math.hypot(ax, ay) * Math.hypot(bx, by));
}

/**
 * A stopped slot: the edge-to-edge `line` (treble edge first) shortened at each end so that the
 * end lies `stopDistance` from its edge measured square to that edge (on a slanted fret the slot
 * gives up more than `stopDistance` along itself). Collapses to the midpoint when too short.
 */
export function stopShortOfEdges(line: Segment, edges: BoardOutline['edges'], stopDistance: number): Segment {
  const atStart = stopDistance / sineBetween(line, edges.treble);
  const atEnd = stopDistance / sineBetween(line, edges.bass);
  if (atStart + atEnd >= distance(line.start, line.end)) {
    const middle = lerpPoint(line.start, line.end, 0.5);
    return { start: middle, end: middle };
  }
  return { start: moveToward(line.start, line.start, line.end, atStart), end: moveToward(line.end, line.end, line.start, atEnd) };
}

/**
 * The least overrun (along the slot, past each edge) at which a through slot's whole width, not
 * just its centre line, clears the board edge: (width / 2) |cot θ| for the sharper of the two
 * angles θ between the slot and the edges. 0 for slots square to both edges.
 */
export function minimumOverrun(line: Segment, edges: BoardOutline['edges'], slotWidth: number): number {
  const cotangent = (edge: Segment) => {
    const sine = sineBetween(line, edge);
    return Math.sqrt(Math.max(0, 1 - sine * sine)) / sine;
  };
  return (slotWidth / 2) * Math.max(cotangent(edges.treble), cotangent(edges.bass));
}
