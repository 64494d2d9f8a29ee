/**
 * Measured slot positions as CSV: `fret,from_nut` (one edge) or `fret,string,from_nut` (per edge
 * of a fanned template, string 1 = treble edge). The header line is optional; without it the
 * column count decides. Blank lines are skipped. Lengths are in whatever unit the user chose.
 */
import type { Measurement } from './compare';

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

export type CsvParse = { ok: true; measurements: Measurement[] } | { ok: false; errors: CsvLineError[] };

const HEADERS: Record<string, readonly string[]> = {
  'fret,from_nut': ['fret', 'from_nut'],
  'fret,string,from_nut': ['fret', 'string', 'from_nut'],
};

/** At most this many errors are reported, so a wrong file does not flood the screen. */
const MAX_ERRORS = 20;

/** Parses measured positions; every problem is reported with its line number and the reason. */
export function parseMeasurementsCsv(text: string, limits: CsvLimits): CsvParse {
  if (new TextEncoder().encode(text).byteLength > MEASUREMENTS_CSV_MAX_BYTES) {
    return { ok: false, errors: [{ line: 0, message: `the file is larger than ${MEASUREMENTS_CSV_MAX_BYTES / 1024} KiB` }] };
  }
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
  const errors: CsvLineError[] = [];
  const measurements: Measurement[] = [];
  const seen = new Set<string>();
  let columns: readonly string[] | null = null;

  for (let index = 0; index < lines.length && errors.length < MAX_ERRORS; index++) {
    const line = index + 1;
    const raw = lines[index]!.trim();
    if (raw === '') continue;
    const cells = raw.split(',').map((cell) => cell.trim());
    if (columns === null) {
      const header = HEADERS[cells.join(',').toLowerCase()];
      if (header) {
        columns = header;
        continue;
      }
      if (!/^[+-]?\d/.test(cells[0] ?? '')) {
        errors.push({ line, message: `unknown header "${raw}"; use "fret,from_nut" or "fret,string,from_nut"` });
        return { ok: false, errors };
      }
      columns = cells.length >= 3 ? HEADERS['fret,string,from_nut']! : HEADERS['fret,from_nut']!;
    }
    const row = parseRow(cells, columns, limits);
    if ('message' in row) {
      errors.push({ line, message: row.message });
      continue;
    }
    const key = `${row.fret}/${row.string}`;
    if (seen.has(key)) {
      const where = columns.length === 3 ? ` on string ${row.string}` : '';
      errors.push({ line, message: `duplicate fret: fret ${row.fret}${where} is already listed` });
      continue;
    }
    seen.add(key);
    measurements.push(row);
  }
  if (errors.length > 0) return { ok: false, errors };
  if (measurements.length === 0) return { ok: false, errors: [{ line: 1, message: 'no measurements found' }] };
  return { ok: true, measurements };
}

function parseRow(cells: readonly string[], columns: readonly string[], limits: CsvLimits): Measurement | { message: string } {
  if (cells.length < columns.length) {
    return { message: `missing column "${columns[cells.length]}" (expected ${columns.join(',')})` };
  }
  if (cells.length > columns.length) return { message: `too many columns (expected ${columns.join(',')})` };
  const values: Record<string, number> = {};
  for (const [i, name] of columns.entries()) {
    const cell = cells[i] ?? '';
    const value = cell === '' ? Number.NaN : Number(cell);
    if (!Number.isFinite(value)) return { message: `${name} "${cell}" is not a number` };
    values[name] = value;
  }
  const fret = values['fret']!;
  if (!Number.isInteger(fret) || fret < 1 || fret > limits.frets) {
    return { message: `fret out of range: ${fret} (frets are 1 to ${limits.frets})` };
  }
  const string = values['string'] ?? 1;
  if (!Number.isInteger(string) || string < 1 || string > limits.strings) {
    return { message: `string out of range: ${string} (strings are 1 = treble to ${limits.strings} = bass)` };
  }
  const fromNut = values['from_nut']!;
  if (fromNut <= 0) return { message: `from_nut must be greater than 0 (got ${fromNut})` };
  return { fret, string, fromNut };
}
