/**
 * `scaleAlong`: a scale given along each outer string, or as its run along the centre line (nut to
 * saddle, square to the nut). Checked against the 12-TET fret formula d(n) = L (1 - 2^(-n/12))
 * (any luthiery handbook; the 12th fret halves the scale and the 24th leaves a quarter), and
 * against worked values computed here by hand from Pythagoras (our own examples, marked as such).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { expectNear } from '../../support/expect-near.ts';
import { designOf } from '../../support/design-builders.ts';

const IN = 25.4;

describe('scale lengths along the centre line', () => {
  // A 25.5 in six-string with string spread (nut 1.75 in, saddle 2.25 in between outer strings).
  const spread = { nut: 1.75, bridge: 2.25 };
  const base = { units: 'in' as const, strings: 6, frets: 24, scale: { treble: 25.5, bass: 25.5 }, stringSpacing: spread };

  it('single-scale 25.5 in: the 12th fret is at 12.75 in on the centre line and on every string (12-TET: L/2)', () => {
    const layout = computeLayout(designOf({ ...base, scaleAlong: 'centreLine' }));
    const twelve = layout.frets[11]!;
    for (const point of twelve.points) expectNear(point.x, 12.75, 1e-12);
    const centre = (twelve.line.start.x + twelve.line.end.x) / 2;
    expectNear(centre, 12.75, 1e-12);
    // 24th fret: 3/4 of the run, 19.125 in.
    for (const point of layout.frets[23]!.points) expectNear(point.x, 19.125, 1e-12);
  });

  it('along the outer strings (the default) the same numbers give 12.749 in on the centre line (hand-computed: sqrt(25.5² - 0.25²) / 2)', () => {
    const layout = computeLayout(designOf(base));
    const run = Math.sqrt(25.5 ** 2 - 0.25 ** 2); // 25.498774480..., worked here from Pythagoras
    expectNear(layout.frets[11]!.points[0]!.x, run / 2, 1e-12);
    expect(Number((run / 2).toFixed(3))).toBe(12.749);
    expect(layout.scaleAlong).toBe('strings');
  });

  it('an outer string is then a little longer than its given run: L = sqrt(run² + spread²) (hand-computed, our own example)', () => {
    const layout = computeLayout(designOf({ ...base, scaleAlong: 'centreLine' }));
    const expected = Math.hypot(25.5, 0.25); // 25.501225460..., worked here
    expectNear(layout.strings[0]!.scaleLength, expected, 1e-12);
    expectNear(layout.strings[5]!.scaleLength, expected, 1e-12);
    expect(layout.scaleAlong).toBe('centreLine');
  });

  it('a fan: the treble and bass runs along the centre line are the two scales (648 / 686 mm, perpendicular at fret 8)', () => {
    const layout = computeLayout(
      designOf({ strings: 7, scale: { treble: 648, bass: 686 }, perpendicularFret: 8, stringSpacing: { nut: 41, bridge: 63 }, scaleAlong: 'centreLine' }),
    );
    const [treble, bass] = [layout.strings[0]!, layout.strings[6]!];
    expectNear(treble.saddle.x - treble.nut.x, 648, 1e-9);
    expectNear(bass.saddle.x - bass.nut.x, 686, 1e-9);
    // Fret 8 square to the centre line on both outer strings.
    const eight = layout.frets[7]!;
    expectNear(eight.points[0]!.x, eight.points[6]!.x, 1e-9);
  });

  it('property: with equal scales along the centre line, fret x does not depend on the string', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 16 }),
        fc.integer({ min: 1, max: 36 }),
        fc.double({ min: 200, max: 1200, noNaN: true }),
        fc.double({ min: 10, max: 80, noNaN: true }),
        fc.double({ min: -5, max: 40, noNaN: true }),
        (strings, frets, scale, nut, taper) => {
          const layout = computeLayout(
            designOf({ strings, frets, scale: { treble: scale, bass: scale }, stringSpacing: { nut, bridge: nut + taper }, scaleAlong: 'centreLine', markers: [] }),
          );
          for (const fret of layout.frets) {
            const expected = scale * (1 - 2 ** (-fret.number / 12));
            for (const point of fret.points) expectNear(point.x, expected, 1e-9 * scale);
          }
        },
      ),
      { numRuns: 200 },
    );
  });

  it('an inch board and its millimetre twin agree (1 in = 25.4 mm exactly)', () => {
    const inches = computeLayout(designOf({ ...base, scaleAlong: 'centreLine' }));
    const mm = computeLayout(
      designOf({ units: 'mm', strings: 6, frets: 24, scale: { treble: 25.5 * IN, bass: 25.5 * IN }, stringSpacing: { nut: 1.75 * IN, bridge: 2.25 * IN }, scaleAlong: 'centreLine' }),
    );
    expectNear(mm.frets[6]!.points[2]!.x, inches.frets[6]!.points[2]!.x * IN, 1e-9);
  });
});
