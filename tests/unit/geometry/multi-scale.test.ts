import { describe, expect, it } from 'vitest';
import { fretTableCsv } from '~/lib/export/csv.ts';
import { distance, type Point } from '~/lib/geometry/plane.ts';
import { kerfOutline } from '~/lib/export/kerf-outline.ts';
import { distanceToLine, expectNear } from '../../support/expect-near.ts';
import { fretPoint, layoutOf } from '../../support/design-builders.ts';

const FAN = {
  strings: 7,
  scale: { treble: 648, bass: 686 },
  perpendicularFret: 8,
  frets: 24,
  stringSpacing: { nut: 41, bridge: 63 },
};

/** Distance of `point` from the infinite line through a and b. */
function offLine(point: Point, a: Point, b: Point): number {
  const cross = (b.x - a.x) * (point.y - a.y) - (b.y - a.y) * (point.x - a.x);
  return Math.abs(cross) / distance(a, b);
}

/** The point `length` along a string from its uncompensated nut end (negative: behind the nut). */
function alongString(string: { nut: Point; saddle: Point }, length: number): Point {
  const span = distance(string.nut, string.saddle);
  return {
    x: string.nut.x + ((string.saddle.x - string.nut.x) / span) * length,
    y: string.nut.y + ((string.saddle.y - string.nut.y) / span) * length,
  };
}

describe('multi-scale model (invariants from the geometry conventions)', () => {
  const layout = layoutOf(FAN);

  it('outer strings are as long as the given scales and symmetric about the centre line', () => {
    const treble = layout.strings[0]!;
    const bass = layout.strings[6]!;
    expectNear(distance(treble.nut, treble.saddle), 648, 1e-9); // mm
    expectNear(distance(bass.nut, bass.saddle), 686, 1e-9); // mm
    expect([treble.nut.y, bass.nut.y, treble.saddle.y, bass.saddle.y]).toEqual([-20.5, 20.5, -31.5, 31.5]);
  });

  it('the nut line crosses the centre line at the origin', () => {
    const { start, end } = layout.uncompensated.nutLine;
    const t = -start.y / (end.y - start.y);
    expectNear(start.x + (end.x - start.x) * t, 0, 1e-12); // mm
  });

  it('the perpendicular fret has the same x on all strings, and its x is reported', () => {
    for (let string = 1; string <= 7; string++) {
      expectNear(fretPoint(layout, 8, string).x, layout.perpendicularFret.x, 1e-9); // mm
    }
  });

  it('every fret line is straight: the points on all strings are collinear', () => {
    for (const fret of layout.frets) {
      const first = fret.points[0]!;
      const last = fret.points[fret.points.length - 1]!;
      for (const point of fret.points) expect(offLine(point, first, last)).toBeLessThan(1e-9); // mm
      expect(offLine(fret.line.start, first, last)).toBeLessThan(1e-9);
      expect(offLine(fret.line.end, first, last)).toBeLessThan(1e-9);
    }
  });

  it('inner strings are equally spaced along the nut and saddle lines; scale = own straight length', () => {
    for (let index = 1; index < 7; index++) {
      const a = layout.strings[index - 1]!;
      const b = layout.strings[index]!;
      expectNear(distance(a.nut, b.nut), distance(layout.strings[0]!.nut, layout.strings[6]!.nut) / 6, 1e-12);
      expectNear(distance(a.saddle, b.saddle), distance(layout.strings[0]!.saddle, layout.strings[6]!.saddle) / 6, 1e-12);
      expectNear(b.scaleLength, distance(b.nut, b.saddle), 1e-9);
    }
  });

  it('fret n lies at the fraction 1 - 2^(-n/12) of each string from its nut', () => {
    for (const string of layout.strings) {
      for (const fret of [1, 5, 8, 13, 24]) {
        const point = fretPoint(layout, fret, string.index);
        const fraction = 1 - 2 ** (-fret / 12);
        expectNear(point.x, string.nut.x + (string.saddle.x - string.nut.x) * fraction, 1e-9); // mm
        expectNear(point.y, string.nut.y + (string.saddle.y - string.nut.y) * fraction, 1e-9);
        expectNear(point.fromNut, string.scaleLength * fraction, 1e-9);
      }
    }
  });

  it('from_previous adds up to from_nut', () => {
    for (const string of layout.strings) {
      let sum = 0;
      for (const fret of layout.frets) {
        sum += fret.points[string.index - 1]!.fromPrevious;
        expectNear(sum, fret.points[string.index - 1]!.fromNut, 1e-9); // mm
      }
    }
  });

  it('treble = bass reproduces the single-scale table exactly, whatever the perpendicular fret', () => {
    const single = { ...FAN, scale: { treble: 650, bass: 650 } };
    const table = fretTableCsv(layoutOf({ ...single, perpendicularFret: 0 }));
    expect(fretTableCsv(layoutOf({ ...single, perpendicularFret: 8 }))).toBe(table);
    expect(fretTableCsv(layoutOf({ ...single, perpendicularFret: 3.7 }))).toBe(table);
  });

  it('a fractional perpendicular fret uses 2^(-p/12) exactly (not interpolated between frets)', () => {
    const fractional = layoutOf({ ...FAN, perpendicularFret: 7.5 });
    const treble = fractional.strings[0]!;
    const bass = fractional.strings[6]!;
    const fraction = 1 - 2 ** (-7.5 / 12);
    const xOn = (string: typeof treble) => string.nut.x + (string.saddle.x - string.nut.x) * fraction;
    expectNear(xOn(treble), xOn(bass), 1e-9); // mm
    expectNear(fractional.perpendicularFret.x, xOn(treble), 1e-9);
  });

  it('a reversed fan (treble longer than bass) also works', () => {
    const reversed = layoutOf({ ...FAN, scale: { treble: 686, bass: 648 } });
    expectNear(fretPoint(reversed, 8, 1).x, fretPoint(reversed, 8, 7).x, 1e-9);
    expectNear(distance(reversed.strings[0]!.nut, reversed.strings[0]!.saddle), 686, 1e-9);
  });
});

