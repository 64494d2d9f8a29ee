/**
 * The Export panel's toolpath preview as plain drawing data: the board outline (from the picture
 * model) and the plan's moves in machine XY, rapids and plunges apart from cuts, each cut coloured
 * by its depth on a ramp from the shallowest (light) to the deepest (dark). Pure and quick, so the
 * panel redraws it on every change (npm run bench measures it).
 */
import type { Layout, Point } from '~/lib/geometry/layout.ts';
import { boardPicture, partsOn } from '~/lib/picture/board-picture.ts';
import { runTime, type ToolpathPlan } from './gcode-plan.ts';

export interface PreviewPath {
  kind: 'cut' | 'rapid';
  /** SVG path data in machine XY (the caller flips y for display). */
  d: string;
  /** Cuts only: 0 = the shallowest cut, 1 = the deepest. */
  depth: number;
}

export interface ToolpathPreview {
  outline: Point[];
  paths: PreviewPath[];
  bounds: { minX: number; minY: number; maxX: number; maxY: number };
  /** Deepest and shallowest cutting Z, machine units. */
  zRange: { min: number; max: number };
  minutes: ReturnType<typeof runTime>;
  moves: number;
}

/** Shades of the depth ramp. */
const DEPTH_STEPS = 8;

/** Screen precision: 0.01 of the design's unit is far below a pixel of the preview. */
const short = (value: number) => Math.round(value * 100) / 100;

/** Depth ramp: light wood to dark rosewood (the palette's rosewood at 1). */
export function depthColour(depth: number): string {
  const mix = (from: number, to: number) => Math.round(from + (to - from) * depth);
  return `rgb(${mix(232, 122)},${mix(190, 59)},${mix(120, 46)})`;
}

export function toolpathPreview(plan: ToolpathPlan, layout: Layout): ToolpathPreview {
  const outline = partsOn(boardPicture(layout), 'outline', 'polygon')[0]?.points.map((p) => ({ x: p.x + plan.offset.x, y: p.y + plan.offset.y })) ?? [];
  const cuts = plan.moves.filter((m) => m.kind === 'cut');
  const zMin = Math.min(...cuts.map((m) => m.to.z));
  const zMax = Math.max(...cuts.map((m) => m.to.z));
  const span = zMax - zMin || 1;
  // Cuts are grouped into DEPTH_STEPS paths by depth, so the panel draws a few elements, not thousands.
  const cutPaths = Array.from({ length: DEPTH_STEPS }, () => '');
  let from = plan.start;
  let rapid = '';
  for (const move of plan.moves) {
    const segment = `M${short(from.x)} ${short(from.y)}L${short(move.to.x)} ${short(move.to.y)}`;
    if (move.kind === 'cut') {
      const step = Math.min(DEPTH_STEPS - 1, Math.floor(((zMax - (from.z + move.to.z) / 2) / span) * DEPTH_STEPS));
      cutPaths[step] += segment;
    } else if (move.to.x !== from.x || move.to.y !== from.y) rapid += segment;
    from = move.to;
  }
  const paths: PreviewPath[] = [
    { kind: 'rapid', d: rapid, depth: 0 },
    ...cutPaths.flatMap((d, step) => (d === '' ? [] : [{ kind: 'cut' as const, d, depth: step / (DEPTH_STEPS - 1) }])),
  ];
  const xs = outline.map((p) => p.x);
  const ys = outline.map((p) => p.y);
  return {
    outline,
    paths,
    bounds: { minX: Math.min(...xs), minY: Math.min(...ys), maxX: Math.max(...xs), maxY: Math.max(...ys) },
    zRange: { min: zMin, max: zMax },
    minutes: runTime(plan),
    moves: plan.moves.length,
  };
}
