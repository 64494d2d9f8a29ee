import { describe, expect, it } from 'vitest';
import { MEASUREMENTS_CSV_MAX_BYTES, parseMeasurementsCsv } from '~/lib/templates/check/measurements-csv.ts';

const limits = { frets: 20, strings: 7 };

describe('measured positions CSV', () => {
  it('reads fret,from_nut with a header, CRLF line ends and blank lines; rows without a line take the line the caller names', () => {
    const parsed = parseMeasurementsCsv('\uFEFFfret,from_nut\r\n1,35.64\r\n\r\n2, 69.28 \r\n', limits, 'string-1');
    expect(parsed).toEqual({
      ok: true,
      measurements: [
        { fret: 1, along: 'string-1', fromNut: 35.64 },
        { fret: 2, along: 'string-1', fromNut: 69.28 },
      ],
      lines: [2, 4],
    });
  });

  it('reads fret,string,from_nut and, without a header, infers the form from the column count', () => {
    const withHeader = parseMeasurementsCsv('fret,string,from_nut\n1,1,36.3\n1,7,38.5\n', limits, 'string-1');
    const without = parseMeasurementsCsv('1,1,36.3\n1,7,38.5\n', limits, 'string-1');
    expect(withHeader.ok && without.ok && withHeader.measurements).toEqual(without.ok && without.measurements);
    expect(withHeader.ok && withHeader.lines).toEqual([2, 3]);
    expect(withHeader.ok && withHeader.measurements[1]).toEqual({ fret: 1, along: 'string-7', fromNut: 38.5 });
  });

  it('names the line and the reason: missing column, not a number, duplicate fret, fret out of range', () => {
    const text = ['fret,from_nut', '1,35.6', '2', '3,abc', '1,35.7', '21,400', '4.5,120', '0,1'].join('\n');
    const parsed = parseMeasurementsCsv(text, limits, 'string-1');
    expect(parsed.ok).toBe(false);
    if (parsed.ok) return;
    expect(parsed.errors).toEqual([
      { line: 3, message: 'missing column "from_nut" (expected fret,from_nut)' },
      { line: 4, message: 'from_nut "abc" is not a number' },
      { line: 5, message: 'duplicate fret: fret 1 is already listed' },
      { line: 6, message: 'fret out of range: 21 (frets are 1 to 20)' },
      { line: 7, message: 'fret out of range: 4.5 (frets are 1 to 20)' },
      { line: 8, message: 'fret out of range: 0 (frets are 1 to 20)' },
    ]);
  });

  it('refuses an unknown header, strings outside 1..N, empty files and files over 64 KiB', () => {
    expect(parseMeasurementsCsv('position,mm\n1,2\n', limits, 'string-1')).toEqual({
      ok: false,
      errors: [{ line: 1, message: 'unknown header "position,mm"; use "fret,from_nut", "fret,along,from_nut" or "fret,string,from_nut"' }],
    });
    const badString = parseMeasurementsCsv('fret,string,from_nut\n1,8,36\n', limits, 'string-1');
    expect(!badString.ok && badString.errors[0]).toEqual({ line: 2, message: 'string out of range: 8 (strings are 1 = treble to 7 = bass)' });
    expect(parseMeasurementsCsv('\n\n', limits, 'string-1').ok).toBe(false);
    const big = `fret,from_nut\n${'1,35.6\n'.repeat(MEASUREMENTS_CSV_MAX_BYTES / 7 + 1)}`;
    const tooBig = parseMeasurementsCsv(big, limits, 'string-1');
    expect(!tooBig.ok && tooBig.errors[0]?.message).toMatch(/larger than 64 KiB/);
  });
});

describe('measured positions CSV as spreadsheets write it (read with csv-parse)', () => {
  it('reads ";" separators with decimal commas, quoted cells and a byte order mark', () => {
    const parsed = parseMeasurementsCsv('\uFEFF"fret";"from_nut"\r\n1;35,64\r\n"2";" 69,28 "\r\n3;"103.2"\r\n', limits, 'centre-line');
    expect(parsed).toEqual({
      ok: true,
      measurements: [
        { fret: 1, along: 'centre-line', fromNut: 35.64 },
        { fret: 2, along: 'centre-line', fromNut: 69.28 },
        { fret: 3, along: 'centre-line', fromNut: 103.2 },
      ],
      lines: [2, 3, 4],
    });
  });

  it('reads fret,along,from_nut with one line per row, with or without a header', () => {
    const text = 'fret,along,from_nut\n1,treble-edge,36.3\n1,"bass-edge",38.5\n2,string-4,70\n';
    const parsed = parseMeasurementsCsv(text, limits, 'centre-line');
    expect(parsed.ok && parsed.measurements.map((m) => m.along)).toEqual(['treble-edge', 'bass-edge', 'string-4']);
    const bare = parseMeasurementsCsv('1;treble-edge;36,3\n', limits, 'centre-line');
    expect(bare.ok && bare.measurements).toEqual([{ fret: 1, along: 'treble-edge', fromNut: 36.3 }]);
  });

  it('names the line and the reason for ";" files, unknown lines, duplicates along a line and an unclosed quote', () => {
    const text = ['fret;along;from_nut', '1;treble-edge;35,6', '2;side;70', '1;treble-edge;35,7', '3;string-8;100', '4;bass-edge;abc'].join('\n');
    const parsed = parseMeasurementsCsv(text, limits, 'centre-line');
    expect(!parsed.ok && parsed.errors).toEqual([
      { line: 3, message: 'along "side" is not a line of this board (use treble-edge, bass-edge, centre-line or string-1 to string-7)' },
      { line: 4, message: 'duplicate fret: fret 1 along treble-edge is already listed' },
      { line: 5, message: 'along "string-8" is not a line of this board (use treble-edge, bass-edge, centre-line or string-1 to string-7)' },
      { line: 6, message: 'from_nut "abc" is not a number' },
    ]);
    const unclosed = parseMeasurementsCsv('fret,from_nut\n1,35.6\n2,"69.3\n', limits, 'centre-line');
    expect(!unclosed.ok && unclosed.errors).toEqual([{ line: 3, message: 'a quoted cell is not closed' }]);
  });
});
