import DxfParser from 'dxf-parser';
import { describe, expect, it } from 'vitest';
import { exportDesign } from '~/lib/export/export-design.server.ts';
import { computeLayout, type Layout, type Point } from '~/lib/geometry/layout.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';
import { validateExportOptions } from '~/lib/schemas/export-options.ts';
import { distanceToLine } from '../../support/expect-near.ts';

/** Slot end points must survive the file round trip to within 1e-9 of the design's unit. */
const TOLERANCE = 1e-9;

function expectNear(actual: number, expected: number, what: string, tolerance = TOLERANCE): void {
  if (!(Math.abs(actual - expected) <= tolerance)) {
    throw new Error(`${what}: ${actual} is not within ${tolerance} of ${expected}`);
  }
}

function demo(id: string): Design {
  const found = DEMO_DESIGNS.find((d) => d.id === id);
  if (!found) throw new Error(`no demo design ${id}`);
  return found.design;
}

function withSlots(design: Design, slot: Partial<Design['slot']>): Design {
  const result = validateDesign({ ...design, slot: { ...design.slot, ...slot } });
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.design;
}

async function exportText(design: Design, input: Record<string, unknown>): Promise<string> {
  const options = validateExportOptions(input);
  if (!options.ok) throw new Error(JSON.stringify(options.issues));
  return new TextDecoder().decode((await exportDesign(design, options.options)).bytes);
}

interface DxfEntity {
  type: string;
  layer: string;
  vertices: { x: number; y: number }[];
  shape?: boolean;
}

async function dxf(design: Design, input: Record<string, unknown>) {
  const text = await exportText(design, { format: 'dxf', ...input });
  const parsed = new DxfParser().parseSync(text) as unknown as {
    header: Record<string, unknown>;
    tables: { layer: { layers: Record<string, unknown> } };
    entities: DxfEntity[];
  };
  return { text, parsed, onLayer: (layer: string) => parsed.entities.filter((e) => e.layer === layer) };
}

function slotSegments(layout: Layout) {
  return layout.frets.map((fret) => fret.slot);
}

function distance(a: Point, b: Point): number {
  return Math.hypot(a.x - b.x, a.y - b.y);
}

describe('slot paths DXF read back with dxf-parser', () => {
  it('sets $INSUNITS to 4 for millimetres and 1 for inches (DXF header variable, AutoCAD DXF reference)', async () => {
    expect((await dxf(demo('seven-string-fan'), {})).parsed.header.$INSUNITS).toBe(4);
    expect((await dxf(demo('mandolin'), {})).parsed.header.$INSUNITS).toBe(1);
  });

  it('names its layers outline, slots, centre-line, nut, saddle, markers and uses each', async () => {
    const { parsed, onLayer } = await dxf(demo('seven-string-fan'), {});
    const layers = ['outline', 'slots', 'centre-line', 'nut', 'saddle', 'markers'];
    expect(Object.keys(parsed.tables.layer.layers).sort()).toEqual([...layers].sort());
    for (const layer of layers) expect(onLayer(layer).length).toBeGreaterThan(0);
    expect(onLayer('outline')).toMatchObject([{ type: 'POLYLINE', shape: true }]);
  });

  it('writes every slot as a line whose end points equal the geometry within 1e-9, for both origins', async () => {
    const design = demo('seven-string-fan');
    const layout = computeLayout(design);
    for (const origin of ['nut-centre', 'lower-left'] as const) {
      const { onLayer } = await dxf(design, { origin });
      const lines = onLayer('slots');
      const shift =
        origin === 'nut-centre'
          ? { x: 0, y: 0 }
          : { x: -Math.min(...layout.outline.map((p) => p.x)), y: -Math.min(...layout.outline.map((p) => p.y)) };
      expect(lines.length).toBe(layout.frets.length);
      slotSegments(layout).forEach((slot, index) => {
        const [start, end] = lines[index]!.vertices;
        expectNear(start!.x, slot.start.x + shift.x, `${origin} slot ${index + 1} start x`);
        expectNear(start!.y, slot.start.y + shift.y, `${origin} slot ${index + 1} start y`);
        expectNear(end!.x, slot.end.x + shift.x, `${origin} slot ${index + 1} end x`);
        expectNear(end!.y, slot.end.y + shift.y, `${origin} slot ${index + 1} end y`);
      });
      if (origin === 'lower-left') {
        const outline = onLayer('outline')[0]!.vertices;
        expectNear(Math.min(...outline.map((v) => v.x)), 0, 'outline lowest x');
        expectNear(Math.min(...outline.map((v) => v.y)), 0, 'outline lowest y');
      }
    }
  });

  it('writes closed kerf outlines as wide as the slot, centred on each slot', async () => {
    const design = withSlots(demo('classical-650'), { width: 0.55 });
    const layout = computeLayout(design);
    const { onLayer } = await dxf(design, { slots: 'outlines' });
    const outlines = onLayer('slots');
    expect(outlines.length).toBe(layout.frets.length);
    // Polylines come out in chain order; pair each with the slot whose middle is its centre.
    const matched = new Set<number>();
    for (const outline of outlines) {
      expect(outline.type).toBe('POLYLINE');
      expect(outline.shape).toBe(true);
      expect(outline.vertices.length).toBe(4);
      const centre = {
        x: outline.vertices.reduce((sum, v) => sum + v.x, 0) / 4,
        y: outline.vertices.reduce((sum, v) => sum + v.y, 0) / 4,
      };
      const index = layout.frets.findIndex((fret) => {
        const middle = { x: (fret.slot.start.x + fret.slot.end.x) / 2, y: (fret.slot.start.y + fret.slot.end.y) / 2 };
        return distance(middle, centre) < 1e-6;
      });
      expect(index).toBeGreaterThanOrEqual(0);
      matched.add(index);
      const slot = layout.frets[index]!.slot;
      // Each corner lies half the slot width from the slot's centre line, beside one of its ends.
      for (const corner of outline.vertices) {
        const nearest = Math.min(distance(corner, slot.start), distance(corner, slot.end));
        expectNear(nearest, 0.55 / 2, `fret ${index + 1} outline corner offset (mm)`);
      }
      const sides = outline.vertices.map((v, i) => distance(v, outline.vertices[(i + 1) % 4]!));
      expectNear(Math.min(...sides), 0.55, `fret ${index + 1} outline width (mm)`);
    }
    expect(matched.size).toBe(layout.frets.length);
  });

  it('stops slots short of each board edge by the stop distance, square to the edge (the fanned 7-string)', async () => {
    const design = withSlots(demo('seven-string-fan'), { stopped: true, stopDistance: 2.5 });
    const layout = computeLayout(design);
    const { onLayer } = await dxf(design, {});
    onLayer('slots').forEach((line, index) => {
      const [start, end] = line.vertices;
      expectNear(distanceToLine(start!, layout.edges.treble), 2.5, `fret ${index + 1} treble stop (mm)`);
      expectNear(distanceToLine(end!, layout.edges.bass), 2.5, `fret ${index + 1} bass stop (mm)`);
    });
  });

  it('states where it comes from, the scale convention, the units and a caution in DXF comments (group 999)', async () => {
    const { text } = await dxf(demo('tenor-ukulele'), {});
    const [code0, provenance, code, convention, code2, comment] = text.split('\n');
    expect(code0).toBe('999');
    expect(provenance).toMatch(/^Kerfline: Demo: tenor ukulele.* - unsaved \(not a saved board revision\) - exported \d{4}-\d\d-\d\d - units in - /);
    expect(code).toBe('999');
    expect(convention).toBe('Scale lengths measured along the centre line (square to the nut).');
    expect(code2).toBe('999');
    expect(comment).toMatch(/Units: (millimetres \(mm\)|inches \(in\))/);
    expect(comment).toMatch(/Verify units and scale on scrap/);
    expect(comment).toMatch(/eye and hearing protection/);
  });
});

