import { describe, expect, it } from 'vitest';
import { proofDrawing } from '~/lib/export/proof-drawing.ts';
import { designSpecs } from '~/lib/format/design-specs.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { decisionSchema, PROOF_LIMITS } from '~/lib/schemas/proof.ts';
import { designInput, validDesign } from '../../support/design-builders.ts';

const FAN = validDesign(designInput({ strings: 7, scale: { treble: 648, bass: 686 }, perpendicularFret: 8, stringSpacing: { nut: 41, bridge: 63 } }));

function specsByLabel(specs: ReturnType<typeof designSpecs>): Record<string, string> {
  return Object.fromEntries(specs.map((s) => [s.label, s.value]));
}

describe('proof drawing (server-rendered board)', () => {
  it('draws every fret of the layout, y flipped into a viewBox that holds the whole board', () => {
    const layout = computeLayout(FAN);
    const drawing = proofDrawing(layout);
    expect(drawing.frets.map((f) => f.number)).toEqual(layout.frets.map((f) => f.number));
    const [minX, minY, width, height] = drawing.viewBox.split(' ').map(Number) as [number, number, number, number];
    for (const p of [...layout.outline, layout.saddleLine.start, layout.saddleLine.end]) {
      // Display y is -y (bass side up); every point lies inside the box.
      expect(p.x >= minX && p.x <= minX + width).toBe(true);
      expect(-p.y >= minY && -p.y <= minY + height).toBe(true);
    }
    const fret12 = layout.frets[11]!;
    expect(drawing.frets[11]!.line).toEqual({ x1: fret12.line.start.x, y1: fret12.line.start.y, x2: fret12.line.end.x, y2: fret12.line.end.y });
  });

  it('reads out fret 12 at half of each outer scale (12-TET octave, 2:1 string length ratio)', () => {
    const readout = proofDrawing(computeLayout(FAN)).frets[11]!.readout;
    expect(readout).toBe('Fret 12: 324.00 mm from the nut on string 1, 343.00 mm on string 7');
  });
});

describe('key specifications in plain words', () => {
  it('names both scales and the perpendicular fret of a multi-scale board', () => {
    const specs = specsByLabel(designSpecs(FAN));
    expect(specs['Scale length']).toBe('648.00 mm on the treble side to 686.00 mm on the bass side (multi-scale)');
    expect(specs['Perpendicular fret']).toBe('Square to the centre line at fret 8');
    expect(specs['Strings']).toBe('7');
    expect(specs['Frets']).toBe('24');
    expect(specs['String spacing']).toContain('41.00 mm at the nut, 63.00 mm at the bridge');
    expect(specs['Temperament']).toBe('12-tone equal temperament (standard)');
  });

  it('gives one scale and no perpendicular fret for a single-scale board in inches', () => {
    const specs = specsByLabel(designSpecs(validDesign(designInput({ units: 'in', scale: { treble: 25.5, bass: 25.5 }, stringSpacing: { nut: 1.4, bridge: 2.1 }, temperament: { kind: 'equal', divisions: 19 } }))));
    expect(specs['Scale length']).toBe('25.500 in');
    expect(specs['Perpendicular fret']).toBeUndefined();
    expect(specs['Temperament']).toBe('19 equal divisions of the octave');
  });
});

describe('decision schema', () => {
  it('approve needs confirmed: true; request changes needs a comment within the limit', () => {
    expect(decisionSchema.safeParse({ decision: 'approved', name: 'A', confirmed: true }).success).toBe(true);
    expect(decisionSchema.safeParse({ decision: 'approved', name: 'A', confirmed: false }).success).toBe(false);
    expect(decisionSchema.safeParse({ decision: 'changes_requested', name: 'A', comment: ' ' }).success).toBe(false);
    const longest = 'x'.repeat(PROOF_LIMITS.commentMaxChars);
    expect(decisionSchema.safeParse({ decision: 'changes_requested', name: 'A', comment: longest }).success).toBe(true);
    expect(decisionSchema.safeParse({ decision: 'changes_requested', name: 'A', comment: `${longest}x` }).success).toBe(false);
  });
});
