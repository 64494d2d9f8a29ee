import { describe, expect, it } from 'vitest';
import { MM_PER_INCH, convertLength, formatLength, fromMm, inToMm, mmToIn, toMm } from '~/lib/format/units.ts';
import { expectNear } from '../../support/expect-near.ts';
import { layoutOf } from '../../support/design-builders.ts';

const MM_DESIGN = {
  units: 'mm' as const,
  strings: 7,
  scale: { treble: 648, bass: 686 },
  perpendicularFret: 8,
  frets: 24,
  stringSpacing: { nut: 41, bridge: 63 },
};

/** Every number in a JSON value, in document order. */
function numbers(value: unknown): number[] {
  if (typeof value === 'number') return [value];
  if (Array.isArray(value)) return value.flatMap(numbers);
  if (value !== null && typeof value === 'object') return Object.values(value).flatMap(numbers);
  return [];
}

describe('units: 1 in = 25.4 mm exactly (international yard and pound agreement, 1959)', () => {
  it('conversions', () => {
    expect(MM_PER_INCH).toBe(25.4);
    expect(inToMm(1)).toBe(25.4);
    expect(mmToIn(25.4)).toBe(1);
    expect(toMm(2, 'in')).toBe(50.8);
    expect(fromMm(50.8, 'in')).toBe(2);
    expect(convertLength(650, 'mm', 'mm')).toBe(650);
    expectNear(convertLength(convertLength(650, 'mm', 'in'), 'in', 'mm'), 650, 1e-12); // mm
  });

  it('display rounding is 0.01 mm and 0.001 in', () => {
    expect(formatLength(36.48174, 'mm')).toBe('36.48');
    expect(formatLength(1.431199, 'in', true)).toBe('1.431 in');
    expect(formatLength(-0.001, 'mm')).toBe('0.00');
  });

  it('a design in inches gives the same layout as the mm design divided by 25.4, defaults included', () => {
    const mm = layoutOf(MM_DESIGN);
    const inches = layoutOf({
      ...MM_DESIGN,
      units: 'in',
      scale: { treble: 648 / 25.4, bass: 686 / 25.4 },
      stringSpacing: { nut: 41 / 25.4, bridge: 63 / 25.4 },
    });
    expect(inches.units).toBe('in');
    const mmNumbers = numbers({ ...mm, name: 0, units: 0, perpendicularFret: 0 });
    const inNumbers = numbers({ ...inches, name: 0, units: 0, perpendicularFret: 0 });
    expect(inNumbers).toHaveLength(mmNumbers.length);
    // Only lengths are numbers here (indices, fret numbers and marker frets are equal in both).
    mm.frets.forEach((fret, f) => {
      fret.points.forEach((point, s) => {
        const other = inches.frets[f]!.points[s]!;
        for (const key of ['x', 'y', 'fromNut', 'fromPrevious'] as const) {
          expectNear(other[key], point[key] / 25.4, 1e-12); // in
        }
      });
    });
    expectNear(inches.slotWidth, mm.slotWidth / 25.4, 1e-15);
    inches.outline.forEach((corner, i) => {
      expectNear(corner.x, mm.outline[i]!.x / 25.4, 1e-12); // in
      expectNear(corner.y, mm.outline[i]!.y / 25.4, 1e-12);
    });
  });
});
