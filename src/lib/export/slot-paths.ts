/**
 * Slot paths for CNC: the layout's lines sorted onto named layers, in the design's units, moved
 * to the chosen origin. Pure data; dxf.server.ts and svg.ts write it out, so both files carry the
 * same layers and the same numbers.
 */
import { fromMm, type LengthUnit } from '~/lib/format/units';
import type { Layout, Point, Segment } from '~/lib/geometry/layout';
import type { ExportOptions } from '~/lib/schemas/export-options';
import { kerfOutline } from './kerf-outline';

/** Layer names, plain words a CAM program shows as they are. */
export const SLOT_PATH_LAYERS = ['outline', 'slots', 'centre-line', 'nut', 'saddle', 'markers'] as const;
export type SlotPathLayer = (typeof SLOT_PATH_LAYERS)[number];

export interface LayerPaths {
  /** Open straight lines. */
  lines: Segment[];
  /** Closed outlines (the last point joins the first). */
  closed: Point[][];
}

export interface SlotPaths {
  name: string;
  units: LengthUnit;
  scaleAlong: Layout['scaleAlong'];
  /** What was added to board coordinates to reach these (zero for the nut-centre origin). */
  offset: Point;
  layers: Record<SlotPathLayer, LayerPaths>;
}

/** Half the arm of the cross that marks each face dot and side dot centre: 1.5 mm. */
const MARKER_ARM_MM = 1.5;

/**
 * Sorts a layout onto layers. Slots are single lines along each fret's slot (stopped short of the
 * edges when the design says so), or closed outlines of the slot width around them.
 * Origin `nut-centre` keeps board coordinates; `lower-left` moves the board outline's lowest x and
 * lowest y to 0.
 */
export function slotPaths(layout: Layout, options: Pick<ExportOptions, 'slots' | 'origin'>): SlotPaths {
  const offset =
    options.origin === 'lower-left'
      ? {
          x: -Math.min(...layout.outline.map((p) => p.x)),
          y: -Math.min(...layout.outline.map((p) => p.y)),
        }
      : { x: 0, y: 0 };
  const move = (p: Point): Point => ({ x: p.x + offset.x, y: p.y + offset.y });
  const moveSegment = (s: Segment): Segment => ({ start: move(s.start), end: move(s.end) });

  const slots = layout.frets.map((fret) => fret.slot);
  if (layout.zeroFret) slots.unshift(layout.zeroFret.slot);
  const arm = fromMm(MARKER_ARM_MM, layout.units);
  const crosses = layout.markers
    .flatMap((marker) => [...marker.dots, marker.side])
    .flatMap((c) => [
      { start: { x: c.x - arm, y: c.y }, end: { x: c.x + arm, y: c.y } },
      { start: { x: c.x, y: c.y - arm }, end: { x: c.x, y: c.y + arm } },
    ]);

  const empty = (): LayerPaths => ({ lines: [], closed: [] });
  const layers: Record<SlotPathLayer, LayerPaths> = {
    outline: { lines: [], closed: [layout.outline.map(move)] },
    slots:
      options.slots === 'outlines'
        ? { lines: [], closed: slots.map((slot) => kerfOutline(moveSegment(slot), layout.slotWidth)) }
        : { lines: slots.map(moveSegment), closed: [] },
    'centre-line': { ...empty(), lines: [moveSegment(layout.centreLine)] },
    nut: { ...empty(), lines: [moveSegment(layout.nutLine)] },
    saddle: { ...empty(), lines: [moveSegment(layout.saddleLine)] },
    markers: { ...empty(), lines: crosses.map(moveSegment) },
  };
  return { name: layout.name, units: layout.units, scaleAlong: layout.scaleAlong, offset, layers };
}

/** The extent of every path on every layer. */
export function slotPathBounds(paths: SlotPaths): { minX: number; minY: number; maxX: number; maxY: number } {
  const points = SLOT_PATH_LAYERS.flatMap((layer) => [
    ...paths.layers[layer].lines.flatMap((s) => [s.start, s.end]),
    ...paths.layers[layer].closed.flat(),
  ]);
  return {
    minX: Math.min(...points.map((p) => p.x)),
    minY: Math.min(...points.map((p) => p.y)),
    maxX: Math.max(...points.map((p) => p.x)),
    maxY: Math.max(...points.map((p) => p.y)),
  };
}
