import { readFile, writeFile } from 'node:fs/promises';
import { layoutExportRefusal } from '~/lib/export/export-cost.ts';
import { exportDesign } from '~/lib/export/export-design.server.ts';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { MACHINE_SAFETY_NOTES, PRINT_CAUTION } from '~/lib/export/safety-note.ts';
import { validateDesign } from '~/lib/schemas/design.ts';
import { USAGE, parseCommand } from './parse-command.server.ts';
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
  const refusal = layoutExportRefusal(computeLayout(validation.design), command.options);
  if (refusal) {
    output.stderr(`kerfline: --${refusal.field}: ${refusal.message}\n`);
    return 2;
  }
  const file = await exportDesign(validation.design, command.options);
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
  if (format === 'dxf' || format === 'svg') output.stdout(`Caution: ${MACHINE_SAFETY_NOTES.join(' ')}\n`);
  return 0;
}

function reason(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
