/**
 * Measured slot positions as CSV, read with csv-parse: `fret,from_nut` (every row along the line
 * the caller names), `fret,along,from_nut` (each row names its line: treble-edge, bass-edge,
 * centre-line or string-N) or the older `fret,string,from_nut` (along string N). The header line
 * is optional; without it the column count (and whether the second cell is a number) decides.
 * Cells may be quoted. The separator is a comma, or a semicolon when the first non-empty line
 * has one, as spreadsheets write in locales with a decimal comma; with `;` a decimal comma is
 * read as a point (`12,5` = 12.5). A byte order mark and blank lines are skipped. Lengths are in
 * whatever unit the user chose.
 */
// csv-parse's browser build of its sync API: this file also runs in the check panel, and the Node
// build reads the global Buffer, which browsers lack.
import { CsvError, parse } from 'csv-parse/browser/esm/sync';
import type { Measurement } from '~/lib/templates/check/compare.ts';
import { measureLines, parseMeasureLine, type MeasureLine } from '~/lib/templates/check/measure-lines.ts';

/** Largest CSV accepted: 64 KiB. */
export const MEASUREMENTS_CSV_MAX_BYTES = 64 * 1024;

export interface CsvLineError {
  /** 1-based line number in the file. */
  line: number;
  message: string;
}

export interface CsvLimits {
  frets: number;
  strings: number;
}

/** `lines[i]` is the 1-based line of `measurements[i]`, so later checks can name it. */
export type CsvParse = { ok: true; measurements: Measurement[]; lines: number[] } | { ok: false; errors: CsvLineError[] };

type Column = 'fret' | 'string' | 'along' | 'from_nut';

const HEADERS: Record<string, readonly Column[]> = {
  'fret,from_nut': ['fret', 'from_nut'],
  'fret,along,from_nut': ['fret', 'along', 'from_nut'],
  'fret,string,from_nut': ['fret', 'string', 'from_nut'],
};

/** At most this many errors are reported, so a wrong file does not flood the screen. */
const MAX_ERRORS = 20;

/** `;` when the first non-empty line has one, else `,`. */
function separatorOf(text: string): ',' | ';' {
  const first = text.split(/\r\n|\n|\r/).find((line) => line.trim() !== '') ?? '';
  return first.includes(';') ? ';' : ',';
}

type Row = { line: number; cells: string[] };

function readRows(text: string, separator: ',' | ';'): { ok: true; rows: Row[] } | { ok: false; error: CsvLineError } {
  try {
    const records = parse(text, { bom: true, delimiter: separator, info: true, relax_column_count: true, skip_empty_lines: true, trim: true }) as unknown as {
      info: { lines: number };
      record: string[];
    }[];
    return { ok: true, rows: records.map(({ info, record }) => ({ line: info.lines, cells: record.map((cell) => cell.trim()) })) };
  } catch (error) {
    if (!(error instanceof CsvError)) throw error;
    const line = (error as CsvError & { lines?: number }).lines ?? 0;
    const message = error.code === 'CSV_QUOTE_NOT_CLOSED' ? 'a quoted cell is not closed' : `the file cannot be read as CSV (${error.code})`;
    return { ok: false, error: { line, message } };
  }
}

/**
 * Parses measured positions; every problem is reported with its line number and the reason.
 * `along` is the line for rows that do not name one (`fret,from_nut`).
 */
