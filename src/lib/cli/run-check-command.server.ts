/**
 * `kerfline check DESIGN.json MEASUREMENTS.csv`: the Template check a shop can script. The same
 * code path as the web check (runCsvCheck); measurements and tolerance are in the design's units.
 * Exit codes: 0 every slot within tolerance, 1 any slot outside, 2 bad input (the file and line
 * at fault on stderr).
 */
import { readFile } from 'node:fs/promises';
import { formatLength } from '~/lib/format/units.ts';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';
import { defaultTolerance, type CheckResult } from '~/lib/templates/check/compare.ts';
import { parseMeasureLine } from '~/lib/templates/check/measure-lines.ts';
import { runCsvCheck } from '~/lib/templates/check/run-check.ts';
import type { KerflineCommand } from './parse-command.server.ts';

type CheckCommand = Extract<KerflineCommand, { kind: 'check' }>;

export interface CheckOutput {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
}

export const CHECK_EXIT = { passed: 0, failed: 1, badInput: 2 } as const;

export async function runCheckCommand(command: CheckCommand, output: CheckOutput): Promise<number> {
  const fail = (message: string) => {
    output.stderr(`kerfline: ${message}\n`);
    return CHECK_EXIT.badInput;
  };
  const design = await readDesign(command.designPath);
  if (!design.ok) return fail(design.message);
  let csv: string;
  try {
    csv = await readFile(command.measurementsPath, 'utf8');
  } catch (error) {
    return fail(`cannot read measurements ${command.measurementsPath}: ${reason(error)}`);
  }
  const along = parseMeasureLine(command.along, design.design.strings);
  if (!along) return fail(`--along: the board has no line "${command.along}" (strings are 1 to ${design.design.strings})`);
  const units = design.design.units;
  const tolerance = command.tolerance ?? defaultTolerance('hand', units);
  const outcome = runCsvCheck(design.design, csv, { units, tolerance, along });
  if (!outcome.ok) {
    const lines = 'csvErrors' in outcome ? outcome.csvErrors.map((e) => `${command.measurementsPath}:${e.line}: ${e.message}`) : outcome.errors.map((e) => `${e.field}: ${e.message}`);
    return fail(`cannot check ${command.measurementsPath}\n${lines.join('\n')}`);
  }
  const { result } = outcome;
  output.stdout(command.format === 'json' ? `${JSON.stringify(checkJson(result))}\n` : checkText(result));
  return result.passed ? CHECK_EXIT.passed : CHECK_EXIT.failed;
}

async function readDesign(path: string): Promise<{ ok: true; design: Design } | { ok: false; message: string }> {
  let input: unknown;
  try {
    input = JSON.parse(await readFile(path, 'utf8')) as unknown;
  } catch (error) {
    return { ok: false, message: `cannot read design ${path}: ${reason(error)}` };
  }
  const validation = validateDesign(input);
  if (validation.ok) return validation;
  return { ok: false, message: `invalid design ${path}\n${validation.issues.map((issue) => `${issue.path}: ${issue.message}`).join('\n')}` };
}

/** The machine-readable verdict: lengths unrounded, in the design's units. */
export function checkJson(result: CheckResult) {
  return {
    passed: result.passed,
    units: result.units,
    tolerance: result.tolerance,
    failing: result.failing,
    worstDeviation: result.worstDeviation,
    worstCents: result.worstCents,
    summary: result.summary,
    slots: result.slots.map((s) => ({
      fret: s.fret,
      along: s.along,
      expected: s.designFromNut,
      measured: s.measuredFromNut,
      deviation: s.deviation,
      cents: s.cents,
      withinTolerance: s.withinTolerance,
    })),
    fits: result.fits.map((f) => ({ along: f.along, designScaleLength: f.designScaleLength, scaleLength: f.scale.scaleLength, maxAbsResidual: f.scale.maxAbsResidual })),
    diagnoses: result.diagnoses,
  };
}

function checkText(result: CheckResult): string {
  const { units } = result;
  const rows = result.slots.map((s) =>
    [String(s.fret).padStart(4), s.along.padEnd(12), formatLength(s.designFromNut, units).padStart(10), formatLength(s.measuredFromNut, units).padStart(10), formatLength(s.deviation, units).padStart(9), s.cents.toFixed(1).padStart(6), s.withinTolerance ? 'yes' : 'NO'].join('  '),
  );
  const header = ['fret', 'along       ', '  expected', '  measured', 'deviation', ' cents', 'within'].join('  ');
  return `${result.summary}\n\n${header}\n${rows.join('\n')}\n(${units}; deviation = measured - expected, + = toward the bridge)\n`;
}

function reason(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
