import { describe, expect, it } from 'vitest';
import { parseScl } from '~/lib/geometry/scala.ts';
import { validateDesign } from '~/lib/schemas/design.ts';
import { expectNear } from '../../support/expect-near.ts';
import { designInput, fretPoint, layoutOf } from '../../support/design-builders.ts';

/** 12-tone equal temperament written as a .scl file in cents (Scala .scl format). */
const TWELVE_TET_SCL = [
  '! twelve-tet.scl',
  '!',
  '12-tone equal temperament',
  ' 12',
  '!',
  ...Array.from({ length: 12 }, (_, i) => ` ${(100 * (i + 1)).toFixed(1)}`),
].join('\n');

/** A 5-limit just scale (ratios from memory; 5/4 is fret 4 and 3/2 is fret 7). */
const JUST_SCL = [
  '! just-twelve.scl',
  'Five-limit just intonation, twelve steps',
  '12',
  '16/15', '9/8', '6/5', '5/4 major third', '4/3', '45/32', '3/2  fifth', '8/5', '5/3', '9/5', '15/8', '2/1',
].join('\r\n');

describe('parseScl (published Scala .scl format)', () => {
  it('reads comments, description, count and pitches in cents and ratios', () => {
    const parsed = parseScl('! a.scl\n!\nMixed values\n 4 pitches follow\n!\n 150.0 a label\n 5/4\n3\n 1200.\n');
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    expect(parsed.scale.description).toBe('Mixed values');
    expect(parsed.scale.pitches.map((p) => p.text)).toEqual(['150.0', '5/4', '3', '1200.']);
    expect(parsed.scale.pitches.map((p) => p.line)).toEqual([6, 7, 8, 9]);
    expectNear(parsed.scale.pitches[0]!.ratio, 2 ** (150 / 1200), 1e-15); // ratio
    expect(parsed.scale.pitches[1]!.ratio).toBe(1.25);
    expectNear(parsed.scale.pitches[1]!.cents, 386.3137138648348, 1e-9); // cents, 1200 log2(5/4)
    expect(parsed.scale.period.ratio).toBe(2);
  });

  it('allows an empty description line', () => {
    const parsed = parseScl('!\n\n1\n2/1\n');
    expect(parsed.ok && parsed.scale.description).toBe('');
  });

  it.each([
    ['', 1, 'empty'],
    ['! only comments\n! here', 2, 'missing description'],
    ['! only a comment\nDescription\n', 3, 'missing pitch count'],
    ['Description\n twelve\n', 2, 'whole number'],
    ['Description\n0\n', 2, 'between 1 and 1024'],
    ['Description\n2000\n', 2, 'between 1 and 1024'],
    ['Description\n2\n0/1\n2/1\n', 3, 'is zero'],
    ['Description\n2\n0\n2/1\n', 3, 'is zero'],
    ['Description\n2\n3/0\n2/1\n', 3, 'zero denominator'],
    ['Description\n2\n-3/2\n2/1\n', 3, 'negative'],
    ['Description\n2\nfifth\n2/1\n', 3, 'not a pitch'],
    ['Description\n2\n1.2.3\n2/1\n', 3, 'not a cents value'],
    ['Description\n3\n3/2\n2/1\n', 5, 'expected 3 pitches, found 2'],
    ['Description\n1\n3/2\n2/1\n', 4, 'more pitches than the count'],
    [`Description\n1\n${'9'.repeat(400)}\n`, 3, 'out of range'],
  ])('rejects %j at line %i (%s)', (text, line, reason) => {
    const parsed = parseScl(text);
    expect(parsed.ok).toBe(false);
    if (parsed.ok) return;
    expect(parsed.error.line).toBe(line);
    expect(parsed.error.message).toContain(reason);
  });
});

describe('Scala temperaments in a layout', () => {
  it('a 12-pitch equal .scl (100.0 ... 1200.0 cents) reproduces built-in 12-TET within 1e-9 mm', () => {
    const fan = { strings: 7, scale: { treble: 648, bass: 686 }, perpendicularFret: 8, frets: 36 };
    const builtIn = layoutOf(fan);
    const scala = layoutOf({ ...fan, temperament: { kind: 'scala', scl: TWELVE_TET_SCL } });
    builtIn.frets.forEach((fret, f) => {
      fret.points.forEach((point, s) => {
        const other = scala.frets[f]!.points[s]!;
        expectNear(other.x, point.x, 1e-9); // mm
        expectNear(other.y, point.y, 1e-9);
        expectNear(other.fromNut, point.fromNut, 1e-9);
        expectNear(other.fromPrevious, point.fromPrevious, 1e-9);
      });
    });
  });

  it('just 5/4 and 3/2 at 650 mm lie 130 mm and 216.667 mm from the nut', () => {
    const layout = layoutOf({ temperament: { kind: 'scala', scl: JUST_SCL } });
    expectNear(fretPoint(layout, 4, 1).fromNut, 130, 1e-9); // mm: 650 (1 - 4/5)
    expectNear(fretPoint(layout, 7, 1).fromNut, 216.667, 0.0005); // mm: 650 (1 - 2/3), to 0.001 mm
    expect(fretPoint(layout, 12, 1).fromNut).toBe(325);
    // Past the period the scale repeats an octave up: fret 16 = 2 * 5/4.
    expectNear(fretPoint(layout, 16, 1).fromNut, 650 * (1 - 1 / 2.5), 1e-9); // mm
  });

  it('names the scl line of a pitch that does not rise', () => {
    const validation = validateDesign(designInput({ temperament: { kind: 'scala', scl: 'Falls\n3\n5/4\n9/8\n2/1\n' } }));
    expect(validation.ok).toBe(false);
    if (validation.ok) return;
    expect(validation.issues).toEqual([
      { path: 'temperament.scl', message: expect.stringMatching(/^line 4: pitch "9\/8" must be higher/) },
    ]);
  });

  it('names the scl line of a parse error and requires a whole perpendicular fret', () => {
    const validation = validateDesign(designInput({ temperament: { kind: 'scala', scl: 'Bad\n2\n5/4\n0\n' } }));
    expect(!validation.ok && validation.issues[0]).toEqual({ path: 'temperament.scl', message: 'line 4: ratio "0" is zero' });
    const fractional = validateDesign(
      designInput({ perpendicularFret: 7.5, temperament: { kind: 'scala', scl: JUST_SCL } }),
    );
    expect(!fractional.ok && fractional.issues.map((i) => i.path)).toEqual(['perpendicularFret']);
  });
});
