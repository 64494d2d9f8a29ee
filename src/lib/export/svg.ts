/**
 * Slot paths as SVG with real-world size: `width`/`height` carry the design's unit and the viewBox
 * uses the same numbers, so one user unit is one mm (or one inch). Coordinates are the slot paths'
 * own, unrounded; only y is negated because SVG's y runs down the screen. Each layer is a group
 * whose id is the layer name.
 */
import { capitalised, scaleConventionWords } from '~/lib/format/design-specs.ts';
import { fromMm } from '~/lib/format/units.ts';
import type { Point } from '~/lib/geometry/layout.ts';
import { machineCaution } from './safety-note.ts';
import { SLOT_PATH_LAYERS, slotPathBounds, type SlotPaths } from './slot-paths.ts';

/** Hairline width: 0.1 mm. */
const STROKE_MM = 0.1;

/** `provenance` (provenanceLine) goes into the file's <metadata>. */
export function slotPathsSvg(paths: SlotPaths, provenance?: string): string {
  const box = slotPathBounds(paths);
  const width = box.maxX - box.minX;
  const height = box.maxY - box.minY;
  const point = (p: Point) => `${num(p.x)} ${num(-p.y)}`;
  const groups = SLOT_PATH_LAYERS.map((layer) => {
    const { lines, closed, circles } = paths.layers[layer];
    const elements = [
      ...lines.map(
        (s) => `<line x1="${num(s.start.x)}" y1="${num(-s.start.y)}" x2="${num(s.end.x)}" y2="${num(-s.end.y)}"/>`,
      ),
      ...closed.map((points) => `<path d="M ${points.map(point).join(' L ')} Z"/>`),
      ...circles.map(({ centre, diameter }) => `<circle cx="${num(centre.x)}" cy="${num(-centre.y)}" r="${num(diameter / 2)}"/>`),
    ];
    return `<g id="${layer}">\n${elements.map((e) => `  ${e}`).join('\n')}\n</g>`;
  });
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<!-- ${escapeComment(`${capitalised(scaleConventionWords(paths.scaleAlong))}.`)} -->`,
    `<!-- ${escapeComment(machineCaution(paths.units, 'slot paths'))} -->`,
    `<svg xmlns="http://www.w3.org/2000/svg" width="${num(width)}${paths.units}" height="${num(height)}${paths.units}" ` +
      `viewBox="${num(box.minX)} ${num(-box.maxY)} ${num(width)} ${num(height)}" ` +
      `fill="none" stroke="#000" stroke-width="${num(fromMm(STROKE_MM, paths.units))}" stroke-linecap="round">`,
    `<title>${escapeText(paths.name)}</title>`,
    ...(provenance ? [`<metadata>${escapeText(provenance)}</metadata>`] : []),
    ...groups,
    '</svg>',
    '',
  ].join('\n');
}

/** Shortest round-trip form: the reader gets the exact double back. */
function num(value: number): string {
  return String(Object.is(value, -0) ? 0 : value);
}

function escapeText(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}

/** "--" may not appear inside an XML comment. */
function escapeComment(text: string): string {
  return text.replace(/-{2,}/g, '-');
}
