import DxfParser from 'dxf-parser';
import { describe, expect, it } from 'vitest';
import { indexTemplateStrip } from '~/lib/templates/index-template.ts';
import { INDEX_TEMPLATE_LAYERS, indexTemplateDxf } from '~/lib/templates/index-template-dxf.server.ts';
import { dxfComments } from '../../support/dxf-comments.ts';
import { indexTemplatePdf } from '~/lib/templates/index-template-pdf.server.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { designOf } from '../../support/design-builders.ts';
import { expectNear } from '../../support/expect-near.ts';
import { pageText, readPdf } from '../../support/pdf-readback.ts';

/** Closed form for 12-tone equal temperament: d(n) = L (1 - 2^(-n/12)). */
const closedForm = (scale: number, fret: number) => scale * (1 - 2 ** (-fret / 12));
const PT_PER_MM = 72 / 25.4; // ISO 32000-1: 72 pt = 1 in = 25.4 mm

interface DxfLine {
  type: string;
  layer: string;
  vertices: { x: number; y: number }[];
  text?: string;
}

function parseDxf(text: string) {
  const parsed = new DxfParser().parseSync(text);
  if (!parsed) throw new Error('DXF did not parse');
  return { header: parsed.header, layers: Object.keys(parsed.tables['layer']?.layers ?? {}), entities: parsed.entities as unknown as DxfLine[] };
}

const classical = designOf({ name: 'Classical 650', scale: { treble: 650, bass: 650 }, frets: 19, stringSpacing: { nut: 43, bridge: 58 } });

