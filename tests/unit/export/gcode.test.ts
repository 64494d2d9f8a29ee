/**
 * The slot toolpath read back by an npm G-code reader (gcode-toolpath 3.0.0, the cncjs project's
 * interpreter), never by our own code: every cutting move lies on its fret line, its Z follows
 * the radiused top less the depth within the chord tolerance, through slots run edge to edge plus
 * the overrun, nothing cuts above the top, G20/G21 follow the design's units, and the dialects
 * differ where the controllers do (LinuxCNC's G64 and M6, GRBL's 80-character lines: from memory).
 * The board top is computed here from the issue's definition z = sqrt(R² − y²) − R, R linear in x.
 */
import DxfParser from 'dxf-parser';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { exportDesign } from '~/lib/export/export-design.server.ts';
import { exportOptionIssues } from '~/lib/export/gcode-checks.ts';
import { computeLayout, type Layout, type Point, type Segment } from '~/lib/geometry/layout.ts';
import { fretsWithZero } from '~/lib/picture/board-picture.ts';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';
import { validateExportOptions, type ExportOptions } from '~/lib/schemas/export-options.ts';
import { distanceToLine } from '../../support/expect-near.ts';

interface Vector {
  x: number;
  y: number;
  z: number;
}
interface ReadMove {
  motion: string;
  units: string;
  from: Vector;
  to: Vector;
  fret: number | null;
}
type ToolpathReader = new (options: { position?: Vector; modal?: { units: string }; addLine: (modal: { motion: string; units: string }, v1: Vector, v2: Vector) => void }) => {
  loadFromStringSync(text: string): unknown;
};
const Toolpath = createRequire(import.meta.url)('gcode-toolpath') as ToolpathReader;

