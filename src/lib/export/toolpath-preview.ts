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
  const paths: PreviewPath[] = [];
  let from = plan.start;
  let rapid = '';
  for (const move of plan.moves) {
    const segment = `M${from.x} ${from.y}L${move.to.x} ${move.to.y}`;
    if (move.kind === 'cut') paths.push({ kind: 'cut', d: segment, depth: (zMax - (from.z + move.to.z) / 2) / span });
    else if (move.to.x !== from.x || move.to.y !== from.y) rapid += segment;
    from = move.to;
  }
  paths.unshift({ kind: 'rapid', d: rapid, depth: 0 });
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
