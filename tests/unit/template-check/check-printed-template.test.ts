/**
 * A template made exactly to the design passes whichever line it is measured along. The paper
 * template is printed with the real PDF export and measured back from its vectors (read with
 * pdfjs-dist, an independent PDF reader): the fret lines (marked content Fret<n>), the nut line
 * (Nut) or the zero fret (Fret0), the edges (through the fret lines' ends, which run edge to
 * edge), the centre line (CentreLine) and the strings (the untagged solid 0.3 pt lines).
 *
 * Precision: pdf-lib writes coordinates with every digit of the double, but pdfjs-dist hands path
 * coordinates back as 32-bit floats (24-bit significand), so read-back points are only good to
 * one float32 step at the page's size: 2^(floor(log2(largest page coordinate)) - 23) pt, at most
 * 2.4e-4 pt (0.000086 mm) on a page under 4096 pt. The printed-template check therefore asserts
 * a worst deviation within two such steps (each crossing is off by at most half a step per
 * point read), and the same check with measurements taken exactly from the layout asserts
 * < 1e-6 design units.
 */
import { describe, expect, it } from 'vitest';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { exportDesign } from '~/lib/export/export-design.server.ts';
import { sheetDrawing } from '~/lib/export/sheet-drawing.ts';
import { planTiles } from '~/lib/export/tile-pages.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import type { Design } from '~/lib/schemas/design.ts';
import { validateExportOptions } from '~/lib/schemas/export-options.ts';
import { defaultTolerance, type Measurement } from '~/lib/templates/check/compare.ts';
import { measureLines, type MeasureLine } from '~/lib/templates/check/measure-lines.ts';
import { runCheck } from '~/lib/templates/check/run-check.ts';
import { readPdf, type PageSegment } from '../../support/pdf-readback.ts';

/** ISO 32000-1: PDF user space units are 1/72 in; 1 in = 25.4 mm exactly. */
const PT_PER_MM = 72 / 25.4;

interface P {
  x: number;
  y: number;
}
interface Line {
  a: P;
  b: P;
}

/** Where the infinite lines through p and q meet (Cramer's rule; plain analytic geometry, written here on purpose). */
function meet(p: Line, q: Line): P {
  const d1 = { x: p.b.x - p.a.x, y: p.b.y - p.a.y };
  const d2 = { x: q.b.x - q.a.x, y: q.b.y - q.a.y };
  const det = d1.x * d2.y - d1.y * d2.x;
  const t = ((q.a.x - p.a.x) * d2.y - (q.a.y - p.a.y) * d2.x) / det;
  return { x: p.a.x + d1.x * t, y: p.a.y + d1.y * t };
}

/** Distance from the nut crossing to the fret crossing along `line`, signed toward the line's `b` end. */
function along(line: Line, nut: Line, fret: Line): number {
  const from = meet(line, nut);
  const to = meet(line, fret);
  const length = Math.hypot(line.b.x - line.a.x, line.b.y - line.a.y);
  return ((to.x - from.x) * (line.b.x - line.a.x) + (to.y - from.y) * (line.b.y - line.a.y)) / length;
}

interface Measured {
  lines: Map<MeasureLine, Line>;
  nut: Line;
  frets: Line[];
  /** How finely the lines were read, in design units (0 = exact). */
  readBackStep: number;
}

function measurementsOf(design: Design, measured: Measured): Measurement[] {
  return measureLines(design.strings).flatMap((name) => {
    const line = measured.lines.get(name)!;
    return measured.frets.map((fret, i) => ({ fret: i + 1, along: name, fromNut: along(line, measured.nut, fret) }));
  });
}

/** The lines read exactly from computeLayout (design units). */
function fromLayout(design: Design): Measured {
  const layout = computeLayout(design);
  const seg = (s: { start: P; end: P }): Line => ({ a: s.start, b: s.end });
  const lines = new Map<MeasureLine, Line>([
    ['treble-edge', seg(layout.edges.treble)],
    ['bass-edge', seg(layout.edges.bass)],
    ['centre-line', { a: { x: 0, y: 0 }, b: { x: 1, y: 0 } }],
  ]);
  for (const string of layout.strings) lines.set(`string-${string.index}`, { a: string.nut, b: string.saddle });
  return { lines, nut: seg(layout.zeroFret?.line ?? layout.nutLine), frets: layout.frets.map((f) => seg(f.line)), readBackStep: 0 };
}