describe('board, slots and compensation', () => {
  it('fret lines run from the treble edge to the bass edge', () => {
    const layout = layoutOf(FAN);
    const { treble, bass } = layout.edges;
    for (const fret of layout.frets) {
      expect(offLine(fret.line.start, treble.start, treble.end)).toBeLessThan(1e-9); // mm
      expect(offLine(fret.line.end, bass.start, bass.end)).toBeLessThan(1e-9);
      expect(fret.slot).toEqual(fret.line);
    }
  });

  it('the edges pass the outer strings by the overhang at the nut (square to the centre line)', () => {
    const layout = layoutOf({ ...FAN, overhang: { nut: 3, end: 5 } });
    const nutTreble = layout.strings[0]!.nut;
    const edge = layout.edges.treble;
    const t = (nutTreble.x - edge.start.x) / (edge.end.x - edge.start.x);
    expectNear(edge.start.y + (edge.end.y - edge.start.y) * t, nutTreble.y - 3, 1e-9); // mm
  });

  it('the board ends endExtension past the last fret, parallel to it', () => {
    const layout = layoutOf({ ...FAN, endExtension: 10 });
    const last = layout.frets[23]!;
    const slope = (s: { start: Point; end: Point }) => (s.end.x - s.start.x) / (s.end.y - s.start.y);
    expectNear(slope(layout.boardEnd), slope(last.line), 1e-12);
    const atCentre = (s: { start: Point; end: Point }) =>
      s.start.x + (s.end.x - s.start.x) * (-s.start.y / (s.end.y - s.start.y));
    expectNear(atCentre(layout.boardEnd) - atCentre(last.line), 10, 1e-9); // mm
    expect(layout.outline).toEqual([
      layout.edges.treble.start,
      layout.edges.treble.end,
      layout.edges.bass.end,
      layout.edges.bass.start,
    ]);
  });

  it('stopped slots end stopDistance short of each edge, measured square to the edge, on their fret line', () => {
    const layout = layoutOf({ ...FAN, slot: { stopped: true, stopDistance: 2.5 } });
    for (const fret of layout.frets) {
      expectNear(distanceToLine(fret.slot.start, layout.edges.treble), 2.5, 1e-9); // mm
      expectNear(distanceToLine(fret.slot.end, layout.edges.bass), 2.5, 1e-9);
      expectNear(distanceToLine(fret.slot.start, fret.line), 0, 1e-9);
      expectNear(distanceToLine(fret.slot.end, fret.line), 0, 1e-9);
    }
    // On the slanted high frets the slot gives up more than 2.5 mm along itself.
    const last = layout.frets.at(-1)!;
    expect(distance(last.line.start, last.slot.start)).toBeGreaterThan(2.5 + 1e-6);
  });

  it('through slots run `overrun` past each edge along the slot; from the layout minimum overrun on, both kerf corners clear the board', () => {
    const width = 0.6;
    const flush = layoutOf({ ...FAN, slot: { width } });
    expect(flush.frets.every((fret) => distance(fret.slot.start, fret.line.start) === 0)).toBe(true);
    // With no overrun, a slanted kerf leaves one corner inside the board at the high frets.
    const outsideBy = (corner: Point, edge: { start: Point; end: Point }, inward: Point) =>
      Math.sign((edge.end.x - edge.start.x) * (corner.y - edge.start.y) - (edge.end.y - edge.start.y) * (corner.x - edge.start.x)) ===
      Math.sign((edge.end.x - edge.start.x) * (inward.y - edge.start.y) - (edge.end.y - edge.start.y) * (inward.x - edge.start.x))
        ? -distanceToLine(corner, edge)
        : distanceToLine(corner, edge);
    const cornersOutside = (layout: typeof flush) =>
      layout.frets.every((fret) => {
        const [startLeft, endLeft, endRight, startRight] = kerfOutline(fret.slot, width);
        const inside = { x: (fret.line.start.x + fret.line.end.x) / 2, y: 0 };
        return [startLeft!, startRight!].every((c) => outsideBy(c, layout.edges.treble, inside) >= -1e-12)
          && [endLeft!, endRight!].every((c) => outsideBy(c, layout.edges.bass, inside) >= -1e-12);
      });
    expect(flush.minimumOverrun).toBeGreaterThan(0);
    expect(cornersOutside(flush)).toBe(false);
    const over = layoutOf({ ...FAN, slot: { width, overrun: flush.minimumOverrun } });
    for (const fret of over.frets) {
      expectNear(distance(fret.slot.start, fret.line.start), flush.minimumOverrun, 1e-9); // mm
      expectNear(distanceToLine(fret.slot.start, fret.line), 0, 1e-9);
    }
    expect(cornersOutside(over)).toBe(true);
    // Square frets need none: (w/2)·cot 90° = 0 on a single-scale board with parallel edges.
    expectNear(layoutOf({ ...FAN, scale: { treble: 650, bass: 650 }, stringSpacing: { nut: 50, bridge: 50 }, overhang: { nut: 4, end: 4 }, perpendicularFret: 0 }).minimumOverrun, 0, 1e-12);
  });

  it('compensation moves the drawn nut and saddle along the outer strings, never the frets', () => {
    const plain = layoutOf(FAN);
    const compensated = layoutOf({ ...FAN, compensation: { nut: 0.5, saddleTreble: 2, saddleBass: 4 } });
    expect(compensated.frets).toEqual(
      plain.frets.map((fret, i) => ({ ...fret, line: compensated.frets[i]!.line, slot: compensated.frets[i]!.slot })),
    );
    expect(fretTableCsv(compensated)).toBe(fretTableCsv(plain));
    const trebleString = compensated.strings[0]!;
    expectNear(distance(trebleString.nut, compensated.saddleLine.start), 648 + 2, 1e-9); // mm
    expectNear(distance(compensated.strings[6]!.nut, compensated.saddleLine.end), 686 + 4, 1e-9);
    // The drawn nut line passes 0.5 mm along each outer string from its uncompensated nut end.
    for (const string of [trebleString, compensated.strings[6]!]) {
      const onLine = alongString(string, 0.5);
      expect(offLine(onLine, compensated.nutLine.start, compensated.nutLine.end)).toBeLessThan(1e-9); // mm
    }
    expect(compensated.uncompensated).toEqual(plain.uncompensated);
  });

  it('a zero fret sits at the nut position and the nut moves zeroFretNutGap behind it', () => {
    const layout = layoutOf({ ...FAN, zeroFret: true, zeroFretNutGap: 5 });
    const zero = layout.zeroFret;
    expect(zero).not.toBeNull();
    const nut = layout.uncompensated.nutLine;
    expect(offLine(zero!.line.start, nut.start, nut.end)).toBeLessThan(1e-9); // mm
    expect(offLine(zero!.line.end, nut.start, nut.end)).toBeLessThan(1e-9);
    for (const string of [layout.strings[0]!, layout.strings[6]!]) {
      const guide = alongString(string, -5);
      expect(offLine(guide, layout.nutLine.start, layout.nutLine.end)).toBeLessThan(1e-9); // mm
    }
    expect(layout.centreLine.start.x).toBeLessThan(-4.9); // mm: the guide nut is behind the origin
    expect(layoutOf(FAN).zeroFret).toBeNull();
  });

  it('markers sit between their fret and the one before, double markers have two dots', () => {
    const layout = layoutOf(FAN);
    expect(layout.markers.map((m) => m.fret)).toEqual([3, 5, 7, 9, 12, 15, 17, 19, 21, 24]);
    const twelve = layout.markers.find((m) => m.fret === 12)!;
    expect(twelve.dots).toHaveLength(2);
    const centreX = (fret: number) => (fretPoint(layout, fret, 1).x + fretPoint(layout, fret, 7).x) / 2;
    const middle = (twelve.dots[0]!.x + twelve.dots[1]!.x) / 2;
    expectNear(middle, (centreX(11) + centreX(12)) / 2, 1e-9); // mm
    expect(twelve.side.y).toBeGreaterThan(fretPoint(layout, 12, 7).y);
  });

  it('default markers are the common-practice set, cut at the last fret', () => {
    expect(layoutOf({ frets: 14 }).markers.map((m) => [m.fret, m.kind])).toEqual([
      [3, 'single'], [5, 'single'], [7, 'single'], [9, 'single'], [12, 'double'],
    ]);
  });

  it('warns when frets come closer than the slot width', () => {
    const tight = layoutOf({ scale: { treble: 120, bass: 120 }, frets: 36, slot: { width: 1 } });
    const warned = tight.warnings.filter((w) => w.code === 'frets-closer-than-slot').map((w) => w.fret);
    expect(warned.length).toBeGreaterThan(0);
    for (const fret of warned) {
      const smallest = Math.min(...tight.frets[fret! - 1]!.points.map((p) => p.fromPrevious));
      expect(smallest).toBeLessThan(1); // mm
    }
    for (const fret of tight.frets.filter((f) => !warned.includes(f.number) && f.number > 1)) {
      for (const point of fret.points) expect(point.fromPrevious).toBeGreaterThanOrEqual(1);
    }
    expect(layoutOf().warnings).toEqual([]);
  });
});