/** Every straight move, with the fret of the `(fret N)` comment before it. */
function readBack(text: string): ReadMove[] {
  const moves: ReadMove[] = [];
  let position: Vector = { x: 0, y: 0, z: 0 };
  // Each chunk is read on from where the last one left off: the same position and units.
  let units = 'G21';
  for (const chunk of text.split(/^(?=\(fret )/m)) {
    const fret = /^\(fret (\d+)/.exec(chunk);
    units = /^G2[01]/m.exec(chunk)?.[0] ?? units;
    const reader = new Toolpath({
      position,
      modal: { units },
      addLine: (modal, v1, v2) => moves.push({ motion: modal.motion, units: modal.units, from: { ...v1 }, to: { ...v2 }, fret: fret ? Number(fret[1]) : null }),
    });
    reader.loadFromStringSync(chunk);
    position = moves.length > 0 ? moves[moves.length - 1]!.to : position;
  }
  return moves;
}

function design(input: Record<string, unknown>): Design {
  const result = validateDesign(input);
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.design;
}
const fan = DEMO_DESIGNS.find((d) => d.id === 'seven-string-fan')!.design;
/** The fan with through slots (1 mm overrun) on a tight compound radius. */
const throughFan = design({ ...fan, slot: { width: 0.6, depth: 3, overrun: 1, stopped: false }, radius: { nut: 184.15, end: 406.4 } });

function options(input: Record<string, unknown>): ExportOptions {
  const result = validateExportOptions({ format: 'gcode', ...input });
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.options;
}
async function gcode(of: Design, input: Record<string, unknown> = {}): Promise<string> {
  return new TextDecoder().decode((await exportDesign(of, options(input))).bytes);
}

/** The top from the issue's definition; beyond an edge (the overrun) the height at that edge. */
function topAt(layout: Layout, of: Design, p: Point, line: Segment): number {
  if (of.radius.nut === 0) return 0;
  const last = layout.frets[layout.frets.length - 1]!.line;
  const lastX = last.start.x + ((last.end.x - last.start.x) * -last.start.y) / (last.end.y - last.start.y);
  const end = of.radius.end === 0 ? of.radius.nut : of.radius.end;
  const [ex, ey] = [line.end.x - line.start.x, line.end.y - line.start.y];
  const u = Math.min(1, Math.max(0, ((p.x - line.start.x) * ex + (p.y - line.start.y) * ey) / (ex * ex + ey * ey)));
  const q = { x: line.start.x + ex * u, y: line.start.y + ey * u };
  const r = of.radius.nut + ((end - of.radius.nut) * q.x) / lastX;
  return Math.sqrt(r * r - q.y * q.y) - r;
}

const cuts = (moves: ReadMove[]) => moves.filter((m) => m.motion === 'G1' && (m.from.x !== m.to.x || m.from.y !== m.to.y));
const linesByFret = (layout: Layout) => new Map(fretsWithZero(layout).map((f) => [f.number, f]));

describe('G-code read back by gcode-toolpath', () => {
  it.each([
    ['the demo fan (stopped slots, compound radius 254 to 406.4 mm)', fan],
    ['a fan with through slots on a 184.15 to 406.4 mm cone', throughFan],
  ])('%s: every cutting XY on its fret line within 0.001 mm, every Z within the chord tolerance of z − depth, none above the top', async (_name, of) => {
    const layout = computeLayout(of);
    const frets = linesByFret(layout);
    const moves = readBack(await gcode(of));
    const cutting = cuts(moves);
    expect(cutting.length).toBeGreaterThan(layout.frets.length);
    const tolerance = 0.01; // mm, the default chord tolerance
    const rounding = 0.0001; // mm, the file's last decimal
    for (const move of cutting) {
      const fret = frets.get(move.fret!)!;
      for (const end of [move.from, move.to]) expect(distanceToLine(end, fret.line)).toBeLessThan(0.001); // mm
      for (const t of [0, 0.25, 0.5, 0.75, 1]) {
        const p = { x: move.from.x + (move.to.x - move.from.x) * t, y: move.from.y + (move.to.y - move.from.y) * t };
        const z = move.from.z + (move.to.z - move.from.z) * t;
        expect(z).toBeLessThanOrEqual(topAt(layout, of, p, fret.line) + rounding);
      }
    }
    // The deepest pass of every slot: every point of it within the chord tolerance of z − depth.
    for (const [number, fret] of frets) {
      const own = cutting.filter((m) => m.fret === number);
      const deepest = Math.min(...own.map((m) => m.to.z));
      expect(deepest).toBeLessThan(-of.slot.depth + 1e-9);
      const depthsSeen = [...new Set(own.map((m) => Math.round((m.to.z - topAt(layout, of, m.to, fret.line)) * 1e3) / 1e3))].sort((a, b) => a - b);
      expect(depthsSeen[0]).toBeCloseTo(-of.slot.depth, 3);
      for (const move of own.filter((m) => Math.abs(m.to.z - topAt(layout, of, m.to, fret.line) + of.slot.depth) < 1e-3)) {
        for (const t of [0.25, 0.5, 0.75]) {
          const p = { x: move.from.x + (move.to.x - move.from.x) * t, y: move.from.y + (move.to.y - move.from.y) * t };
          const z = move.from.z + (move.to.z - move.from.z) * t;
          expect(Math.abs(z - (topAt(layout, of, p, fret.line) - of.slot.depth))).toBeLessThan(tolerance + rounding);
        }
      }
    }
  });

  it('cuts in passes no deeper than the pass depth (3 mm in passes of at most 1.4 mm: 3 passes)', async () => {
    const layout = computeLayout(throughFan);
    const fret = linesByFret(layout).get(12)!;
    const own = cuts(readBack(await gcode(throughFan, { passDepth: 1.4 }))).filter((m) => m.fret === 12);
    const belowTop = [...new Set(own.map((m) => Math.round((topAt(layout, throughFan, m.to, fret.line) - m.to.z) * 1e4) / 1e4))].sort((a, b) => a - b);
    expect(belowTop).toEqual([1, 2, 3]);
  });

  it('runs the final pass of every through slot edge to edge plus the overrun', async () => {
    const layout = computeLayout(throughFan);
    const moves = cuts(readBack(await gcode(throughFan)));
    for (const fret of fretsWithZero(layout)) {
      const last = moves.filter((m) => m.fret === fret.number && m.to.z < -throughFan.slot.depth + 1e-9);
      const points = last.flatMap((m) => [m.from, m.to]);
      const [ex, ey] = [fret.line.end.x - fret.line.start.x, fret.line.end.y - fret.line.start.y];
      const length = Math.hypot(ex, ey);
      const along = points.map((p) => ((p.x - fret.line.start.x) * ex + (p.y - fret.line.start.y) * ey) / length);
      expect(Math.abs(Math.min(...along) - -1)).toBeLessThan(0.001); // mm: 1 mm overrun past the treble edge
      expect(Math.abs(Math.max(...along) - (length + 1))).toBeLessThan(0.001); // and past the bass edge
    }
  });

  it('uses the DXF’s coordinates: with origin lower-left every stopped slot starts and ends on the DXF slot line’s ends', async () => {
    const dxf = new DxfParser().parseSync(new TextDecoder().decode((await exportDesign(fan, options({ format: 'dxf', origin: 'lower-left' }))).bytes)) as unknown as {
      entities: { type: string; layer: string; vertices: Point[] }[];
    };
    const slots = dxf.entities.filter((e) => e.layer === 'slots' && e.type === 'LINE');
    const moves = cuts(readBack(await gcode(fan, { origin: 'lower-left' })));
    const numbers = fretsWithZero(computeLayout(fan)).map((f) => f.number);
    expect(slots.length).toBe(numbers.length);
    numbers.forEach((number, i) => {
      const own = moves.filter((m) => m.fret === number);
      const ends = [own[0]!.from, own[0]!.to, ...own.map((m) => m.to)];
      for (const vertex of slots[i]!.vertices) {
        expect(Math.min(...ends.map((p) => Math.hypot(p.x - vertex.x, p.y - vertex.y)))).toBeLessThan(0.0002); // mm
      }
    });
  });

  it('says G21 for a mm design and G20 for an inch design, and every move is read in those units', async () => {
    expect(new Set(readBack(await gcode(fan)).map((m) => m.units))).toEqual(new Set(['G21']));
    const inches = design({ name: 'Inch board', units: 'in', strings: 6, scale: { treble: 25.5, bass: 25.5 }, perpendicularFret: 0, frets: 22, stringSpacing: { nut: 1.65, bridge: 2.2 }, temperament: { kind: 'equal', divisions: 12 }, radius: { nut: 9.5, end: 14 } });
    const text = await gcode(inches);
    expect(text).toMatch(/^G20 G90 G17/m);
    const moves = readBack(text);
    expect(new Set(moves.map((m) => m.units))).toEqual(new Set(['G20']));
    // The reader turns inches into mm: the depth (3 mm, written as 3/25.4 in) comes back as 3 mm
    // below the top, the top at the edges dropping under 2.5 mm on this 9.5 in radius.
    const deepest = Math.min(...moves.map((m) => m.to.z));
    expect(deepest).toBeLessThan(-3 + 1e-3);
    expect(deepest).toBeGreaterThan(-3 - 2.5);
    expect(text.replace(/\)\n\(/g, ' ')).toContain(`depth ${(3 / 25.4).toFixed(6)} below the top`);
  });

  it('differs by dialect where the controllers do; GRBL lines stay within 80 characters', async () => {
    const linux = await gcode(fan, { dialect: 'linuxcnc' });
    const grbl = await gcode(fan, { dialect: 'grbl' });
    expect(linux).toMatch(/^G64 P0\.0100$/m);
    expect(linux).toMatch(/^T1 M6$/m);
    expect(grbl).not.toMatch(/G64|M6/);
    for (const line of grbl.split('\n')) expect(line.length).toBeLessThanOrEqual(80);
    expect(cuts(readBack(grbl))).toEqual(cuts(readBack(linux)));
  });

  it('opens with the comment block (cautions in comments only) and ends at safe Z with the spindle off', async () => {
    const text = await gcode(fan);
    const lines = text.trimEnd().split('\n');
    const header = lines.slice(0, lines.findIndex((line) => !line.startsWith('(')));
    const block = header.map((line) => line.slice(1, -1)).join(' ');
    for (const words of ['fingerprint', 'Units mm', 'Origin nut centre', 'Z zero on the crown', 'Tool diameter 0.6000', 'Secure the work', 'eye and hearing protection', 'dry run first', "machine maker's instructions"]) {
      expect(block).toContain(words);
    }
    for (const line of lines.filter((l) => !l.startsWith('('))) expect(line).toMatch(/^[GMTSPXYZF0-9 .-]+$/);
    expect(lines.slice(-3)).toEqual(['G0 Z5.0000', 'M5', 'M2']);
  });

  it('lifts every Z by the dry run height and moves Z zero for edge-at-nut by the top’s drop at that corner', async () => {
    const real = readBack(await gcode(fan));
    const dry = readBack(await gcode(fan, { dryRun: 10 }));
    expect(dry.length).toBe(real.length);
    dry.forEach((move, i) => expect(Math.abs(move.to.z - real[i]!.to.z - 10)).toBeLessThan(1e-9));
    const layout = computeLayout(fan);
    const corner = layout.nutLine.start;
    const drop = -topAt(layout, fan, corner, layout.nutLine);
    const edge = readBack(await gcode(fan, { zZero: 'edge-at-nut' }));
    const realCuts = cuts(real);
    cuts(edge).forEach((move, i) => expect(Math.abs(move.to.z - realCuts[i]!.to.z - drop)).toBeLessThan(2e-4));
  });

  it('with a cutter narrower than the slot, covers the slot with offset lines (step at most half the cutter)', async () => {
    const layout = computeLayout(throughFan);
    const fret = linesByFret(layout).get(5)!;
    const own = cuts(readBack(await gcode(throughFan, { toolDiameter: 0.3 }))).filter((m) => m.fret === 5);
    const offsets = [...new Set(own.map((m) => Math.round(distanceToLine(m.to, fret.line) * 1e4) / 1e4))].sort();
    // Spare width 0.3 mm in steps of at most 0.15 mm: lines at ±0.15 and 0 from the centre line.
    expect(offsets).toEqual([0, 0.15]);
  });

  it('refuses a cutter wider than the slot and a safe Z inside the wood, naming the option', () => {
    const layout = computeLayout(fan);
    expect(exportOptionIssues(fan, layout, options({ toolDiameter: 0.8 }))[0]?.path).toBe('toolDiameter');
    expect(exportOptionIssues(fan, layout, options({ zZero: 'edge-at-nut', safeZ: 0.1 }))[0]?.path).toBe('safeZ');
    expect(exportOptionIssues(fan, layout, options({ toolDiameter: 0.6 }))).toEqual([]);
  });
});
