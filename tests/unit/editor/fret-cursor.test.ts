/** The drawing's keyboard cursor: steps between frets and strings, stops at the ends, and says where it is. */
import { describe, expect, it } from 'vitest';
import { cursorPoint, cursorWords, stepCursor } from '~/components/editor/fret-cursor.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';

const fan = computeLayout(DEMO_DESIGNS.find((d) => d.id === 'seven-string-fan')!.design);
const ukulele = computeLayout(DEMO_DESIGNS.find((d) => d.id === 'tenor-ukulele')!.design);

describe('stepCursor', () => {
  it('lands on fret 1, string 1 from nowhere, or on the fret already picked', () => {
    expect(stepCursor(fan, null, 'ArrowRight')).toEqual({ fret: 1, string: 1 });
    expect(stepCursor(fan, null, 'ArrowUp', 12)).toEqual({ fret: 12, string: 1 });
  });

  it('Left/Right change the fret, Up/Down the string (Up toward the bass), stopping at the ends', () => {
    expect(stepCursor(fan, { fret: 5, string: 3 }, 'ArrowRight')).toEqual({ fret: 6, string: 3 });
    expect(stepCursor(fan, { fret: 5, string: 3 }, 'ArrowLeft')).toEqual({ fret: 4, string: 3 });
    expect(stepCursor(fan, { fret: 5, string: 3 }, 'ArrowUp')).toEqual({ fret: 5, string: 4 });
    expect(stepCursor(fan, { fret: 5, string: 3 }, 'ArrowDown')).toEqual({ fret: 5, string: 2 });
    expect(stepCursor(fan, { fret: 24, string: 7 }, 'ArrowRight')).toEqual({ fret: 24, string: 7 });
    expect(stepCursor(fan, { fret: 24, string: 7 }, 'ArrowUp')).toEqual({ fret: 24, string: 7 });
    expect(stepCursor(fan, { fret: 1, string: 1 }, 'ArrowLeft')).toEqual({ fret: 1, string: 1 });
    expect(stepCursor(fan, { fret: 1, string: 1 }, 'ArrowDown')).toEqual({ fret: 1, string: 1 });
  });

  it('keeps a cursor from a bigger board inside this one', () => {
    expect(stepCursor(ukulele, { fret: 24, string: 7 }, 'ArrowLeft')).toEqual({ fret: ukulele.frets.length, string: ukulele.strings.length });
  });
});

describe('cursorWords', () => {
  it('names the fret, the string and both distances in the design\'s units (12-TET: fret 12 halves the string, a 2:1 octave)', () => {
    expect(cursorWords(fan, { fret: 12, string: 1 })).toMatch(/^Fret 12, string 1: 324\.00 mm from the nut, \d+\.\d\d mm from fret 11$/);
    const first = (648 * (1 - 2 ** (-1 / 12))).toFixed(2);
    expect(cursorWords(fan, { fret: 1, string: 1 })).toBe(`Fret 1, string 1: ${first} mm from the nut, ${first} mm from the nut`);
  });

  it('speaks inches on an inch design (the 17 in ukulele, quoted on the centre line: fret 12 halves string 1\'s own length)', () => {
    const half = (ukulele.strings[0]!.scaleLength / 2).toFixed(3);
    expect(half).toMatch(/^8\.50\d$/);
    expect(cursorWords(ukulele, { fret: 12, string: 1 })).toMatch(new RegExp(`^Fret 12, string 1: ${half.replace('.', '\\.')} in from the nut, \\d\\.\\d{3} in from fret 11$`));
  });

  it('says nothing, and has no point, for a place the board does not have', () => {
    expect(cursorWords(ukulele, { fret: 30, string: 1 })).toBe('');
    expect(cursorPoint(ukulele, { fret: 30, string: 1 })).toBeNull();
  });
});
