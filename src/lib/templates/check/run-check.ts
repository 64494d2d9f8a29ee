/**
 * One Template check from what a person entered: measurements and tolerance in the unit they
 * chose, converted once here into the design's units. Used by the API (authoritative, saved), by
 * the page for an instant preview and by `kerfline check` on the command line.
 */
import { convertLength, type LengthUnit } from '~/lib/format/units.ts';
import type { Design } from '~/lib/schemas/design.ts';
import { compareTemplate, type CheckError, type CheckResult, type Measurement } from '~/lib/templates/check/compare.ts';
import type { MeasureLine } from '~/lib/templates/check/measure-lines.ts';
import { parseMeasurementsCsv, type CsvLineError } from '~/lib/templates/check/measurements-csv.ts';
import { checkReference } from '~/lib/templates/check/reference.ts';

export interface CheckInput {
  units: LengthUnit;
  tolerance: number;
  measurements: readonly Measurement[];
}

export type CheckOutcome =
  | { ok: true; result: CheckResult }
  | { ok: false; errors: CheckError[] }
  | { ok: false; csvErrors: CsvLineError[] };

export function runCheck(design: Design, input: CheckInput): CheckOutcome {
  const toDesign = (length: number) => convertLength(length, input.units, design.units);
  const measurements = input.measurements.map((m) => ({ ...m, fromNut: toDesign(m.fromNut) }));
  return compareTemplate(checkReference(design), measurements, toDesign(input.tolerance));
}

/** Settings of a CSV check: units and tolerance, and the line of rows that do not name one. */
export interface CsvCheckSettings {
  units: LengthUnit;
  tolerance: number;
  along: MeasureLine;
}

/**
 * Parses an uploaded CSV against the design's frets and strings, then checks it. A row the design
 * cannot check (a slot past the saddle) is reported by its line, like any other CSV error.
 */
export function runCsvCheck(design: Design, csv: string, settings: CsvCheckSettings): CheckOutcome {
  const parsed = parseMeasurementsCsv(csv, { frets: design.frets, strings: design.strings }, settings.along);
  if (!parsed.ok) return { ok: false, csvErrors: parsed.errors };
  const outcome = runCheck(design, { units: settings.units, tolerance: settings.tolerance, measurements: parsed.measurements });
  if (outcome.ok || !('errors' in outcome)) return outcome;
  return {
    ok: false,
    csvErrors: outcome.errors.map((error) => ({
      line: parsed.lines[Number(/^measurements\.(\d+)/.exec(error.field)?.[1])] ?? 1,
      message: `fret ${error.fret} along ${error.along}: ${error.message}`,
    })),
  };
}
