import type { Layout } from '~/lib/geometry/layout.ts';

/** The fret table's header; part of the public output format. */
export const FRET_TABLE_HEADER = 'fret,string,scale_length,from_nut,from_previous,x,y';

/** One row of the fret table, in the layout's units (the CSV columns, in order). */
export interface FretTableRow {
  fret: number;
  string: number;
  scaleLength: number;
  fromNut: number;
  fromPrevious: number;
  x: number;
  y: number;
}

/** The fret table's rows, ordered by fret then string; shared by the CSV and the on-screen table. */
export function fretTableRows(layout: Layout): FretTableRow[] {
  return layout.frets.flatMap((fret) =>
    fret.points.map((point) => ({
      fret: fret.number,
      string: point.string,
      scaleLength: layout.strings[point.string - 1]?.scaleLength ?? Number.NaN,
      fromNut: point.fromNut,
      fromPrevious: point.fromPrevious,
      x: point.x,
      y: point.y,
    })),
  );
}

/**
 * The fret table as CSV: one row per fret (1..F) and string (1..N), ordered by fret then string,
 * in the layout's units. Numbers are unrounded, in JavaScript's shortest round-trip form, so a
 * reader parsing them gets back the exact doubles. Every line ends with \n.
 */
export function fretTableCsv(layout: Layout): string {
  const lines = [FRET_TABLE_HEADER];
  for (const row of fretTableRows(layout)) {
    lines.push(
      `${row.fret},${row.string},${String(row.scaleLength)},${String(row.fromNut)},` +
        `${String(row.fromPrevious)},${String(row.x)},${String(row.y)}`,
    );
  }
  return `${lines.join('\n')}\n`;
}
