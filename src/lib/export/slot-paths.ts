/**
 * Slot paths for CNC: the layout's lines sorted onto named layers, in the design's units, moved
 * to the chosen origin. Pure data; dxf.server.ts and svg.ts write it out, so both files carry the
 * same layers and the same numbers.
 */
import type { LengthUnit } from '~/lib/format/units.ts';
import type { Layout, Point, Segment } from '~/lib/geometry/layout.ts';
import { boardPicture, boundsOf, partsOn, type Box, type LineRole, type PictureLayer } from '~/lib/picture/board-picture.ts';
import type { ExportOptions } from '~/lib/schemas/export-options.ts';
import { kerfOutline } from './kerf-outline.ts';

/** Layer names, plain words a CAM program shows as they are. */
export const SLOT_PATH_LAYERS = ['outline', 'slots', 'centre-line', 'nut', 'saddle', 'markers'] as const;
export type SlotPathLayer = (typeof SLOT_PATH_LAYERS)[number];

export interface LayerPaths {
  /** Open straight lines. */
  lines: Segment[];
  /** Closed outlines (the last point joins the first). */
  closed: Point[][];
  /** Dots at their real diameter (face dots and side dots, on the markers layer). */
  circles: { centre: Point; diameter: number }[];
}

export interface SlotPaths {
  name: string;
  units: LengthUnit;
  scaleAlong: Layout['scaleAlong'];
  /** What was added to board coordinates to reach these (zero for the nut-centre origin). */
  offset: Point;
  layers: Record<SlotPathLayer, LayerPaths>;
}

/**
 * Sorts a layout onto layers. Slots are single lines along each fret's slot (stopped short of the
 * edges when the design says so), or closed outlines of the slot width around them.
 * Origin `nut-centre` keeps board coordinates; `lower-left` moves the board outline's lowest x and
 * lowest y to 0.
 */
export function slotPaths(layout: Layout, options: Pick<ExportOptions, 'slots' | 'origin'>): SlotPaths {
  const board = boundsOf(layout.outline);
  const offset = options.origin === 'lower-left' ? { x: -board.minX, y: -board.minY } : { x: 0, y: 0 };
  const move = (p: Point): Point => ({ x: p.x + offset.x, y: p.y + offset.y });
  const moveSegment = (s: Segment): Segment => ({ start: move(s.start), end: move(s.end) });

  const picture = boardPicture(layout);
  const drawn = (layer: PictureLayer, role: LineRole) =>
    partsOn(picture, layer, 'line')
      .filter((part) => part.role === role)
      .map((part) => moveSegment(part.segment));
  const slots = drawn('slots', 'slot');
  const dots = [...partsOn(picture, 'face-dots', 'circle'), ...partsOn(picture, 'side-dots', 'circle')];

  const empty = (): LayerPaths => ({ lines: [], closed: [], circles: [] });
  const layers: Record<SlotPathLayer, LayerPaths> = {
    outline: { ...empty(), closed: partsOn(picture, 'outline', 'polygon').map((part) => part.points.map(move)) },
    slots: options.slots === 'outlines' ? { ...empty(), closed: slots.map((slot) => kerfOutline(slot, layout.slotWidth)) } : { ...empty(), lines: slots },
    'centre-line': { ...empty(), lines: drawn('centre-line', 'centre-line') },
    nut: { ...empty(), lines: drawn('nut', 'nut') },
    saddle: { ...empty(), lines: drawn('saddle', 'saddle') },
    markers: { ...empty(), circles: dots.map((dot) => ({ centre: move(dot.centre), diameter: dot.diameter })) },
  };
  return { name: layout.name, units: layout.units, scaleAlong: layout.scaleAlong, offset, layers };
}

/** The extent of every path on every layer (a dot's whole circle). */
export function slotPathBounds(paths: SlotPaths): Box {
  return boundsOf(
    SLOT_PATH_LAYERS.flatMap((layer) => [
      ...paths.layers[layer].lines.flatMap((s) => [s.start, s.end]),
      ...paths.layers[layer].closed.flat(),
      ...paths.layers[layer].circles.flatMap(({ centre, diameter }) => [
        { x: centre.x - diameter / 2, y: centre.y - diameter / 2 },
        { x: centre.x + diameter / 2, y: centre.y + diameter / 2 },
      ]),
    ]),
  );
}
