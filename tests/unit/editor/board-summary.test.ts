import { describe, expect, it } from 'vitest';
import { describeBoard } from '~/components/editor/board-summary.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';

describe('text summary of the drawing', () => {
  it('names strings, both scales, the square fret and the fret count of a fanned board', () => {
    const fan = DEMO_DESIGNS.find((d) => d.id === 'seven-string-fan')?.design;
    if (!fan) throw new Error('missing demo');
    const text = describeBoard(fan, computeLayout(fan));
    expect(text).toContain('7 strings');
    expect(text).toContain('string 1 (treble) 648.00 mm');
    expect(text).toContain('string 7 (bass) 686.00 mm');
    expect(text).toContain('fret 8 is square to the centre line');
    expect(text).toContain('24 frets');
    expect(text).toContain('stopped 2.00 mm');
  });

  it('describes a single-scale board in inches to 0.001 in', () => {
    const mandolin = DEMO_DESIGNS.find((d) => d.id === 'mandolin')?.design;
    if (!mandolin) throw new Error('missing demo');
    const text = describeBoard(mandolin, computeLayout(mandolin));
    expect(text).toContain('single scale, 13.875 in on every string');
    expect(text).toContain('the nut is square to the centre line');
  });
});
