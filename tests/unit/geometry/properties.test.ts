import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { distance, type Point } from '~/lib/geometry/plane.ts';
import { validateDesign } from '~/lib/schemas/design.ts';
import { invalidFieldArbitrary, validDesignArbitrary } from './design-arbitraries.ts';
import { validDesign, withField } from '../../support/design-builders.ts';

function offLine(point: Point, a: Point, b: Point): number {
  return Math.abs((b.x - a.x) * (point.y - a.y) - (b.y - a.y) * (point.x - a.x)) / distance(a, b);
}

function allFinite(value: unknown): boolean {
  if (typeof value === 'number') return Number.isFinite(value);
  if (Array.isArray(value)) return value.every(allFinite);
  if (value !== null && typeof value === 'object') return Object.values(value).every(allFinite);
  return true;
}

describe('property: every valid random design keeps the model invariants (fast-check)', () => {
  it('outer scales, perpendicular fret, straight fret lines, increasing positions, finite numbers', () => {
    fc.assert(
      fc.property(validDesignArbitrary, (input) => {
        const design = validDesign(input);
        const layout = computeLayout(design);
        const n = design.strings;
        const tolerance = 1e-9 * design.scale.bass; // mm, relative to the board's size
        expect(allFinite(layout)).toBe(true);
        expect(layout.frets).toHaveLength(design.frets);
        const treble = layout.strings[0]!;
        const bass = layout.strings[n - 1]!;
        expect(Math.abs(distance(treble.nut, treble.saddle) - design.scale.treble)).toBeLessThan(tolerance);
        expect(Math.abs(distance(bass.nut, bass.saddle) - design.scale.bass)).toBeLessThan(tolerance);
        const fraction = 1 - 2 ** (-design.perpendicularFret / (design.temperament.kind === 'equal' ? design.temperament.divisions : 12));
        const perpendicularX = (s: typeof treble) => s.nut.x + (s.saddle.x - s.nut.x) * fraction;
        expect(Math.abs(perpendicularX(treble) - perpendicularX(bass))).toBeLessThan(tolerance);
        for (const fret of layout.frets) {
          expect(fret.points).toHaveLength(n);
          const first = fret.points[0]!;
          const last = fret.points[n - 1]!;
          for (const point of fret.points) {
            expect(offLine(point, first, last)).toBeLessThan(tolerance);
            expect(point.fromPrevious).toBeGreaterThan(0);
            expect(point.fromNut).toBeLessThan(layout.strings[point.string - 1]!.scaleLength);
          }
          expect(fret.line.start.y).toBeLessThan(first.y);
          expect(fret.line.end.y).toBeGreaterThan(last.y);
        }
      }),
      { numRuns: 300 },
    );
  });
});

describe('property: random invalid designs are rejected, naming the field (fast-check)', () => {
  it('one bad field in an otherwise valid design', () => {
    fc.assert(
      fc.property(invalidFieldArbitrary, ([path, value]) => {
        const input = withField(path, value);
        const validation = validateDesign(input);
        expect(validation.ok).toBe(false);
        if (!validation.ok) expect(validation.issues.map((i) => i.path)).toContain(path);
      }),
      { numRuns: 300 },
    );
  });

  it('arbitrary JSON values never pass and never throw', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (value) => {
        expect(validateDesign(value).ok).toBe(false);
      }),
      { numRuns: 300 },
    );
  });
});
