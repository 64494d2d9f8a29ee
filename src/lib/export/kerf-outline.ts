import type { Point, Segment } from '~/lib/geometry/layout.ts';

/**
 * The closed outline of a slot of width `width` cut along `slot`: a rectangle whose long sides run
 * `width / 2` either side of the slot's centre line. Corners in order: start-left, end-left,
 * end-right, start-right (same units as the inputs).
 */
export function kerfOutline(slot: Segment, width: number): Point[] {
  const dx = slot.end.x - slot.start.x;
  const dy = slot.end.y - slot.start.y;
  const length = Math.hypot(dx, dy);
  const nx = (-dy / length) * (width / 2);
  const ny = (dx / length) * (width / 2);
  return [
    { x: slot.start.x + nx, y: slot.start.y + ny },
    { x: slot.end.x + nx, y: slot.end.y + ny },
    { x: slot.end.x - nx, y: slot.end.y - ny },
    { x: slot.start.x - nx, y: slot.start.y - ny },
  ];
}
