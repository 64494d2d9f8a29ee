import type { Layout, Point, Segment } from '~/lib/geometry/layout.ts';
import { boardPicture, boundsOf, partsOn, type PictureLayer } from '~/lib/picture/board-picture.ts';

/** Size of the drawing in CSS pixels; the board is scaled to fit and centred. */
export const THUMBNAIL_SIZE = { width: 240, height: 48 } as const;

const PADDING = 0.04;

/**
 * A small SVG of a computed layout for the Boards list: the board picture up to the board end
 * (outline, dots, centre line, frets with the zero fret, nut and the outer strings), each layer
 * a group named by `data-layer`. Not to scale with anything outside itself (it is a picture, not
 * a template): the viewBox is the board's bounding box in its own units, with y flipped for display.
 */
export function boardThumbnailSvg(layout: Layout): string {
  const picture = boardPicture(layout, { to: 'board-end' });
  const box = boundsOf(layout.outline);
  const width = box.maxX - box.minX;
  const height = box.maxY - box.minY;
  const pad = Math.max(width, height) * PADDING;
  const viewBox = [box.minX - pad, -box.maxY - pad, width + 2 * pad, height + 2 * pad].map(num).join(' ');
  // Strokes scale with the board, so pick them as a fraction of its width across.
  const stroke = num(height / 60);
  const outerStrings = new Set([1, layout.strings.length]);
  const lines = (layer: PictureLayer, colour: string, width: string, keep: (string?: number) => boolean = () => true) =>
    group(
      layer,
      partsOn(picture, layer, 'line')
        .filter((part) => !part.role.endsWith('-uncompensated') && keep(part.string))
        .map((part) => line(part.segment, colour, width)),
    );
  const dots = (layer: PictureLayer) =>
    group(layer, partsOn(picture, layer, 'circle').map((dot) => `<circle cx="${num(dot.centre.x)}" cy="${num(-dot.centre.y)}" r="${num(dot.diameter / 2)}" fill="#8a9096"/>`));
  const body = [
    group('outline', partsOn(picture, 'outline', 'polygon').map((part) => `<polygon points="${part.points.map(pt).join(' ')}" fill="#f1eee7" stroke="#4b5259" stroke-width="${stroke}"/>`)),
    dots('face-dots'),
    dots('side-dots'),
    lines('centre-line', '#8a9096', stroke),
    lines('nut', '#1f2328', num(height / 25)),
    lines('frets', '#7a3b2e', stroke),
    lines('strings', '#8a9096', stroke, (string) => string !== undefined && outerStrings.has(string)),
  ];
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" width="${THUMBNAIL_SIZE.width}" height="${THUMBNAIL_SIZE.height}" ` +
    `viewBox="${viewBox}" preserveAspectRatio="xMidYMid meet" role="img">${body.join('')}</svg>`
  );
}

function group(layer: PictureLayer, elements: string[]): string {
  return `<g data-layer="${layer}">${elements.join('')}</g>`;
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
