import { distance, intersectLines, lerpPoint, moveToward, sineBetween, type Point, type Segment } from './plane.ts';

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
  /** How far the board end lies past the last fret, measured as `endMarginAt` says. */
  endExtension: number;
  /** `centreLine`: along the centre line; `edge`: along each edge, the smaller of the two. */
  endMarginAt: 'centreLine' | 'edge';
  /** The end line's direction: parallel to the last fret, or square to the centre line. */
  endLine: 'parallelToLastFret' | 'squareToCentreLine';
}

export interface BoardOutline {
  edges: { treble: Segment; bass: Segment };
  /** The board end line, treble edge to bass edge. */
  boardEnd: Segment;
  /** The drawn nut line, treble edge to bass edge. */
  nutLine: Segment;
  /** Corners: nut treble, end treble, end bass, nut bass (a closed polygon). */
  outline: Point[];
}

/** Iterations allowed for an end placed by its margin along the edges (it converges in a few). */
const EDGE_MARGIN_ITERATIONS = 50;

/**
 * The board's outline: straight edges that pass `overhangNut` outside the outer strings at the nut
 * line and `overhangEnd` outside them at the board end. The end lies `endExtension` past the last
 * fret, along the centre line or (`endMarginAt: 'edge'`) along each edge where that is smallest,
 * parallel to the last fret or square to the centre line.
 */
export function boardOutline(input: BoardOutlineInput): BoardOutline {
  const fretTreble = input.lastFretTreble;
  const fretBass = input.lastFretBass;
  const direction = input.endLine === 'parallelToLastFret' ? { x: fretBass.x - fretTreble.x, y: fretBass.y - fretTreble.y } : { x: 0, y: 1 };
  const through = (p: Point): Segment => ({ start: p, end: { x: p.x + direction.x, y: p.y + direction.y } });
  if (input.endLine === 'parallelToLastFret' && input.endMarginAt === 'centreLine') {
    // The last fret line moved along x: kept in this form so boards laid out before the end
    // options existed come out exactly as they did.
    return outlineWithEnd(input, {
      start: { x: fretTreble.x + input.endExtension, y: fretTreble.y },
      end: { x: fretBass.x + input.endExtension, y: fretBass.y },
    });
  }
  const fretOnCentre = intersectLines(fretTreble, fretBass, { x: 0, y: 0 }, { x: 1, y: 0 });
  let board = outlineWithEnd(input, through({ x: fretOnCentre.x + input.endExtension, y: 0 }));
  if (input.endMarginAt === 'centreLine') return board;
  for (let i = 0; i < EDGE_MARGIN_ITERATIONS; i++) {
    const end = endByEdgeMargin(board.edges, fretTreble, fretBass, input.endExtension, through);
    const next = outlineWithEnd(input, end);
    const moved = distance(next.boardEnd.start, board.boardEnd.start) + distance(next.boardEnd.end, board.boardEnd.end);
    board = next;
    if (moved <= 1e-13 * Math.max(1, Math.abs(fretOnCentre.x))) break;
  }
  return board;
}

/**
 * The end line (through `through(point)`) that lies `margin` past the last fret along the edge
 * where the gap is smallest: the candidate placed from one edge is kept when the other edge's gap
 * is at least as large.
 */
function endByEdgeMargin(
  edges: BoardOutline['edges'],
  fretTreble: Point,
  fretBass: Point,
  margin: number,
  through: (p: Point) => Segment,
): Segment {
  const gapAlong = (edge: Segment, end: Segment) => {
    const fret = intersectLines(edge.start, edge.end, fretTreble, fretBass);
    const atEnd = intersectLines(edge.start, edge.end, end.start, end.end);
    const forward = (atEnd.x - fret.x) * (edge.end.x - edge.start.x) + (atEnd.y - fret.y) * (edge.end.y - edge.start.y);
    return Math.sign(forward) * distance(fret, atEnd);
  };
  const fromEdge = (edge: Segment): Segment => {
    const fret = intersectLines(edge.start, edge.end, fretTreble, fretBass);
    return through(moveToward(fret, edge.start, edge.end, margin));
  };
  const [treble, bass] = [fromEdge(edges.treble), fromEdge(edges.bass)];
  return gapAlong(edges.bass, treble) >= gapAlong(edges.treble, bass) ? treble : bass;
}

/** The outline whose end runs along `end` (any two points on the end line). */
function outlineWithEnd(input: BoardOutlineInput, end: Segment): BoardOutline {
  const trebleAtEnd = intersectLines(input.nutTreble, input.trebleStringFar, end.start, end.end);
  const bassAtEnd = intersectLines(input.nutBass, input.bassStringFar, end.start, end.end);

  const trebleEdgeA = { x: input.nutTreble.x, y: input.nutTreble.y - input.overhangNut };
  const trebleEdgeB = { x: trebleAtEnd.x, y: trebleAtEnd.y - input.overhangEnd };
  const bassEdgeA = { x: input.nutBass.x, y: input.nutBass.y + input.overhangNut };
  const bassEdgeB = { x: bassAtEnd.x, y: bassAtEnd.y + input.overhangEnd };

  const nutTrebleCorner = intersectLines(trebleEdgeA, trebleEdgeB, input.nutTreble, input.nutBass);
  const nutBassCorner = intersectLines(bassEdgeA, bassEdgeB, input.nutTreble, input.nutBass);
  const endTrebleCorner = intersectLines(trebleEdgeA, trebleEdgeB, end.start, end.end);
  const endBassCorner = intersectLines(bassEdgeA, bassEdgeB, end.start, end.end);

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
