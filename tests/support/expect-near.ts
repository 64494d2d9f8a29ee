import { expect } from 'vitest';

/** |actual - expected| <= tolerance, where the tolerance carries the unit named at the call. */
export function expectNear(actual: number, expected: number, tolerance: number): void {
  const gap = Math.abs(actual - expected);
  if (!(gap <= tolerance)) {
    expect.fail(`expected ${actual} to be within ${tolerance} of ${expected} (off by ${gap})`);
  }
}

/** Distance from `point` to the infinite line through `line` (plain analytic geometry), in the line's units. */
export function distanceToLine(point: { x: number; y: number }, line: { start: { x: number; y: number }; end: { x: number; y: number } }): number {
  const dx = line.end.x - line.start.x;
  const dy = line.end.y - line.start.y;
  return Math.abs(dy * (point.x - line.start.x) - dx * (point.y - line.start.y)) / Math.hypot(dx, dy);
}
