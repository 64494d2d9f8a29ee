import { parseArgs } from 'node:util';
import { EXPORT_FORMATS, GCODE_DIALECTS, Z_ZEROS, validateExportOptions, type ExportOptions } from '~/lib/schemas/export-options.ts';
import { DEFAULT_SPINDLE_RPM, GCODE_DEFAULTS_MM } from '~/lib/export/gcode-settings.ts';
import { PAPER_NAMES } from '~/lib/export/paper-sizes.ts';
import { EDGE_AND_CENTRE_LINES, parseMeasureLine, type MeasureLine } from '~/lib/templates/check/measure-lines.ts';

/** Output forms of `kerfline check`. */
export const CHECK_FORMATS = ['text', 'json'] as const;
export type CheckFormat = (typeof CHECK_FORMATS)[number];

/** What the command line was asked to do. */
export type KerflineCommand =
  | { kind: 'layout'; designPath: string; options: ExportOptions; out: string | null }
  | {
      kind: 'check';
      designPath: string;
      measurementsPath: string;
      /** The line of rows that name none (whether the board has it is checked with the design). */
      along: MeasureLine;
      /** In the design's units; null = the hand-sawn default. */
      tolerance: number | null;
      format: CheckFormat;
    }
  | { kind: 'help' };

export type ParsedCommand = { ok: true; command: KerflineCommand } | { ok: false; message: string };

export const USAGE = [
  `Usage: kerfline layout <design.json> [--format ${EXPORT_FORMATS.join('|')}] [--out <file>] [options]`,
  `       kerfline check <design.json> <measurements.csv> [--along <line>] [--tolerance <t>] [--format ${CHECK_FORMATS.join('|')}]`,
  '',
  '  layout   compute the fret layout of a design file and export it',
  `  --format       ${EXPORT_FORMATS.join(', ')} (default csv): pdf = paper template,`,
  '                 dxf/svg = slot paths, csv = fret table, json = the computed layout',
  '                 gcode = slot toolpath, cutlist = fret wire cut list (CSV), cutsheet = shop cut sheet (PDF)',
  '  --out <file>   write to this file instead of stdout (required for pdf and cutsheet)',
  '',
  '  Paper template (pdf):',
  `  --paper        ${PAPER_NAMES.join(', ')} (default letter; fit = one sheet sized to the board)`,
  '  --orientation  auto, portrait, landscape (default auto: fewest pages)',
  '  --overlap      overlap between tiled pages in mm (default 10)',
  '  --strings      draw the strings          --no-kerf  leave out the slot-width bands',
  '  --mirror       mirror for a template glued face-down',
  '  --to-saddle    draw on to the saddle (default: the board only, with a saddle mark on each outer string)',
  '  --distances    add a last page of fret distances along the edges and the centre line',
  '  Slot paths (dxf, svg):',
  '  --slots        lines, outlines (default lines; outlines = closed outlines of the slot width)',
  '  --origin       nut-centre, lower-left (default nut-centre; also for gcode)',
  "  Slot toolpath (gcode); lengths in the design's units, feeds in its units per minute,",
  '  defaults given in mm and converted for a design in inches (the estimate goes to stderr):',
  `  --dialect          ${GCODE_DIALECTS.join(', ')} (default linuxcnc)`,
  `  --z-zero           ${Z_ZEROS.join(', ')} (default crown: the board top on the centre line)`,
  '  --tool-diameter    cutter diameter (default the slot width; wider is refused, narrower adds offset passes)',
  `  --feed             cutting feed (default ${GCODE_DEFAULTS_MM.feed} mm/min)   --plunge-feed  (default ${GCODE_DEFAULTS_MM.plungeFeed} mm/min)`,
  `  --spindle          rpm (default ${DEFAULT_SPINDLE_RPM})              --safe-z  above Z zero (default ${GCODE_DEFAULTS_MM.safeZ} mm)`,
  `  --pass-depth       deepest cut per pass (default ${GCODE_DEFAULTS_MM.passDepth} mm)`,
  `  --chord-tolerance  straight moves stay this close to the radiused slot bottom (default ${GCODE_DEFAULTS_MM.chordTolerance} mm)`,
  '  --dry-run <h>      raise every Z by h so the cutter cuts only air (default 0: a real cut)',
  `  --rapid-rate       for the time estimate only (default ${GCODE_DEFAULTS_MM.rapidRate} mm/min)`,
  '  Cut list (cutlist, cutsheet):',
  "  --stock-length     wire stock length in the design's units (default: none; the Export panel uses the board's fret wire)",
  '',
  '  check    compare measured slot positions of a template with the design (Template check)',
  '  CSV columns    fret,from_nut (along --along) or fret,along,from_nut; comma or semicolon separated,',
  "                 lengths in the design's units from the nut line (or zero fret) the template marks",
  `  --along        ${EDGE_AND_CENTRE_LINES.join(', ')} or string-N (default centre-line)`,
  "  --tolerance    +/- in the design's units (default 0.1 mm, hand-sawn, common practice)",
  '  --format       text, json (default text)',
  '  Exit status: 0 every slot within tolerance, 1 any slot outside, 2 bad input.',
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
  'to-saddle': { type: 'boolean' },
  distances: { type: 'boolean' },
  slots: { type: 'string' },
  origin: { type: 'string' },
  dialect: { type: 'string' },
  'z-zero': { type: 'string' },
  'tool-diameter': { type: 'string' },
  feed: { type: 'string' },
  'plunge-feed': { type: 'string' },
  'rapid-rate': { type: 'string' },
  spindle: { type: 'string' },
  'safe-z': { type: 'string' },
  'pass-depth': { type: 'string' },
  'chord-tolerance': { type: 'string' },
  'dry-run': { type: 'string' },
  'stock-length': { type: 'string' },
  along: { type: 'string' },
  tolerance: { type: 'string' },
  help: { type: 'boolean', short: 'h' },
} as const;

