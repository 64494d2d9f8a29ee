import type { Layout, Point, Segment } from '~/lib/geometry/layout';

/** Size of the drawing in CSS pixels; the board is scaled to fit and centred. */
export const THUMBNAIL_SIZE = { width: 240, height: 48 } as const;

const PADDING = 0.04;

/**
 * A small SVG of a computed layout for the Boards list: board outline, nut, fret lines and the
 * outer strings. Not to scale with anything outside itself (it is a picture, not a template):
 * the viewBox is the board's bounding box in its own units, with y flipped for display.
 */
export function boardThumbnailSvg(layout: Layout): string {
  const points = layout.outline;
  const xs = points.map((p) => p.x);
  const ys = points.map((p) => -p.y);
  const minX = Math.min(...xs);
  const minY = Math.min(...ys);
  const width = Math.max(...xs) - minX;
  const height = Math.max(...ys) - minY;
  const pad = Math.max(width, height) * PADDING;
  const viewBox = [minX - pad, minY - pad, width + 2 * pad, height + 2 * pad].map(num).join(' ');
  // Strokes scale with the board, so pick them as a fraction of its width across.
  const stroke = num(height / 60);
  const outer = [layout.strings[0], layout.strings[layout.strings.length - 1]].filter((s) => s !== undefined);
  const body = [
    `<polygon points="${points.map(pt).join(' ')}" fill="#f1eee7" stroke="#4b5259" stroke-width="${stroke}"/>`,
    line(layout.nutLine, '#1f2328', num(height / 25)),
    ...layout.frets.map((fret) => line(fret.line, '#7a3b2e', stroke)),
    ...outer.map((s) => line({ start: s.nut, end: s.saddle }, '#8a9096', stroke)),
  ];
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" width="${THUMBNAIL_SIZE.width}" height="${THUMBNAIL_SIZE.height}" ` +
    `viewBox="${viewBox}" preserveAspectRatio="xMidYMid meet" role="img">${body.join('')}</svg>`
  );
}

function num(value: number): string {
  return String(Math.round(value * 1000) / 1000);
}

function pt(p: Point): string {
  return `${num(p.x)},${num(-p.y)}`;
}

function line(segment: Segment, colour: string, width: string): string {
  const { start, end } = segment;
  return `<line x1="${num(start.x)}" y1="${num(-start.y)}" x2="${num(end.x)}" y2="${num(-end.y)}" stroke="${colour}" stroke-width="${width}"/>`;
}
