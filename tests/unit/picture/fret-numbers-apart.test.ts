/**
 * Fret numbers never overprint: the picture's one rule (fretNumbersApart) and the two printed
 * surfaces that use it, the paper template's sheet drawing (1:1, 7 pt) and the proof drawing.
 * A 36-fret mandolin at 13.875 in crowds: its last frets are about 2.6 mm apart while "36" at
 * 7 pt is about 3 mm wide (JetBrains Mono advances 0.6 em; 1 pt = 25.4/72 mm).
 */
import { describe, expect, it } from 'vitest';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { proofDrawing } from '~/lib/export/proof-drawing.ts';
import { labelHalfWidthMm, sheetDrawing } from '~/lib/export/sheet-drawing.ts';
import { ptToMm } from '~/lib/export/paper-sizes.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { boxesOverlap, fretNumbersApart, MONO_ADVANCE_EM, type Box } from '~/lib/picture/board-picture.ts';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';

function design(id: string, changes: Partial<Design>): Design {
  const found = DEMO_DESIGNS.find((d) => d.id === id);
  if (!found) throw new Error(`no demo design ${id}`);
  const checked = validateDesign({ ...found.design, ...changes });
  if (!checked.ok) throw new Error(JSON.stringify(checked.issues));
  return checked.design;
}

function overlapping(boxes: Box[]): [number, number][] {
  const pairs: [number, number][] = [];
  boxes.forEach((a, i) => boxes.slice(i + 1).forEach((b, j) => boxesOverlap(a, b) && pairs.push([i, i + 1 + j])));
  return pairs;
}

const box = (x: number, width: number): Box => ({ minX: x, maxX: x + width, minY: 0, maxY: 1 });

describe('fretNumbersApart (the one rule)', () => {
  it('keeps every label that has room, in the given order', () => {
    const labels = [1, 2, 3].map((fret) => ({ fret, x: fret * 10 }));
    expect(fretNumbersApart(labels, (l) => box(l.x, 5))).toEqual(labels);
  });

  it('drops a label that would overprint one kept, keeping the octave (12) over its neighbours', () => {
    const labels = [10, 11, 12, 13].map((fret) => ({ fret, x: fret * 3 }));
    const kept = fretNumbersApart(labels, (l) => box(l.x, 5)).map((l) => l.fret);
    expect(kept).toEqual([10, 12]);
  });

  it('counts touching edges as apart, and any shared area as overlap', () => {
    expect(boxesOverlap(box(0, 5), box(5, 5))).toBe(false);
    expect(boxesOverlap(box(0, 5), box(4.999, 5))).toBe(true);
  });
});

describe('printed surfaces thin crowded fret numbers', () => {
  const crowded = computeLayout(design('mandolin', { frets: 36 }));

  it('the paper template (1:1): no two fret numbers overlap, the low frets and the octaves all print', () => {
    const labels = sheetDrawing(crowded, { strings: true, kerf: false, mirror: false, toSaddle: false }).items.filter(
      (item): item is Extract<typeof item, { kind: 'label' }> => item.kind === 'label' && /^\d+$/.test(item.text),
    );
    // String numbers are labels too; fret numbers lie beyond the treble edge, the string numbers before the nut.
    const frets = labels.filter((label) => label.centre.x > 0);
    const boxes = frets.map((l) => {
      const half = { x: labelHalfWidthMm(l.text, l.sizePt), y: ptToMm(l.sizePt) / 2 };
      return { minX: l.centre.x - half.x, maxX: l.centre.x + half.x, minY: l.centre.y - half.y, maxY: l.centre.y + half.y };
    });
    expect(overlapping(boxes)).toEqual([]);
    const shown = frets.map((l) => Number(l.text));
    for (const fret of [1, 2, 3, 12, 24, 36]) expect(shown).toContain(fret);
    expect(shown.length).toBeLessThan(36);
  });

  it('the proof drawing: no two fret numbers overlap, fret 1 and the octaves are shown', () => {
    const d = proofDrawing(crowded);
    const boxes = d.numbers.map((n) => {
      const half = (n.text.length * MONO_ADVANCE_EM * d.fontSize) / 2;
      return { minX: n.x - half, maxX: n.x + half, minY: n.y - d.fontSize, maxY: n.y };
    });
    expect(overlapping(boxes)).toEqual([]);
    const shown = d.numbers.map((n) => n.fret);
    for (const fret of [1, 12, 24, 36]) expect(shown).toContain(fret);
    expect(shown.length).toBeLessThan(36);
  });

  it('a roomy board keeps every number (the 650 mm classical guitar, 19 frets)', () => {
    const roomy = computeLayout(design('classical-650', {}));
    expect(proofDrawing(roomy).numbers.map((n) => n.fret)).toEqual(roomy.frets.map((f) => f.number));
  });
});