export function parseMeasurementsCsv(text: string, limits: CsvLimits, along: MeasureLine): CsvParse {
  if (new TextEncoder().encode(text).byteLength > MEASUREMENTS_CSV_MAX_BYTES) {
    return { ok: false, errors: [{ line: 0, message: `the file is larger than ${MEASUREMENTS_CSV_MAX_BYTES / 1024} KiB` }] };
  }
  const separator = separatorOf(text.replace(/^\uFEFF/, ''));
  const read = readRows(text, separator);
  if (!read.ok) return { ok: false, errors: [read.error] };
  const errors: CsvLineError[] = [];
  const measurements: Measurement[] = [];
  const measuredOn: number[] = [];
  const seen = new Set<string>();
  let columns: readonly Column[] | null = null;

  for (const { line, cells } of read.rows) {
    if (errors.length >= MAX_ERRORS) break;
    if (cells.every((cell) => cell === '')) continue;
    if (columns === null) {
      const header = HEADERS[cells.join(',').toLowerCase()];
      if (header) {
        columns = header;
        continue;
      }
      if (!/^[+-]?\d/.test(cells[0] ?? '')) {
        errors.push({ line, message: `unknown header "${cells.join(separator)}"; use "fret,from_nut", "fret,along,from_nut" or "fret,string,from_nut"` });
        return { ok: false, errors };
      }
      columns = cells.length < 3 ? HEADERS['fret,from_nut']! : /^[+-]?\d/.test(cells[1] ?? '') ? HEADERS['fret,string,from_nut']! : HEADERS['fret,along,from_nut']!;
    }
    const row = parseRow(cells, columns, limits, along, separator);
    if ('message' in row) {
      errors.push({ line, message: row.message });
      continue;
    }
    const key = `${row.fret}/${row.along}`;
    if (seen.has(key)) {
      errors.push({ line, message: `duplicate fret: fret ${row.fret}${duplicateWhere(columns, row.along)} is already listed` });
      continue;
    }
    seen.add(key);
    measurements.push(row);
    measuredOn.push(line);
  }
  if (errors.length > 0) return { ok: false, errors };
  if (measurements.length === 0) return { ok: false, errors: [{ line: 1, message: 'no measurements found' }] };
  return { ok: true, measurements, lines: measuredOn };
}

function duplicateWhere(columns: readonly Column[], along: MeasureLine): string {
  if (columns.includes('string')) return ` on string ${along.slice('string-'.length)}`;
  return columns.includes('along') ? ` along ${along}` : '';
}

/** A number cell; with `;` separators a decimal comma reads as a decimal point. */
function numberOf(cell: string, separator: ',' | ';'): number {
  if (cell === '') return Number.NaN;
  return Number(separator === ';' ? cell.replace(',', '.') : cell);
}

function parseRow(
  cells: readonly string[],
  columns: readonly Column[],
  limits: CsvLimits,
  defaultAlong: MeasureLine,
  separator: ',' | ';',
): Measurement | { message: string } {
  if (cells.length < columns.length) {
    return { message: `missing column "${columns[cells.length]}" (expected ${columns.join(',')})` };
  }
  if (cells.length > columns.length) return { message: `too many columns (expected ${columns.join(',')})` };
  const values: Partial<Record<Column, number>> = {};
  let along = defaultAlong;
  for (const [i, name] of columns.entries()) {
    const cell = cells[i] ?? '';
    if (name === 'along') {
      const line = parseMeasureLine(cell, limits.strings);
      if (!line) return { message: `along "${cell}" is not a line of this board (use ${measureLines(limits.strings).slice(0, 3).join(', ')} or string-1 to string-${limits.strings})` };
      along = line;
      continue;
    }
    const value = numberOf(cell, separator);
    if (!Number.isFinite(value)) return { message: `${name} "${cell}" is not a number` };
    values[name] = value;
  }
  const fret = values.fret!;
  if (!Number.isInteger(fret) || fret < 1 || fret > limits.frets) {
    return { message: `fret out of range: ${fret} (frets are 1 to ${limits.frets})` };
  }
  const string = values.string;
  if (string !== undefined) {
    if (!Number.isInteger(string) || string < 1 || string > limits.strings) {
      return { message: `string out of range: ${string} (strings are 1 = treble to ${limits.strings} = bass)` };
    }
    along = `string-${string}`;
  }
  const fromNut = values.from_nut!;
  if (fromNut <= 0) return { message: `from_nut must be greater than 0 (got ${fromNut})` };
  return { fret, along, fromNut };
}