type Values = ReturnType<typeof parseArgs<{ args: string[]; allowPositionals: true; allowNegative: true; options: typeof OPTION_FLAGS }>>['values'];

/** Flags that belong to one command only. */
const CHECK_ONLY = ['along', 'tolerance'] as const;
const LAYOUT_ONLY = [
  'out', 'paper', 'orientation', 'overlap', 'strings', 'kerf', 'mirror', 'to-saddle', 'distances', 'slots', 'origin',
  'dialect', 'z-zero', 'tool-diameter', 'feed', 'plunge-feed', 'rapid-rate', 'spindle', 'safe-z', 'pass-depth', 'chord-tolerance', 'dry-run', 'stock-length',
] as const;

/** The option's name as a flag: toolDiameter → tool-diameter. */
export function flagName(option: string): string {
  return option.replace(/[A-Z]/g, (letter) => `-${letter.toLowerCase()}`);
}

/** The flag's name as an option: tool-diameter → toolDiameter. */
function optionName(flag: string): string {
  return flag.replace(/-([a-z])/g, (_, letter: string) => letter.toUpperCase());
}

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
  if (name === 'check') return parseCheck(rest, parsed.values);
  if (name !== 'layout') {
    return { ok: false, message: name === undefined ? 'missing command' : `unknown command "${name}"` };
  }
  const [designPath, ...extra] = rest;
  if (designPath === undefined) return { ok: false, message: 'layout needs a design file' };
  if (extra.length > 0) return { ok: false, message: `unexpected argument "${extra[0]}"` };
  const foreign = CHECK_ONLY.find((flag) => parsed.values[flag] !== undefined);
  if (foreign) return { ok: false, message: `--${foreign} belongs to the check command` };
  const { out, help: _help, along: _along, tolerance: _tolerance, ...values } = parsed.values;
  const named = Object.fromEntries(Object.entries(values).map(([flag, value]) => [optionName(flag), value]));
  const options = validateExportOptions({ format: 'csv', ...named });
  if (!options.ok) {
    const first = options.issues[0];
    return { ok: false, message: `--${flagName(first?.path ?? 'format')}: ${first?.message}` };
  }
  if ((options.options.format === 'pdf' || options.options.format === 'cutsheet') && out === undefined) {
    return { ok: false, message: `a ${options.options.format} is a PDF (binary): give --out <file>` };
  }
  return { ok: true, command: { kind: 'layout', designPath, options: options.options, out: out ?? null } };
}

function parseCheck(positionals: readonly string[], values: Values): ParsedCommand {
  const [designPath, measurementsPath, ...extra] = positionals;
  if (designPath === undefined || measurementsPath === undefined) return { ok: false, message: 'check needs a design file and a measurements CSV' };
  if (extra.length > 0) return { ok: false, message: `unexpected argument "${extra[0]}"` };
  const foreign = LAYOUT_ONLY.find((flag) => values[flag] !== undefined);
  if (foreign) return { ok: false, message: `--${foreign} belongs to the layout command` };
  const format = values.format ?? 'text';
  if (!(CHECK_FORMATS as readonly string[]).includes(format)) return { ok: false, message: `--format: must be ${CHECK_FORMATS.join(' or ')}` };
  // Any string number is allowed here; the design says how many strings there are.
  const along = parseMeasureLine(values.along ?? 'centre-line', Number.MAX_SAFE_INTEGER);
  if (!along) return { ok: false, message: `--along: must be ${EDGE_AND_CENTRE_LINES.join(', ')} or string-N` };
  let tolerance: number | null = null;
  if (values.tolerance !== undefined) {
    tolerance = Number(values.tolerance);
    if (values.tolerance.trim() === '' || !Number.isFinite(tolerance) || tolerance <= 0) {
      return { ok: false, message: '--tolerance: must be a number greater than 0' };
    }
  }
  return { ok: true, command: { kind: 'check', designPath, measurementsPath, along, tolerance, format: format as CheckFormat } };
}
