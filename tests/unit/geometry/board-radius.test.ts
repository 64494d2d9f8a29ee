/**
 * The radiused board top: heights, arc lengths and the radius check. Outside checks: the arc of
 * a circle over a chord c is 2R·asin(c/2R) (any geometry handbook, e.g. the circular segment
 * formulas); a slanted line on a cone is checked against a polyline sum of 3D chord lengths
 * computed here (a plain numerical integral, independent of the Gauss-Legendre rule the module uses).
 */
import { describe, expect, it } from 'vitest';
import { arcLengthOver, boardSurface, radiusAt, surfaceZ, type BoardSurface } from '~/lib/geometry/board-radius.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { validateDesign } from '~/lib/schemas/design.ts';
import { designInput, designOf } from '../../support/design-builders.ts';
import { expectNear } from '../../support/expect-near.ts';

const cylinder = (radius: number): BoardSurface => ({ radius: { nut: radius, end: radius, lastFretX: 500 } });
const cone: BoardSurface = { radius: { nut: 184.15, end: 406.4, lastFretX: 480 } };

/** Sum of 3D chords over `steps` pieces of a→b lifted onto the surface. */
function polylineLength(surface: BoardSurface, a: { x: number; y: number }, b: { x: number; y: number }, steps: number): number {
  let total = 0;
  let previous = { ...a, z: surfaceZ(surface, a) };
  for (let i = 1; i <= steps; i++) {
    const t = i / steps;
    const p = { x: a.x + (b.x - a.x) * t, y: a.y + (b.y - a.y) * t };
    const z = surfaceZ(surface, p);
    total += Math.hypot(p.x - previous.x, p.y - previous.y, z - previous.z);
    previous = { ...p, z };
  }
  return total;
}

describe('the board top', () => {
  it('is 0 on the crown and sqrt(R² − y²) − R off it (the issue’s definition)', () => {
    const surface = cylinder(241.3);
    expectNear(surfaceZ(surface, { x: 100, y: 0 }), 0, 0); // mm
    expectNear(surfaceZ(surface, { x: 100, y: 25 }), Math.sqrt(241.3 ** 2 - 25 ** 2) - 241.3, 1e-12); // mm
    expect(surfaceZ({ radius: null }, { x: 100, y: 25 })).toBe(0);
  });

  it('changes its radius linearly from the nut to the last fret and beyond (a cone)', () => {
    expectNear(radiusAt(cone, 0), 184.15, 1e-12);
    expectNear(radiusAt(cone, 480), 406.4, 1e-12);
    expectNear(radiusAt(cone, 240), (184.15 + 406.4) / 2, 1e-12);
    expectNear(radiusAt(cone, 500), 184.15 + ((406.4 - 184.15) * 500) / 480, 1e-12);
  });

  it('takes R at the last fret on the centre line, and 0 at the end as the nut radius', () => {
    const layout = computeLayout(designOf({ scale: { treble: 648, bass: 686 }, perpendicularFret: 8 }));
    const last = layout.frets[layout.frets.length - 1]!.line;
    const surface = boardSurface({ nut: 254, end: 0 }, last);
    const centreX = last.start.x + ((last.end.x - last.start.x) * -last.start.y) / (last.end.y - last.start.y);
    expectNear(surface.radius!.lastFretX, centreX, 1e-9);
    expect(surface.radius!.end).toBe(254);
    expect(boardSurface({ nut: 0, end: 300 }, last).radius).toBeNull();
  });
});

describe('arc length over a slot', () => {
  it.each([184.15, 241.3, 304.8, 508])('on a cylinder of R = %d mm, square to the axis: 2R·asin(c/2R) (geometry handbook)', (radius) => {
    const half = 28;
    const arc = arcLengthOver(cylinder(radius), { x: 200, y: -half }, { x: 200, y: half });
    expectNear(arc, 2 * radius * Math.asin((2 * half) / (2 * radius)), 1e-9); // mm
  });

  it('along a slanted slot on a cone: matches a numerical integral (polyline of 200 000 chords)', () => {
    const a = { x: 30, y: -26 };
    const b = { x: 52, y: 27 };
    expectNear(arcLengthOver(cone, a, b), polylineLength(cone, a, b, 200_000), 1e-6); // mm
  });

  it('on a flat board: the slot length itself', () => {
    expect(arcLengthOver({ radius: null }, { x: 0, y: -3 }, { x: 4, y: 0 })).toBe(5);
  });
});

describe('the radius fields', () => {
  it('leave the layout exactly as it was (radius changes only Z)', () => {
    const flat = computeLayout(designOf({ scale: { treble: 648, bass: 686 }, perpendicularFret: 8 }));
    const radiused = computeLayout(designOf({ scale: { treble: 648, bass: 686 }, perpendicularFret: 8, radius: { nut: 254, end: 406.4 } }));
    expect(radiused).toEqual(flat);
  });

  it('refuse a radius smaller than half the board width, naming the field', () => {
    const atNut = validateDesign(designInput({ radius: { nut: 20 } }));
    expect(atNut.ok).toBe(false);
    if (!atNut.ok) expect(atNut.issues[0]?.path).toBe('radius.nut');
    const atEnd = validateDesign(designInput({ radius: { nut: 200, end: 25 } }));
    expect(atEnd.ok).toBe(false);
    if (!atEnd.ok) expect(atEnd.issues[0]).toMatchObject({ path: 'radius.end', message: expect.stringContaining('at the board end') });
  });

  it('accept the common radii (7.25 in to 20 in, from memory, common practice)', () => {
    for (const inches of [7.25, 9.5, 10, 12, 16, 20]) {
      expect(validateDesign(designInput({ radius: { nut: inches * 25.4 } })).ok).toBe(true);
    }
  });
});
