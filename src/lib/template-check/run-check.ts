/**
 * One Template check from what a person entered: measurements and tolerance in the unit they
 * chose, converted once here into the design's units. Used by the API (authoritative, saved) and
 * by the page for an instant preview.
 */
import { convertLength, type LengthUnit } from '~/lib/format/units';
import type { Design } from '~/lib/schemas/design';
import { compareTemplate, type CheckError, type CheckResult, type Measurement } from './compare';
import { parseMeasurementsCsv, type CsvLineError } from './measurements-csv';
import { checkReference } from './reference';

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

/** Parses an uploaded CSV against the design's frets and strings, then checks it. */
export function runCsvCheck(design: Design, csv: string, settings: { units: LengthUnit; tolerance: number }): CheckOutcome {
  const parsed = parseMeasurementsCsv(csv, { frets: design.frets, strings: design.strings });
  if (!parsed.ok) return { ok: false, csvErrors: parsed.errors };
  return runCheck(design, { ...settings, measurements: parsed.measurements });
}
