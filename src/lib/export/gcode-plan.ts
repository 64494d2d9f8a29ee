/**
 * The slot toolpath as plain moves, before any G-code is written: the G-code writer (gcode.ts),
 * the Export panel's preview and the run-time estimate all read this one plan.
 *
 * XY are the slot paths' coordinates (slot-paths.ts: the same origin and axes as the DXF). Z = 0
 * is the crown (the board top on the centre line) or, with `zZero: 'edge-at-nut'`, the top at the
 * nut on the treble edge. Each slot is cut along its centre line (or, for a cutter narrower than
 * the slot, along evenly spaced offset lines that cover its width) in passes no deeper than the
 * pass depth, the cutting Z following z(x, y) − depth within the chord tolerance. Beyond the
 * board edges (a through slot's overrun) Z holds the value at the edge.
 */
import { boardSurface, surfaceZ, type BoardSurface } from '~/lib/geometry/board-radius.ts';
import type { Layout, Point, Segment } from '~/lib/geometry/layout.ts';
import { fretsWithZero } from '~/lib/picture/board-picture.ts';
import type { Design } from '~/lib/schemas/design.ts';
import type { GcodeSettings, SettingIssue } from './gcode-settings.ts';
import { slotPaths } from './slot-paths.ts';

export interface Point3 {
  x: number;
  y: number;
  z: number;
}

export type MoveKind = 'rapid' | 'plunge' | 'cut' | 'retract';

/** One straight move to `to`, in machine coordinates; `fret` is the slot it belongs to (0 = zero fret). */
export interface ToolMove {
  kind: MoveKind;
  to: Point3;
  fret: number;
}

export interface ToolpathPlan {
  settings: GcodeSettings;
  /** What was added to board XY (the slot paths' origin offset). */
  offset: Point;
  /** What was added to surface heights to reach machine Z (before the dry run's lift). */
  zShift: number;
  /** Where the tool starts: over the origin at safe Z. */
  start: Point3;
  moves: ToolMove[];
  /** Per slot: fret number, depth passes and offset lines cut. */
  slots: { fret: number; passes: number; lines: number }[];
}

export type PlanResult = { ok: true; plan: ToolpathPlan } | { ok: false; issues: SettingIssue[] };

/** Longest subdivision of one slot line (2^20 pieces): a guard, never reached by a valid board. */
const MAX_SPLIT_DEPTH = 20;

/** The surface of a design's board. */
export function designSurface(design: Design, layout: Layout): BoardSurface {
  return boardSurface(design.radius, layout.frets[layout.frets.length - 1]!.line);
}

/** Depth of each pass, shallowest first, the last exactly `depth`. */
export function passDepths(depth: number, passDepth: number): number[] {
  const count = Math.max(1, Math.ceil(depth / passDepth - 1e-9));
  return Array.from({ length: count }, (_, i) => (i === count - 1 ? depth : (depth * (i + 1)) / count));
}

/** Offsets across the slot of each line the cutter follows: one (0) when it is as wide as the slot. */
export function lineOffsets(slotWidth: number, toolDiameter: number): number[] {
  const spare = slotWidth - toolDiameter;
  if (spare <= 1e-12) return [0];
  // Step over at most half the cutter's diameter (common practice).
  const steps = Math.ceil(spare / (toolDiameter / 2));
  return Array.from({ length: steps + 1 }, (_, i) => -spare / 2 + (spare * i) / steps);
}

/** Plans the toolpath of every slot (zero fret first), nut end to board end. */
export function planToolpath(design: Design, layout: Layout, settings: GcodeSettings): PlanResult {
  const surface = designSurface(design, layout);
  const zShift = settings.zZero === 'crown' ? 0 : -surfaceZ(surface, layout.nutLine.start);
  if (settings.safeZ <= zShift) {
    return { ok: false, issues: [{ path: 'safeZ', message: `must be above the board top (Z ${zShift.toFixed(4)} ${settings.units} on the crown with this Z zero)` }] };
  }
  const offset = slotPaths(layout, { slots: 'lines', origin: settings.origin }).offset;
  const lift = settings.dryRun;
  const safe = settings.safeZ + lift;
  const depths = passDepths(settings.depth, settings.passDepth);
  const offsets = lineOffsets(settings.slotWidth, settings.toolDiameter);
  const moves: ToolMove[] = [];
  const slots: ToolpathPlan['slots'] = [];
  for (const fret of fretsWithZero(layout)) {
    for (const across of offsets) {
      const path = slotLine(surface, fret.slot, fret.line, across, settings.chordTolerance);
      const last = path.length - 1;
      depths.forEach((depth, pass) => {
        // Odd passes run back the way the last one came.
        const at = (i: number): Point3 => {
          const p = path[pass % 2 === 0 ? i : last - i]!;
          return { x: p.x + offset.x, y: p.y + offset.y, z: p.top + zShift - depth + lift };
        };
        const first = at(0);
        if (pass === 0) moves.push({ kind: 'rapid', to: { x: first.x, y: first.y, z: safe }, fret: fret.number });
        moves.push({ kind: 'plunge', to: first, fret: fret.number });
        for (let i = 1; i <= last; i++) moves.push({ kind: 'cut', to: at(i), fret: fret.number });
      });
      const end = moves[moves.length - 1]!.to;
      moves.push({ kind: 'retract', to: { x: end.x, y: end.y, z: safe }, fret: fret.number });
    }
    slots.push({ fret: fret.number, passes: depths.length, lines: offsets.length });
  }
  return { ok: true, plan: { settings, offset, zShift, start: { x: offset.x, y: offset.y, z: safe }, moves, slots } };
}

