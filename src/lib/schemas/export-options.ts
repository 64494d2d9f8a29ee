/**
 * Options for every export (paper template, slot paths, fret table). One schema serves the API
 * query string, the command line and the Export panel: text values ("true", "10") are accepted
 * and converted, so the same rules and messages apply everywhere.
 */
import { z } from 'zod';
import { maxOverlapMm } from '~/lib/export/page-frame.ts';
import { PAPER_NAMES } from '~/lib/export/paper-sizes.ts';

export const EXPORT_FORMATS = ['pdf', 'dxf', 'svg', 'csv', 'json', 'gcode', 'cutlist', 'cutsheet'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

export const ORIENTATIONS = ['auto', 'portrait', 'landscape'] as const;
export const SLOT_STYLES = ['lines', 'outlines'] as const;
export const ORIGINS = ['nut-centre', 'lower-left'] as const;
/** G-code as LinuxCNC and GRBL read it; they differ in a few words (docs/exports.md, "G-code"). */
export const GCODE_DIALECTS = ['linuxcnc', 'grbl'] as const;
/** Where the machine's Z = 0 was touched off: the crown (centre line), or the treble edge at the nut. */
export const Z_ZEROS = ['crown', 'edge-at-nut'] as const;

/** Default overlap between tiled pages: 10 mm. */
export const DEFAULT_OVERLAP_MM = 10;

function fromText(value: unknown): unknown {
  if (typeof value !== 'string') return value;
  const text = value.trim().toLowerCase();
  if (text === 'true' || text === '1' || text === 'yes' || text === 'on') return true;
  if (text === 'false' || text === '0' || text === 'no' || text === 'off') return false;
  return value;
}

function numberFromText(value: unknown): unknown {
  if (typeof value !== 'string' || value.trim() === '') return value;
  const number = Number(value);
  return Number.isNaN(number) ? value : number;
}

const flag = z.preprocess(fromText, z.boolean({ invalid_type_error: 'must be true or false' }));

/** A G-code length or rate in the design's units; absent = the default converted (gcode-settings.ts). */
const designLength = (sign: 'positive' | 'nonNegative') => {
  const base = z.number({ invalid_type_error: "must be a number in the design's units" }).finite({ message: 'must be a finite number' });
  return z.preprocess(numberFromText, sign === 'positive' ? base.positive({ message: 'must be greater than 0' }) : base.nonnegative({ message: 'must not be negative' })).optional();
};

function choice<T extends readonly [string, ...string[]]>(values: T) {
  return z.enum(values, { errorMap: () => ({ message: `must be one of: ${values.join(', ')}` }) });
}

export const exportOptionsSchema = z
  .object({
    /**
     * pdf = paper template, dxf/svg = slot paths, csv = fret table, json = the computed layout,
     * gcode = slot toolpath, cutlist = fret wire cut list (CSV), cutsheet = the shop cut sheet (PDF).
     */
    format: choice(EXPORT_FORMATS).default('pdf'),
    /** Paper template sheet; `fit` is one sheet sized to the board. */
    paper: choice(PAPER_NAMES).default('letter'),
    /** `auto` picks the orientation that needs the fewest pages. */
    orientation: choice(ORIENTATIONS).default('auto'),
    /** Overlap between neighbouring tiled pages, in millimetres (also `fit` pages, when a board needs more than one). */
    overlap: z
      .preprocess(
        numberFromText,
        z
          .number({ invalid_type_error: 'must be a number of millimetres' })
          .finite({ message: 'must be a finite number of millimetres' })
          .nonnegative({ message: 'must not be negative' }),
      )
      .default(DEFAULT_OVERLAP_MM),
    /** Draw the string lines on the paper template. */
    strings: flag.default(false),
    /** Draw each slot's width as a band on the paper template. */
    kerf: flag.default(true),
    /** Mirror the paper template across the centre line, for templates glued face-down. */
    mirror: flag.default(false),
    /**
     * Draw the paper template on to the saddle. By default it stops at the board end, with a
     * saddle mark on each outer string giving its distance from the nut.
     */
    toSaddle: flag.default(false),
    /** Add a last page with each fret's distance from the nut along the treble edge, the bass edge and the centre line. */
    distances: flag.default(false),
    /** Fret table: start the CSV with a `#` comment line naming the board, revision and fingerprint (off: plain CSV for scripts). */
    sourceComment: flag.default(false),
    /** Slot paths: single lines, or closed outlines of the slot width. */
    slots: choice(SLOT_STYLES).default('lines'),
    /** Slot paths origin: the nut centre (board coordinates) or the board's lower-left corner. */
    origin: choice(ORIGINS).default('nut-centre'),
    /** G-code: the controller's dialect. */
    dialect: choice(GCODE_DIALECTS).default('linuxcnc'),
    /** G-code: where Z = 0 is. */
    zZero: choice(Z_ZEROS).default('crown'),
    /** G-code, in the design's units: cutter diameter (default the slot width). */
    toolDiameter: designLength('positive'),
    /** G-code, design units per minute: cutting and plunging feeds, and the rapid rate the time estimate assumes. */
    feed: designLength('positive'),
    plungeFeed: designLength('positive'),
    rapidRate: designLength('positive'),
    /** G-code: spindle speed, rpm. */
    spindle: z.preprocess(numberFromText, z.number({ invalid_type_error: 'must be a number of rpm' }).finite().positive({ message: 'must be greater than 0' })).optional(),
    /** G-code, design units: the height for moves between slots, above Z = 0. */
    safeZ: designLength('positive'),
    /** G-code, design units: the deepest cut of one pass. */
    passDepth: designLength('positive'),
    /** G-code, design units: how far the straight moves may leave the radiused slot bottom. */
    chordTolerance: designLength('positive'),
    /** G-code, design units: a dry run raises every Z by this much, so the cutter runs in the air (0 = a real cut). */
    dryRun: designLength('nonNegative'),
    /** Cut list, design units: the wire's stock length (default: the chosen fret wire's). */
    stockLength: designLength('positive'),
  })
  .strict()
  .superRefine((options, ctx) => {
    const limit = maxOverlapMm(options.paper);
    if (options.overlap >= limit) {
      ctx.addIssue({
        code: z.ZodIssueCode.custom,
        path: ['overlap'],
        message: `must be less than ${limit.toFixed(1)} mm on ${options.paper} paper`,
      });
    }
  });

export type ExportOptions = z.output<typeof exportOptionsSchema>;
export type ExportOptionsInput = z.input<typeof exportOptionsSchema>;

export const DEFAULT_EXPORT_OPTIONS: ExportOptions = exportOptionsSchema.parse({});

export interface OptionIssue {
  /** The option's name, e.g. "overlap", or the unknown option itself. */
  path: string;
  message: string;
}

export type OptionsValidation = { ok: true; options: ExportOptions } | { ok: false; issues: OptionIssue[] };

/** Validates options from a query string, the command line or a form; never throws. */
export function validateExportOptions(input: unknown): OptionsValidation {
  const result = exportOptionsSchema.safeParse(input);
  if (result.success) return { ok: true, options: result.data };
  return {
    ok: false,
    issues: result.error.issues.map((issue) => {
      if (issue.code === z.ZodIssueCode.unrecognized_keys) {
        return { path: issue.keys[0] ?? 'options', message: `unknown option (known: ${KNOWN_OPTIONS.join(', ')})` };
      }
      return { path: issue.path.join('.') || 'options', message: issue.message };
    }),
  };
}

const KNOWN_OPTIONS = Object.keys(exportOptionsSchema._def.schema.shape);