describe('index template DXF (read back with dxf-parser)', () => {
  const dxf = parseDxf(indexTemplateDxf(indexTemplateStrip(classical, 0.6)));

  it('declares millimetres ($INSUNITS 4), has the named layers and one slot per fret plus the nut slot', () => {
    expect(dxf.header['$INSUNITS']).toBe(4);
    expect(dxf.layers.sort()).toEqual(Object.values(INDEX_TEMPLATE_LAYERS).sort());
    expect(dxf.entities.filter((e) => e.layer === 'slots')).toHaveLength(19);
    expect(dxf.entities.filter((e) => e.layer === 'nut')).toHaveLength(1);
  });

  it('puts every slot centre line at L (1 - 2^(-n/12)) from the nut within 1e-9 mm (Varieschi & Gower, Am. J. Phys. 78, 2010)', () => {
    const centres = dxf.entities.filter((e) => e.layer === 'slot-centres');
    expect(centres).toHaveLength(20);
    for (let fret = 1; fret <= 19; fret++) {
      const line = centres.find((e) => Math.abs(e.vertices[0]!.x - closedForm(650, fret)) < 1e-6);
      if (!line) throw new Error(`no slot centre line for fret ${fret}`);
      expectNear(line.vertices[0]!.x, closedForm(650, fret), 1e-9); // mm
      expectNear(line.vertices[1]!.x, closedForm(650, fret), 1e-9); // mm, square to the strip
    }
    expect(centres.some((e) => e.vertices.every((v) => v.x === 0))).toBe(true); // the nut slot
  });

  it('makes each slot as wide as the jig key (0.6 mm), not the saw kerf (0.6 mm here vs the design 0.55 mm default)', () => {
    const slots = dxf.entities.filter((e) => e.layer === 'slots');
    for (const slot of slots) {
      const [a, , , d] = slot.vertices;
      expectNear(Math.hypot(a!.x - d!.x, a!.y - d!.y), 0.6, 1e-9); // mm
    }
  });

  it('engraves name and scale on their own layer and carries the machine cautions as 999 comments, never as TEXT', () => {
    const texts = dxf.entities.filter((e) => e.type === 'TEXT');
    expect(texts.filter((e) => e.layer === 'engraving').map((e) => e.text)).toContain('Classical 650 - scale 650.00 mm - key 0.60 mm');
    expect(new Set(texts.map((e) => e.layer))).toEqual(new Set(['engraving']));
    const notes = dxfComments(indexTemplateDxf(indexTemplateStrip(classical, 0.6))).join('\n');
    expect(notes).toMatch(/Verify units and scale on scrap or a test piece/);
    expect(notes).toMatch(/eye and hearing protection/);
    expect(notes).toMatch(/not the saw kerf/);
  });

  it('declares inches ($INSUNITS 1) for a design in inches', () => {
    const mandolin = designOf({ units: 'in', scale: { treble: 13.875, bass: 13.875 }, frets: 20, stringSpacing: { nut: 0.85, bridge: 1.45 } });
    const parsed = parseDxf(indexTemplateDxf(indexTemplateStrip(mandolin, 0.024)));
    expect(parsed.header['$INSUNITS']).toBe(1);
    const fret12 = parsed.entities.find((e) => e.layer === 'slot-centres' && Math.abs(e.vertices[0]!.x - 13.875 / 2) < 1e-6);
    expectNear(fret12!.vertices[0]!.x, 13.875 / 2, 1e-12); // in: the 12th fret halves the scale
  });

  it('fanned: each slot follows its fret line through strings 1 and N, carries its angle, and the notes say the jig must follow it', () => {
    const fan = designOf({ name: 'Fan 7', strings: 7, scale: { treble: 648, bass: 686 }, perpendicularFret: 8, stringSpacing: { nut: 48, bridge: 75 }, frets: 24 });
    const layout = computeLayout(fan);
    const strip = indexTemplateStrip(fan, 0.7);
    const parsed = parseDxf(indexTemplateDxf(strip));
    const centres = parsed.entities.filter((e) => e.layer === 'slot-centres');
    const [treble, bass] = [layout.strings[0]!, layout.strings[6]!];
    for (let fret = 1; fret <= 24; fret++) {
      // Expected crossings from the closed form along each outer string.
      const along = (s: typeof treble, scale: number) => {
        const t = closedForm(scale, fret) / scale;
        return { x: s.nut.x + (s.saddle.x - s.nut.x) * t, y: s.nut.y + (s.saddle.y - s.nut.y) * t };
      };
      const onTreble = along(treble, 648);
      const onBass = along(bass, 686);
      const line = centres.find((e) => Math.hypot(e.vertices[1]!.x - onBass.x, e.vertices[1]!.y - onBass.y) < 1e-6);
      if (!line) throw new Error(`no slot for fret ${fret}`);
      const [a, b] = line.vertices as [{ x: number; y: number }, { x: number; y: number }];
      const cross = ((b.x - a.x) * (onTreble.y - a.y) - (b.y - a.y) * (onTreble.x - a.x)) / Math.hypot(b.x - a.x, b.y - a.y);
      expectNear(cross, 0, 1e-9); // mm: the treble crossing lies on the slot line
      expectNear(b.x, onBass.x, 1e-9); // mm
      expectNear(b.y, onBass.y, 1e-9); // mm
    }
    expectNear(strip.slots.find((s) => s.fret === 8)!.angleDeg, 0, 1e-9); // degrees: the perpendicular fret is square
    expect(strip.slots[0]!.angleDeg).toBeLessThan(0);
    expect(strip.slots[23]!.angleDeg).toBeGreaterThan(0);
    expect(strip.notes.join(' ')).toMatch(/the jig must follow each slot's angle/);
    expect(parsed.entities.filter((e) => e.layer === 'engraving').map((e) => e.text)).toContain('8 0.0%%d');
  });
});

describe('index template PDF (read back with pdfjs-dist)', () => {
  it('is 1:1: slot centre lines lie at L (1 - 2^(-n/12)) x 72/25.4 pt from the nut within 0.01 pt', async () => {
    const out = await indexTemplatePdf(indexTemplateStrip(classical, 0.6));
    const [page] = await readPdf(out.bytes);
    expectNear(page!.widthPt, out.pageSize[0], 0.01); // pt
    expectNear(page!.heightPt, out.pageSize[1], 0.01); // pt
    const vertical = page!.segments.filter((s) => Math.abs(s.x1 - s.x2) < 1e-3);
    const nut = vertical.filter((s) => Math.abs(s.x1 - out.placement.originX) < 0.01);
    expect(nut.length).toBeGreaterThan(0);
    for (let fret = 1; fret <= 19; fret++) {
      const expected = out.placement.originX + closedForm(650, fret) * PT_PER_MM;
      const hit = vertical.find((s) => Math.abs(s.x1 - expected) < 0.01);
      expect(hit, `slot centre line for fret ${fret} at ${expected} pt`).toBeDefined();
    }
    // The strip's nut end sits 15 mm behind the nut line, drawn to scale.
    expect(vertical.some((s) => Math.abs(s.x1 - (out.placement.originX - 15 * PT_PER_MM)) < 0.01)).toBe(true);
    expect(page!.text).toMatch(/Print at 100 % \/ actual size\. Measure both bars before cutting/);
    expect(page!.text).toMatch(/100 mm/);
  });
});

describe('index template notes say how to use it', () => {
  const fan = designOf({ name: 'Fan 7', strings: 7, scale: { treble: 648, bass: 686 }, perpendicularFret: 0, stringSpacing: { nut: 48, bridge: 75 }, frets: 24 });

  it('single scale: the nut slot crosses the treble reference edge 15 mm from the strip end (the strip proportion), square to it', () => {
    const strip = indexTemplateStrip(classical, 0.6, { revision: 3 });
    expectNear(strip.registration.fromEndAlongEdge, 15, 1e-9); // mm
    expectNear(strip.registration.nutAngleToEdgeDeg, 90, 1e-9); // degrees
    expect(strip.notes).toContain('Made from revision 3 of the board.');
    expect(strip.notes.join(' ')).toMatch(/crosses it 15\.00 mm from the strip's nut end, measured along that edge/);
    expect(strip.notes.join(' ')).toMatch(/scale 650\.00 mm \(scale lengths measured along each outer string\)/);
    expect(strip.notes.join(' ')).toMatch(/jig key width 0\.60 mm/);
  });

  it('fan perpendicular at the nut: the treble edge runs along string 1, so the nut slot meets it at the angle between string 1 and the nut (hand-computed with atan2)', () => {
    const layout = computeLayout(fan);
    const string1 = layout.strings[0]!;
    // Our own worked check: the nut is square to the centre line here (perpendicular fret 0), and
    // string 1 leaves the centre-line direction by atan2(spread, run); the angle to the nut is 90° minus that.
    const slope = (Math.atan2(string1.saddle.y - string1.nut.y, string1.saddle.x - string1.nut.x) * 180) / Math.PI;
    const strip = indexTemplateStrip(fan, 0.7, { revision: null });
    expectNear(strip.registration.nutAngleToEdgeDeg, 90 - Math.abs(slope), 1e-9); // degrees
    expect(strip.notes).toContain('Made from typed scale lengths, not from a saved board revision.');
    expect(strip.notes.join(' ')).toMatch(/The NUT slot meets the treble edge at \d+\.\d\d° \(90° would be square to it\)/);
    // The registration distance along the slanted edge is a little over the 15 mm taken along the centre line.
    expect(strip.registration.fromEndAlongEdge).toBeGreaterThan(15);
  });

  it('the same notes are in the PDF and the DXF', async () => {
    const strip = indexTemplateStrip(classical, 0.6, { revision: 3 });
    const dxf = indexTemplateDxf(strip);
    expect(dxf).toContain('Made from revision 3 of the board.');
    const pdf = await indexTemplatePdf(strip);
    const text = pageText(pdf.bytes, 1).replace(/\s+/g, ' ');
    expect(text).toContain('Made from revision 3 of the board.');
    expect(text).toContain("crosses it 15.00 mm from the strip's nut end");
  });
});
