/**
 * The radiused top of the board: a cylinder (one radius) or a cone (compound radius, the radius
 * changing linearly along the board). Board coordinates (+x from the nut toward the bridge along
 * the centre line, +y toward the bass side), lengths in the design's units. The surface only adds
 * Z: it never moves a fret, a slot or the outline in x or y.
 *
 * z(x, y) = sqrt(R(x)² − y²) − R(x): 0 on the crown (the centre line), below 0 elsewhere.
 * R(x) = nut + (end − nut) · x / lastFretX, extrapolated past the nut and the last fret.
 */
import { distance, intersectLines, type Point, type Segment } from './plane.ts';

/** A board's top, as data: `null` radii mean a flat board. */
export interface BoardSurface {
  /** Radius at the nut (x = 0) and at the last fret, on the centre line; null = flat. */
  radius: { nut: number; end: number; lastFretX: number } | null;
}

export interface RadiusInput {
  /** Radius at the nut; 0 = a flat board. */
  nut: number;
  /** Radius at the last fret; 0 = the same as at the nut (a cylinder). */
  end: number;
}

/** The surface of a design's board; `lastFret` is the last fret line (its x on the centre line fixes R there). */
export function boardSurface(radius: RadiusInput, lastFret: Segment): BoardSurface {
  if (radius.nut === 0) return { radius: null };
  const lastFretX = intersectLines(lastFret.start, lastFret.end, { x: 0, y: 0 }, { x: 1, y: 0 }).x;
  return { radius: { nut: radius.nut, end: radius.end === 0 ? radius.nut : radius.end, lastFretX } };
}

/** R(x), the radius square to the centre line at `x`; Infinity for a flat board. */
export function radiusAt(surface: BoardSurface, x: number): number {
  const r = surface.radius;
  if (!r) return Number.POSITIVE_INFINITY;
  return r.nut + ((r.end - r.nut) * x) / r.lastFretX;
}

/** Height of the top at (x, y) below the crown (≤ 0); NaN where |y| > R(x). */
export function surfaceZ(surface: BoardSurface, p: Point): number {
  const radius = radiusAt(surface, p.x);
  if (radius === Number.POSITIVE_INFINITY) return 0;
  // y² / (R + sqrt(R² − y²)) is the same value without the cancellation of sqrt(R² − y²) − R.
  const y2 = p.y * p.y;
  return -y2 / (radius + Math.sqrt(radius * radius - y2));
}

/** dz/dt along p(t) = a + t (b − a), by the chain rule (∂z/∂x = R'(R/s − 1), ∂z/∂y = −y/s). */
function slopeAlong(surface: BoardSurface, p: Point, dx: number, dy: number): number {
  const r = surface.radius;
  if (!r) return 0;
  const radius = radiusAt(surface, p.x);
  const s = Math.sqrt(radius * radius - p.y * p.y);
  const dRdx = (r.end - r.nut) / r.lastFretX;
  return dRdx * (radius / s - 1) * dx - (p.y / s) * dy;
}

/** 5-point Gauss-Legendre nodes and weights on [−1, 1] (Abramowitz and Stegun, table 25.4). */
const GAUSS_NODES = [0, -0.5384693101056831, 0.5384693101056831, -0.906179845938664, 0.906179845938664];
const GAUSS_WEIGHTS = [0.5688888888888889, 0.4786286704993665, 0.4786286704993665, 0.2369268850561891, 0.2369268850561891];
const ARC_PANELS = 64;

/**
 * Length of the surface curve above the segment a→b (the curve a fret wire follows), in the
 * design's units. A flat board gives the segment's own length. Gauss-Legendre never evaluates
 * the end points, so a segment ending where the tangent is vertical (|y| = R) still integrates.
 */
export function arcLengthOver(surface: BoardSurface, a: Point, b: Point): number {
  const flat = distance(a, b);
  if (!surface.radius || flat === 0) return flat;
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  let sum = 0;
  for (let panel = 0; panel < ARC_PANELS; panel++) {
    for (let k = 0; k < GAUSS_NODES.length; k++) {
      const t = (panel + (GAUSS_NODES[k]! + 1) / 2) / ARC_PANELS;
      const dz = slopeAlong(surface, { x: a.x + dx * t, y: a.y + dy * t }, dx, dy);
      sum += GAUSS_WEIGHTS[k]! * Math.sqrt(flat * flat + dz * dz);
    }
  }
  return sum / (2 * ARC_PANELS);
}

/**
 * Where the radius is too small for the board: the first corner (nut or end) at which
 * R(x) < |y|, with the radius the board needs there, or null when every corner is under the
 * curve. Radius and half-width both change linearly along each edge, so the corners decide.
 */
export function radiusTooSmall(surface: BoardSurface, outline: readonly Point[]): { corner: Point; radius: number; needed: number } | null {
  for (const corner of outline) {
    const radius = radiusAt(surface, corner.x);
    if (radius < Math.abs(corner.y)) return { corner, radius, needed: Math.abs(corner.y) };
  }
  return null;
}
