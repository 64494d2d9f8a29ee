import { readFile } from 'node:fs/promises';
import { LAYOUT_FORMATS } from '~/lib/export/layout-formats';
import { computeLayout } from '~/lib/geometry/layout';
import { validateDesign } from '~/lib/schemas/design';
import { USAGE, parseCommand } from './parse-command';

export interface CliOutput {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
}

/** Exit codes: 0 done, 1 bad design or unreadable file, 2 bad command line. */
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
  let input: unknown;
  try {
    input = JSON.parse(await readFile(command.designPath, 'utf8')) as unknown;
  } catch (error) {
    const why = error instanceof Error ? error.message : String(error);
    output.stderr(`kerfline: cannot read design ${command.designPath}: ${why}\n`);
    return 1;
  }
  const validation = validateDesign(input);
  if (!validation.ok) {
    const lines = validation.issues.map((issue) => `${issue.path}: ${issue.message}`);
    output.stderr(`kerfline: invalid design ${command.designPath}\n${lines.join('\n')}\n`);
    return 1;
  }
  const rendered = LAYOUT_FORMATS[command.format].render(computeLayout(validation.design));
  output.stdout(command.format === 'json' ? `${rendered}\n` : rendered);
  return 0;
}
