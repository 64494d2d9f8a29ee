/**
 * The drawing's view: how board coordinates (design units, +y toward the bass side) map to screen
 * pixels (+y down). Board y is flipped for display only, so the bass side is drawn at the top.
 * Pure maths, shared by the drawing, its navigation and the unit tests.
 */
import { MM_PER_INCH, type LengthUnit } from '~/lib/format/units.ts';
import type { Box } from '~/lib/picture/board-picture.ts';

/** The one bounding box, shared with every other surface. */
export { boundsOf } from '~/lib/picture/board-picture.ts';

export interface View {
  /** Screen pixels per board unit (mm or in). */
  zoom: number;
  /** Screen position (CSS px, from the stage's top left) of the board origin. */
  originX: number;
  originY: number;
}

export interface ScreenPoint {
  x: number;
  y: number;
}

export type BoardBounds = Box;

/** Zoom limits in screen pixels per millimetre, whatever the design's units. */
export const ZOOM_LIMITS_PX_PER_MM = { min: 0.05, max: 400 } as const;

/** CSS reference pixels per millimetre (CSS Values and Units: 1in = 96px, 1in = 25.4mm). */
export const CSS_PX_PER_MM = 96 / MM_PER_INCH;

export function boardToScreen(view: View, x: number, y: number): ScreenPoint {
  return { x: view.originX + x * view.zoom, y: view.originY - y * view.zoom };
}

export function screenToBoard(view: View, screen: ScreenPoint): { x: number; y: number } {
  return { x: (screen.x - view.originX) / view.zoom, y: (view.originY - screen.y) / view.zoom };
}

/** Keeps a zoom inside the limits, which are given per mm and converted for designs in inches. */
export function clampZoom(zoom: number, units: LengthUnit): number {
  const perMm = units === 'in' ? MM_PER_INCH : 1;
  return Math.min(ZOOM_LIMITS_PX_PER_MM.max * perMm, Math.max(ZOOM_LIMITS_PX_PER_MM.min * perMm, zoom));
}

/**
 * Sets a new zoom so that the board point under `anchor` (a screen point, e.g. the pointer)
 * stays under it.
 */
export function zoomAt(view: View, zoom: number, anchor: ScreenPoint): View {
  const board = screenToBoard(view, anchor);
  return { zoom, originX: anchor.x - board.x * zoom, originY: anchor.y + board.y * zoom };
}

/** Zoom by a factor (> 1 zooms in) around a screen point, within the zoom limits. */
export function zoomBy(view: View, factor: number, anchor: ScreenPoint, units: LengthUnit): View {
  return zoomAt(view, clampZoom(view.zoom * factor, units), anchor);
}

export function panBy(view: View, dx: number, dy: number): View {
  return { ...view, originX: view.originX + dx, originY: view.originY + dy };
}

/**
 * The view that shows `bounds` as large as possible, centred, inside a `width` x `height` stage
 * with `marginPx` left free on every side.
 */
export function fitView(
  bounds: BoardBounds,
  width: number,
  height: number,
  marginPx: number,
  units: LengthUnit,
): View {
  const spanX = Math.max(bounds.maxX - bounds.minX, Number.MIN_VALUE);
  const spanY = Math.max(bounds.maxY - bounds.minY, Number.MIN_VALUE);
  const usableWidth = Math.max(width - 2 * marginPx, 1);
  const usableHeight = Math.max(height - 2 * marginPx, 1);
  const zoom = clampZoom(Math.min(usableWidth / spanX, usableHeight / spanY), units);
  return centredView(bounds, width, height, zoom);
}

/** The view at a given zoom with the centre of `bounds` in the middle of the stage. */
export function centredView(bounds: BoardBounds, width: number, height: number, zoom: number): View {
  const centreX = (bounds.minX + bounds.maxX) / 2;
  const centreY = (bounds.minY + bounds.maxY) / 2;
  return { zoom, originX: width / 2 - centreX * zoom, originY: height / 2 + centreY * zoom };
}

/**
 * The zoom at which one board unit is drawn at its real size on this screen.
 * @param screenPxPerMm CSS pixels per real millimetre, from the user's screen calibration
 */
export function oneToOneZoom(screenPxPerMm: number, units: LengthUnit): number {
  return units === 'in' ? screenPxPerMm * MM_PER_INCH : screenPxPerMm;
}
