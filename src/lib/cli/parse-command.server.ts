import { parseArgs } from 'node:util';
import { EXPORT_FORMATS, validateExportOptions, type ExportOptions } from '~/lib/schemas/export-options';
import { PAPER_NAMES } from '~/lib/export/paper-sizes';

/** What the command line was asked to do. */
export type KerflineCommand =
  | { kind: 'layout'; designPath: string; options: ExportOptions; out: string | null }
  | { kind: 'help' };

export type ParsedCommand = { ok: true; command: KerflineCommand } | { ok: false; message: string };

export const USAGE = [
  `Usage: kerfline layout <design.json> [--format ${EXPORT_FORMATS.join('|')}] [--out <file>] [options]`,
  '',
  '  layout   compute the fret layout of a design file and export it',
  `  --format       ${EXPORT_FORMATS.join(', ')} (default csv): pdf = paper template,`,
  '                 dxf/svg = slot paths, csv = fret table, json = the computed layout',
  '  --out <file>   write to this file instead of stdout (required for pdf)',
  '',
  '  Paper template (pdf):',
  `  --paper        ${PAPER_NAMES.join(', ')} (default letter; fit = one sheet sized to the board)`,
  '  --orientation  auto, portrait, landscape (default auto: fewest pages)',
  '  --overlap      overlap between tiled pages in mm (default 10)',
  '  --strings      draw the strings          --no-kerf  leave out the slot-width bands',
  '  --mirror       mirror for a template glued face-down',
  '  Slot paths (dxf, svg):',
  '  --slots        lines, outlines (default lines; outlines = closed outlines of the slot width)',
  '  --origin       nut-centre, lower-left (default nut-centre)',
].join('\n');

const OPTION_FLAGS = {
  format: { type: 'string', short: 'f' },
  out: { type: 'string', short: 'o' },
  paper: { type: 'string' },
  orientation: { type: 'string' },
  overlap: { type: 'string' },
  strings: { type: 'boolean' },
  kerf: { type: 'boolean' },
  mirror: { type: 'boolean' },
  slots: { type: 'string' },
  origin: { type: 'string' },
  help: { type: 'boolean', short: 'h' },
} as const;

/** Parses the arguments after the program name; never throws. */
export function parseCommand(argv: readonly string[]): ParsedCommand {
  let parsed;
  try {
    parsed = parseArgs({ args: [...argv], allowPositionals: true, allowNegative: true, options: OPTION_FLAGS });
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
  const { out, help: _help, ...values } = parsed.values;
  const options = validateExportOptions({ format: 'csv', ...values });
  if (!options.ok) {
    const first = options.issues[0];
    return { ok: false, message: `--${first?.path}: ${first?.message}` };
  }
  if (options.options.format === 'pdf' && out === undefined) {
    return { ok: false, message: 'a pdf is binary: give --out <file>' };
  }
  return { ok: true, command: { kind: 'layout', designPath, options: options.options, out: out ?? null } };
}
