import { describe, expect, it } from 'vitest';
import { distanceToSegment, nearestFret, snapPoint, snapTargets } from '~/components/editor/board-picking.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';

const fan = DEMO_DESIGNS.find((d) => d.id === 'seven-string-fan');
if (!fan) throw new Error('missing demo');
const layout = computeLayout(fan.design);

describe('picking on the board', () => {
  it('measures the distance to a segment, not to its infinite line', () => {
    const segment = { start: { x: 0, y: 0 }, end: { x: 10, y: 0 } };
    expect(distanceToSegment({ x: 5, y: 3 }, segment)).toBe(3);
    expect(distanceToSegment({ x: 13, y: 4 }, segment)).toBe(5);
  });

  it('finds the fret under a point on its line, and none when the point is far from every fret', () => {
    const twelve = layout.frets[11];
    if (!twelve) throw new Error('no fret 12');
    const onLine = twelve.points[3];
    if (!onLine) throw new Error('no string 4');
    expect(nearestFret(layout, { x: onLine.x + 0.3, y: onLine.y }, 1)).toBe(12);
    expect(nearestFret(layout, { x: -200, y: 0 }, 1)).toBeNull();
  });

  it('snaps the measure tool to the nearest fret and string crossing within reach', () => {
    const targets = snapTargets(layout);
    expect(targets.length).toBe(7 * 2 + 7 * 24);
    const crossing = layout.frets[7]?.points[0];
    if (!crossing) throw new Error('no fret 8');
    const snapped = snapPoint(targets, { x: crossing.x + 0.5, y: crossing.y - 0.5 }, 1);
    expect(snapped).toEqual({ point: { x: crossing.x, y: crossing.y }, snapped: true });
    const free = { x: -100, y: -100 };
    expect(snapPoint(targets, free, 1)).toEqual({ point: free, snapped: false });
  });
});
