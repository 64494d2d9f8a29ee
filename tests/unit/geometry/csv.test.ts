import { describe, expect, it } from 'vitest';
import { FRET_TABLE_HEADER, fretTableCsv } from '~/lib/export/csv.ts';
import { layoutOf } from '../../support/design-builders.ts';

describe('fret table CSV', () => {
  const layout = layoutOf({ strings: 7, scale: { treble: 648, bass: 686 }, perpendicularFret: 8, frets: 24 });
  const csv = fretTableCsv(layout);
  const lines = csv.split('\n');

  it('has exactly the public header and ends every line with \\n', () => {
    expect(FRET_TABLE_HEADER).toBe('fret,string,scale_length,from_nut,from_previous,x,y');
    expect(lines[0]).toBe(FRET_TABLE_HEADER);
    expect(csv.endsWith('\n')).toBe(true);
    expect(csv).not.toContain('\r');
    expect(lines).toHaveLength(1 + 24 * 7 + 1);
  });

  it('orders rows by fret then string', () => {
    const keys = lines.slice(1, -1).map((line) => line.split(',').slice(0, 2).map(Number));
    const expected = Array.from({ length: 24 * 7 }, (_, i) => [Math.floor(i / 7) + 1, (i % 7) + 1]);
    expect(keys).toEqual(expected);
  });

  it('prints unrounded numbers that read back to the exact doubles', () => {
    lines.slice(1, -1).forEach((line, i) => {
      const [fret, string, scaleLength, fromNut, fromPrevious, x, y] = line.split(',').map(Number);
      const point = layout.frets[fret! - 1]!.points[string! - 1]!;
      expect([scaleLength, fromNut, fromPrevious, x, y]).toEqual([
        layout.strings[string! - 1]!.scaleLength,
        point.fromNut,
        point.fromPrevious,
        point.x,
        point.y,
      ]);
      expect(i).toBeLessThan(24 * 7);
    });
  });
});
