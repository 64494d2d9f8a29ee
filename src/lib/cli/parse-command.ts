import { parseArgs } from 'node:util';
import { LAYOUT_FORMATS, isLayoutFormatName, type LayoutFormatName } from '~/lib/export/layout-formats';

/** What the command line was asked to do. New exports add formats in LAYOUT_FORMATS. */
export type KerflineCommand =
  | { kind: 'layout'; designPath: string; format: LayoutFormatName }
  | { kind: 'help' };

export type ParsedCommand = { ok: true; command: KerflineCommand } | { ok: false; message: string };

export const USAGE = [
  'Usage: kerfline layout <design.json> [--format csv|json]',
  '',
  '  layout   compute the fret layout of a design file and print it to stdout',
  `  --format one of: ${Object.keys(LAYOUT_FORMATS).join(', ')} (default csv)`,
].join('\n');

/** Parses the arguments after the program name; never throws. */
export function parseCommand(argv: readonly string[]): ParsedCommand {
  let parsed;
  try {
    parsed = parseArgs({
      args: [...argv],
      allowPositionals: true,
      options: { format: { type: 'string', short: 'f' }, help: { type: 'boolean', short: 'h' } },
    });
  } catch (error) {
    return { ok: false, message: error instanceof Error ? error.message : String(error) };
  }
  const [name, ...rest] = parsed.positionals;
  if (parsed.values.help === true || name === 'help') return { ok: true, command: { kind: 'help' } };
  if (name !== 'layout') {
    return { ok: false, message: name === undefined ? 'missing command' : `unknown command "${name}"` };
  }
  const [designPath, ...extra] = rest;
  if (designPath === undefined) return { ok: false, message: 'layout needs a design file' };
  if (extra.length > 0) return { ok: false, message: `unexpected argument "${extra[0]}"` };
  const format = parsed.values.format ?? 'csv';
  if (!isLayoutFormatName(format)) return { ok: false, message: `unknown format "${format}"` };
  return { ok: true, command: { kind: 'layout', designPath, format } };
}