describe('slot paths SVG', () => {
  it('has width and height with units and a viewBox of the same size', async () => {
    for (const id of ['seven-string-fan', 'mandolin']) {
      const design = demo(id);
      const svg = await exportText(design, { format: 'svg' });
      const root = /<svg [^>]*width="([^"]+)" height="([^"]+)" viewBox="([^"]+)"/.exec(svg);
      expect(root).not.toBeNull();
      const [, width, height, viewBox] = root!;
      expect(width).toMatch(new RegExp(`^[0-9.e+-]+${design.units}$`));
      expect(height).toMatch(new RegExp(`^[0-9.e+-]+${design.units}$`));
      const [, , boxWidth, boxHeight] = viewBox!.split(' ').map(Number);
      expect(parseFloat(width!)).toBe(boxWidth);
      expect(parseFloat(height!)).toBe(boxHeight);
    }
  });

  it('groups the layers with ids and keeps the geometry coordinates (y negated for the screen)', async () => {
    const design = demo('seven-string-fan');
    const layout = computeLayout(design);
    const svg = await exportText(design, { format: 'svg' });
    for (const id of ['outline', 'slots', 'centre-line', 'nut', 'saddle', 'markers']) {
      expect(svg).toContain(`<g id="${id}">`);
    }
    const slotsGroup = /<g id="slots">([\s\S]*?)<\/g>/.exec(svg)![1]!;
    const lines = [...slotsGroup.matchAll(/<line x1="([^"]+)" y1="([^"]+)" x2="([^"]+)" y2="([^"]+)"\/>/g)];
    expect(lines.length).toBe(layout.frets.length);
    lines.forEach((match, index) => {
      const slot = layout.frets[index]!.slot;
      expectNear(Number(match[1]), slot.start.x, `svg slot ${index + 1} x1`);
      expectNear(Number(match[2]), -slot.start.y, `svg slot ${index + 1} y1`);
      expectNear(Number(match[3]), slot.end.x, `svg slot ${index + 1} x2`);
      expectNear(Number(match[4]), -slot.end.y, `svg slot ${index + 1} y2`);
    });
    expect(svg).toMatch(/<!-- [^>]*Units: millimetres/);
  });
});
