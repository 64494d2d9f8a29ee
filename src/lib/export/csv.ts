import type { Layout } from '~/lib/geometry/layout';

/** The fret table's header; part of the public output format. */
export const FRET_TABLE_HEADER = 'fret,string,scale_length,from_nut,from_previous,x,y';

/**
 * The fret table as CSV: one row per fret (1..F) and string (1..N), ordered by fret then string,
 * in the layout's units. Numbers are unrounded, in JavaScript's shortest round-trip form, so a
 * reader parsing them gets back the exact doubles. Every line ends with \n.
 */
export function fretTableCsv(layout: Layout): string {
  const lines = [FRET_TABLE_HEADER];
  for (const fret of layout.frets) {
    for (const point of fret.points) {
      const scaleLength = layout.strings[point.string - 1]?.scaleLength ?? Number.NaN;
      lines.push(
        `${fret.number},${point.string},${String(scaleLength)},${String(point.fromNut)},` +
          `${String(point.fromPrevious)},${String(point.x)},${String(point.y)}`,
      );
    }
  }
  return `${lines.join('\n')}\n`;
}