interface SlotPoint extends Point {
  /** Surface height above the point, held at the edge value beyond the board. */
  top: number;
}

/**
 * The points of one slot line (the slot moved `across` square to itself), with the surface
 * height over each, subdivided until straight pieces stay within `tolerance` of the curve.
 */
function slotLine(surface: BoardSurface, slot: Segment, edgeToEdge: Segment, across: number, tolerance: number): SlotPoint[] {
  const dx = slot.end.x - slot.start.x;
  const dy = slot.end.y - slot.start.y;
  const length = Math.hypot(dx, dy);
  const normal = { x: -dy / length, y: dx / length };
  const at = (t: number): Point => ({ x: slot.start.x + dx * t + normal.x * across, y: slot.start.y + dy * t + normal.y * across });
  // Where along the slot the board edges lie (u = 0 and 1 on the edge-to-edge line).
  const ex = edgeToEdge.end.x - edgeToEdge.start.x;
  const ey = edgeToEdge.end.y - edgeToEdge.start.y;
  const span = ex * ex + ey * ey;
  const edgeParameter = (t: number) => ((slot.start.x + dx * t - edgeToEdge.start.x) * ex + (slot.start.y + dy * t - edgeToEdge.start.y) * ey) / span;
  const top = (t: number): number => {
    const u = Math.min(1, Math.max(0, edgeParameter(t)));
    return surfaceZ(surface, { x: edgeToEdge.start.x + ex * u + normal.x * across, y: edgeToEdge.start.y + ey * u + normal.y * across });
  };
  const u0 = edgeParameter(0);
  const u1 = edgeParameter(1);
  const breaks = [0, 1];
  for (const u of [0, 1]) {
    const t = (u - u0) / (u1 - u0);
    if (t > 1e-12 && t < 1 - 1e-12) breaks.push(t);
  }
  breaks.sort((a, b) => a - b);
  const ts: number[] = [0];
  const tops: number[] = [top(0)];
  for (let i = 1; i < breaks.length; i++) {
    const a = breaks[i - 1]!;
    const b = breaks[i]!;
    split(top, a, b, tops[tops.length - 1]!, top((a + b) / 2), top(b), tolerance, 0, ts, tops);
  }
  return ts.map((t, i) => {
    const p = at(t);
    return { x: p.x, y: p.y, top: tops[i]! };
  });
}

/**
 * Appends the inner points of [a, b] and b to `out` (their z to `zs`), splitting where the chord
 * leaves the curve by more than `tolerance` at a quarter, the middle or three quarters. `za`,
 * `zm`, `zb` are z at a, the middle and b, so each split evaluates z only at the two new quarters.
 */
function split(z: (t: number) => number, a: number, b: number, za: number, zm: number, zb: number, tolerance: number, depth: number, out: number[], zs: number[]): void {
  const q1 = a + (b - a) * 0.25;
  const q3 = a + (b - a) * 0.75;
  const z1 = z(q1);
  const z3 = z(q3);
  const off = Math.max(Math.abs(z1 - (za * 0.75 + zb * 0.25)), Math.abs(zm - (za + zb) / 2), Math.abs(z3 - (za * 0.25 + zb * 0.75)));
  if (depth < MAX_SPLIT_DEPTH && off > tolerance) {
    const mid = (a + b) / 2;
    split(z, a, mid, za, z1, zm, tolerance, depth + 1, out, zs);
    split(z, mid, b, zm, z3, zb, tolerance, depth + 1, out, zs);
    return;
  }
  out.push(b);
  zs.push(zb);
}

/** Run time from the plan's lengths and feeds, minutes (acceleration ignored: a lower bound). */
export function runTime(plan: ToolpathPlan): { cutting: number; plunging: number; rapid: number; total: number } {
  const { feed, plungeFeed, rapidRate } = plan.settings;
  let from = plan.start;
  const lengths = { cut: 0, plunge: 0, rapid: 0 };
  for (const move of plan.moves) {
    const length = Math.hypot(move.to.x - from.x, move.to.y - from.y, move.to.z - from.z);
    if (move.kind === 'cut') lengths.cut += length;
    else if (move.kind === 'plunge') lengths.plunge += length;
    else lengths.rapid += length;
    from = move.to;
  }
  const cutting = lengths.cut / feed;
  const plunging = lengths.plunge / plungeFeed;
  const rapid = lengths.rapid / rapidRate;
  return { cutting, plunging, rapid, total: cutting + plunging + rapid };
}
