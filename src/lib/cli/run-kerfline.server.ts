import { readFile, writeFile } from 'node:fs/promises';
import { layoutExportRefusal } from '~/lib/export/export-cost.ts';
import { exportDesign } from '~/lib/export/export-design.server.ts';
import { DRY_RUN_NOTE, MACHINE_SAFETY_NOTES, PRINT_CAUTION } from '~/lib/export/safety-note.ts';
import { designToolpath, exportOptionIssues } from '~/lib/export/gcode-checks.ts';
import { runTime } from '~/lib/export/gcode-plan.ts';
import { computeLayout, type Layout } from '~/lib/geometry/layout.ts';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';
import type { ExportOptions } from '~/lib/schemas/export-options.ts';
import { flagName, USAGE, parseCommand } from './parse-command.server.ts';
import { runCheckCommand } from './run-check-command.server.ts';

export interface CliOutput {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
}

/**
 * Exit codes of `layout`: 0 done, 1 bad design or unreadable/unwritable file, 2 bad command line
 * (an export over a cap in docs/exports.md "Limits" included: the message names the flag to
 * change). `check` has its own (run-check-command.server.ts: 0 pass, 1 fail, 2 bad input).
 * Runs in this process: the server's worker pool is for keeping a web server answering.
 */
export async function runKerfline(argv: readonly string[], output: CliOutput): Promise<number> {
  const parsed = parseCommand(argv);
  if (!parsed.ok) {
    output.stderr(`kerfline: ${parsed.message}\n${USAGE}\n`);
    return 2;
  }
  const { command } = parsed;
  if (command.kind === 'help') {
    output.stdout(`${USAGE}\n`);
    return 0;
  }
  if (command.kind === 'check') return runCheckCommand(command, output);
  let input: unknown;
  try {
    input = JSON.parse(await readFile(command.designPath, 'utf8')) as unknown;
  } catch (error) {
    output.stderr(`kerfline: cannot read design ${command.designPath}: ${reason(error)}\n`);
    return 1;
  }
  const validation = validateDesign(input);
  if (!validation.ok) {
    const lines = validation.issues.map((issue) => `${issue.path}: ${issue.message}`);
    output.stderr(`kerfline: invalid design ${command.designPath}\n${lines.join('\n')}\n`);
    return 1;
  }
  const layout = computeLayout(validation.design);
  const issue = exportOptionIssues(validation.design, layout, command.options)[0];
  if (issue) {
    output.stderr(`kerfline: --${flagName(issue.path)}: ${issue.message}\n`);
    return 2;
  }
  const refusal = layoutExportRefusal(layout, command.options, validation.design);
  if (refusal) {
    output.stderr(`kerfline: --${refusal.field}: ${refusal.message}\n`);
    return 2;
  }
  const file = await exportDesign(validation.design, command.options);
  if (command.options.format === 'gcode') reportRunTime(validation.design, layout, command.options, output);
  if (command.out === null) {
    output.stdout(new TextDecoder().decode(file.bytes));
    return 0;
  }
  try {
    await writeFile(command.out, file.bytes);
  } catch (error) {
    output.stderr(`kerfline: cannot write ${command.out}: ${reason(error)}\n`);
    return 1;
  }
  output.stdout(`Wrote ${command.out} (${file.bytes.byteLength} bytes)\n`);
  const format = command.options.format;
  if (format === 'pdf') output.stdout(`${PRINT_CAUTION}\n`);
  if (format === 'dxf' || format === 'svg' || format === 'gcode') output.stdout(`Caution: ${MACHINE_SAFETY_NOTES.join(' ')}\n`);
  if (format === 'gcode') output.stdout(`Caution: ${DRY_RUN_NOTE}\n`);
  return 0;
}

/** The estimate goes to stderr so stdout stays the file when no --out is given. */
function reportRunTime(design: Design, layout: Layout, options: ExportOptions, output: CliOutput): void {
  const planned = designToolpath(design, layout, options);
  if (!planned.ok) return;
  const time = runTime(planned.plan);
  output.stderr(
    `Estimated run time ${time.total.toFixed(1)} min (cutting ${time.cutting.toFixed(1)}, plunging ${time.plunging.toFixed(1)}, rapids ${time.rapid.toFixed(1)}; ` +
      `${planned.plan.moves.length} moves, acceleration ignored)\n`,
  );
}

function reason(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