/** The lines read back from the printed PDF, in design units from the board origin. */
async function fromPdf(design: Design): Promise<Measured> {
  const options = validateExportOptions({ format: 'pdf', paper: 'fit', strings: true });
  if (!options.ok) throw new Error(JSON.stringify(options.issues));
  const file = await exportDesign(design, options.options);
  const layout = computeLayout(design);
  const plan = planTiles(sheetDrawing(layout, options.options).bounds, options.options);
  const [page] = await readPdf(file.bytes);
  const float32StepMm = 2 ** (Math.floor(Math.log2(Math.max(page!.widthPt, page!.heightPt))) - 23) / PT_PER_MM;
  expect(plan.tiles).toHaveLength(1);
  const tile = plan.tiles[0]!;
  const mmPerUnit = design.units === 'in' ? 25.4 : 1;
  // Undo the page offset, then points -> mm -> design units.
  const board = (x: number, y: number): P => ({
    x: (x / PT_PER_MM - (plan.window.xMm - tile.x0)) / mmPerUnit,
    y: (y / PT_PER_MM - (plan.window.yMm - tile.y0)) / mmPerUnit,
  });
  const line = (s: PageSegment): Line => ({ a: board(s.x1, s.y1), b: board(s.x2, s.y2) });
  const tagged = (tag: string) => {
    const found = page!.tagged.get(tag) ?? [];
    expect(found, tag).toHaveLength(1);
    return line(found[0]!);
  };
  const frets = Array.from({ length: design.frets }, (_, i) => tagged(`Fret${i + 1}`));
  const first = frets[0]!;
  const last = frets[frets.length - 1]!;
  // Fret lines run from the treble edge (start) to the bass edge (end).
  const lines = new Map<MeasureLine, Line>([
    ['treble-edge', { a: first.a, b: last.a }],
    ['bass-edge', { a: first.b, b: last.b }],
  ]);
  // The PDF tags its centre line and nut line (CentreLine, Nut); strings are the untagged thin solid lines.
  lines.set('centre-line', tagged('CentreLine'));
  const pens = page!.untagged.map((s) => ({ pen: s, line: line(s) }));
  const strings = pens.filter((p) => !p.pen.dashed && p.pen.widthPt === 0.3).sort((p, q) => p.line.a.y - q.line.a.y);
  expect(strings).toHaveLength(design.strings);
  strings.forEach((s, i) => lines.set(`string-${i + 1}`, s.line));
  const nut = design.zeroFret ? tagged('Fret0') : tagged('Nut');
  return { lines, nut, frets, readBackStep: float32StepMm / mmPerUnit };
}

function worstOf(design: Design, measured: Measured) {
  const outcome = runCheck(design, { units: design.units, tolerance: defaultTolerance('cnc', design.units), measurements: measurementsOf(design, measured) });
  if (!outcome.ok) throw new Error(JSON.stringify(outcome));
  return outcome.result;
}

describe('a template made exactly to the design passes along every line', () => {
  for (const { id, design } of DEMO_DESIGNS) {
    it(`${id}: measured exactly from the layout along both edges, the centre line and each string, worst deviation < 1e-6 design units`, () => {
      const result = worstOf(design, fromLayout(design));
      expect(result.slots).toHaveLength((3 + design.strings) * design.frets);
      expect(result.passed).toBe(true);
      expect(Math.abs(result.worstDeviation)).toBeLessThan(1e-6);
    });

    it(`${id}: its printed paper template (PDF), measured back along every line, passes within two float32 steps of the read-back`, async () => {
      const measured = await fromPdf(design);
      const result = worstOf(design, measured);
      expect(result.slots).toHaveLength((3 + design.strings) * design.frets);
      expect(result.passed).toBe(true);
      expect(measured.readBackStep).toBeLessThan(0.0001 / (design.units === 'in' ? 25.4 : 1)); // under 0.0001 mm
      expect(Math.abs(result.worstDeviation)).toBeLessThanOrEqual(2 * measured.readBackStep);
    });
  }
});