describe('where the board ends', () => {
  const gapAlong = (edge: { start: Point; end: Point }, fret: { start: Point; end: Point }, end: { start: Point; end: Point }) => {
    const cross = (a: { start: Point; end: Point }, b: { start: Point; end: Point }) => {
      const ax = a.end.x - a.start.x, ay = a.end.y - a.start.y, bx = b.end.x - b.start.x, by = b.end.y - b.start.y;
      const s = ((b.start.x - a.start.x) * by - (b.start.y - a.start.y) * bx) / (ax * by - ay * bx);
      return { x: a.start.x + ax * s, y: a.start.y + ay * s };
    };
    return distance(cross(edge, fret), cross(edge, end));
  };

  it('today: the end is the last fret moved endExtension along the centre line, parallel to it', () => {
    const layout = layoutOf({ ...FAN, endExtension: 10 });
    const last = layout.frets.at(-1)!;
    const direction = (s: { start: Point; end: Point }) => Math.atan2(s.end.y - s.start.y, s.end.x - s.start.x);
    expectNear(direction(layout.boardEnd), direction(last.line), 1e-12); // radians
    const onCentre = (s: { start: Point; end: Point }) => s.start.x + ((s.end.x - s.start.x) * (0 - s.start.y)) / (s.end.y - s.start.y);
    expectNear(onCentre(layout.boardEnd) - onCentre(last.line), 10, 1e-9); // mm
  });

  it('a margin at the edge where it is smallest: at least endExtension past the last fret along both edges, exactly on one', () => {
    for (const endLine of ['parallelToLastFret', 'squareToCentreLine'] as const) {
      const layout = layoutOf({ ...FAN, endExtension: 10, endMarginAt: 'edge', endLine });
      const last = layout.frets.at(-1)!.line;
      const gaps = [gapAlong(layout.edges.treble, last, layout.boardEnd), gapAlong(layout.edges.bass, last, layout.boardEnd)];
      expectNear(Math.min(...gaps), 10, 1e-9); // mm
      expect(Math.max(...gaps)).toBeGreaterThanOrEqual(10 - 1e-9);
    }
  });

  it('square to the centre line: both end corners have the same x', () => {
    for (const endMarginAt of ['centreLine', 'edge'] as const) {
      const layout = layoutOf({ ...FAN, endExtension: 10, endMarginAt, endLine: 'squareToCentreLine' });
      expectNear(layout.boardEnd.start.x, layout.boardEnd.end.x, 1e-9); // mm
    }
  });
});
