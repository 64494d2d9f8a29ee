import { z } from 'zod';
import { formatLength } from '~/lib/format/units.ts';
import { boardSurface, radiusTooSmall } from '~/lib/geometry/board-radius.ts';
import { computeLayout, type Layout } from '~/lib/geometry/layout.ts';
import { parseScl } from '~/lib/geometry/scala.ts';
import { COUNT_ROWS, fieldShape, fieldValues, magnitudeProblems, maxLengthMm } from './design-fields.ts';

/**
 * The design: everything needed to lay out one fretboard. The required field names are part of
 * the public API (HTTP and CLI). Every length is in the design's `units`.
 * The plain fields (counts, lengths, flags) come from the field table in design-fields.ts, with
 * their defaults (chosen in mm and converted when the design is in inches), so a parsed `Design`
 * has every field present. This file adds what is not a plain field: name, units, temperament,
 * markers, and the checks that need several fields at once.
 */

const countRow = (path: 'strings' | 'frets') => COUNT_ROWS.find((row) => row.path === path) as { min: number; max: number };

export const DESIGN_LIMITS = {
  nameMaxChars: 120,
  minStrings: countRow('strings').min,
  maxStrings: countRow('strings').max,
  minFrets: countRow('frets').min,
  maxFrets: countRow('frets').max,
  maxDivisions: 1024,
  maxSclChars: 65_536,
  /** Upper limits in millimetres (from the field table); converted for designs in inches. */
  mm: {
    length: maxLengthMm('scale.treble'),
    slotWidth: maxLengthMm('slot.width'),
  },
} as const;

/** Largest design, as JSON text, the API reads (POST /api/layout and POST /api/export). */
export const DESIGN_JSON_MAX_BYTES = 64 * 1024;

/** Side dot and inlay frets, common practice: 3, 5, 7, 9, 12 (double), 15, 17, 19, 21, 24. */
export const DEFAULT_MARKERS: readonly Marker[] = [
  { fret: 3, kind: 'single' },
  { fret: 5, kind: 'single' },
  { fret: 7, kind: 'single' },
  { fret: 9, kind: 'single' },
  { fret: 12, kind: 'double' },
  { fret: 15, kind: 'single' },
  { fret: 17, kind: 'single' },
  { fret: 19, kind: 'single' },
  { fret: 21, kind: 'single' },
  { fret: 24, kind: 'single' },
];

function wholeNumber(min: number, max: number) {
  const message = `must be a whole number from ${min} to ${max}`;
  return z.number().int({ message }).min(min, { message }).max(max, { message });
}

const markerSchema = z
  .object({
    fret: wholeNumber(1, DESIGN_LIMITS.maxFrets),
    kind: z.enum(['single', 'double']),
  })
  .strict();

export type Marker = z.infer<typeof markerSchema>;

const temperamentSchema = z.discriminatedUnion('kind', [
  z
    .object({
      kind: z.literal('equal'),
      divisions: wholeNumber(1, DESIGN_LIMITS.maxDivisions),
    })
    .strict(),
  z
    .object({
      kind: z.literal('scala'),
      scl: z.string().max(DESIGN_LIMITS.maxSclChars),
    })
    .strict(),
]);

const designObjectSchema = z
  .object({
    name: z
      .string()
      .trim()
      .min(1, { message: 'must not be empty' })
      .max(DESIGN_LIMITS.nameMaxChars, {
        message: `must be at most ${DESIGN_LIMITS.nameMaxChars} characters`,
      }),
    units: z.enum(['mm', 'in']),
    ...fieldShape(),
    temperament: temperamentSchema,
    markers: z.array(markerSchema).max(DESIGN_LIMITS.maxFrets).optional(),
  })
  .strict();

export type DesignInput = z.input<typeof designObjectSchema>;

/** Fills every optional field; defaults in mm are converted into the design's units. */
export function normaliseDesign(input: z.output<typeof designObjectSchema>) {
  return {
    name: input.name,
    units: input.units,
    ...fieldValues(input, input.units),
    temperament: input.temperament,
    markers:
      input.markers ??
      DEFAULT_MARKERS.filter((marker) => marker.fret <= input.frets).map((marker) => ({ ...marker })),
  };
}

/** A validated design with every optional field filled in. */
export type Design = ReturnType<typeof normaliseDesign>;

export const designSchema = designObjectSchema
  .transform(normaliseDesign)
  .superRefine((design, ctx) => {
    for (const problem of geometryCheck(design).problems) {
      ctx.addIssue({ code: z.ZodIssueCode.custom, path: problem.path, message: problem.message });
    }
  });

export interface DesignIssue {
  /** Dotted field path, e.g. "scale.treble" or "markers.2.fret"; "design" for the whole. */
  path: string;
  message: string;
}

export type DesignValidation = { ok: true; design: Design } | { ok: false; issues: DesignIssue[] };

/** Validates unknown input (parsed JSON) as a design; never throws. */
export function validateDesign(input: unknown): DesignValidation {
  const checked = checkDesign(input);
  return checked.ok ? { ok: true, design: checked.design } : checked;
}

export type DesignLayoutValidation = { ok: true; design: Design; layout: Layout } | { ok: false; issues: DesignIssue[] };

/**
 * validateDesign, plus the design's layout: the radius check of a radiused design computes it
 * already, so a caller that needs it (POST /api/layout) does not compute it a second time.
 */
export function validateDesignWithLayout(input: unknown): DesignLayoutValidation {
  const checked = checkDesign(input);
  if (!checked.ok) return checked;
  return { ok: true, design: checked.design, layout: checked.layout ?? computeLayout(checked.design) };
}

/**
 * What designSchema.safeParse does (the same issues in the same order), without the layout the
 * radius check computed being thrown away: the object's checks, then the defaults, then the checks
 * that need several fields at once.
 */
function checkDesign(input: unknown): { ok: true; design: Design; layout: Layout | null } | { ok: false; issues: DesignIssue[] } {
  const parsed = designObjectSchema.safeParse(input);
  if (!parsed.success) return { ok: false, issues: parsed.error.issues.map(toDesignIssue) };
  const design = normaliseDesign(parsed.data);
  const { problems, layout } = geometryCheck(design);
  if (problems.length > 0) return { ok: false, issues: problems.map(({ path, message }) => ({ path: path.length === 0 ? 'design' : path.join('.'), message })) };
  return { ok: true, design, layout };
}

function toDesignIssue(issue: z.ZodIssue): DesignIssue {
  // Point unknown-key issues at the key itself so the caller sees which field is not allowed.
  const path =
    issue.code === z.ZodIssueCode.unrecognized_keys && issue.keys.length === 1
      ? [...issue.path, ...issue.keys]
      : issue.path;
  return { path: path.length === 0 ? 'design' : path.join('.'), message: issue.message };
}

interface Problem {
  path: (string | number)[];
  message: string;
}

/** Checks that need several fields at once, or the design's units; the layout when the radius check computed it. */
function geometryCheck(design: Design): { problems: Problem[]; layout: Layout | null } {
  const problems: Problem[] = [
    ...magnitudeProblems(design, design.units),
    ...spreadProblems(design),
    ...markerProblems(design),
  ];
  if (design.perpendicularFret > design.frets) {
    problems.push({
      path: ['perpendicularFret'],
      message: `must not be past the last fret (${design.frets})`,
    });
  }
  problems.push(...temperamentProblems(design));
  if (problems.length > 0 || design.radius.nut === 0) return { problems, layout: null };
  const layout = computeLayout(design);
  return { problems: radiusProblems(design, layout), layout };
}

/** A radiused top must span the board: R(x) at least half the board's width at every corner. */
function radiusProblems(design: Design, layout: Layout): Problem[] {
  const surface = boardSurface(design.radius, layout.frets[layout.frets.length - 1]!.line);
  const tight = radiusTooSmall(surface, layout.outline);
  if (!tight) return [];
  const atNut = tight.corner.x < (surface.radius?.lastFretX ?? 0) / 2;
  return [
    {
      path: ['radius', atNut || design.radius.end === 0 ? 'nut' : 'end'],
      message: `is too small for the board: it must be at least half the board's width (${formatLength(tight.needed, design.units, true)}) ${atNut ? 'at the nut' : 'at the board end'}`,
    },
  ];
}

/**
 * A scale given along the string must be longer than the string's sideways spread, or it would
 * have no length along x (a run along the centre line has no such limit).
 */
function spreadProblems(design: Design): Problem[] {
  if (design.scaleAlong === 'centreLine') return [];
  const spread = Math.abs(design.stringSpacing.bridge - design.stringSpacing.nut) / 2;
  const problems: Problem[] = [];
  for (const side of ['treble', 'bass'] as const) {
    if (design.scale[side] <= spread) {
      problems.push({
        path: ['scale', side],
        message:
          `must be longer than half the difference between bridge and nut spacing ` +
          `(${formatLength(spread, design.units, true)})`,
      });
    }
  }
  return problems;
}

function markerProblems(design: Design): Problem[] {
  const seen = new Set<number>();
  const problems: Problem[] = [];
  design.markers.forEach((marker, index) => {
    if (marker.fret > design.frets) {
      problems.push({
        path: ['markers', index, 'fret'],
        message: `must not be past the last fret (${design.frets})`,
      });
    }
    if (seen.has(marker.fret)) {
      problems.push({ path: ['markers', index, 'fret'], message: `fret ${marker.fret} is listed twice` });
    }
    seen.add(marker.fret);
  });
  return problems;
}

/** A Scala scale must parse, rise step by step (so frets move toward the bridge) and has whole steps only. */
function temperamentProblems(design: Design): Problem[] {
  const { temperament } = design;
  if (temperament.kind !== 'scala') return [];
  const parsed = parseScl(temperament.scl);
  if (!parsed.ok) {
    return [
      {
        path: ['temperament', 'scl'],
        message: `line ${parsed.error.line}: ${parsed.error.message}`,
      },
    ];
  }
  const problems: Problem[] = [];
  let previousRatio = 1;
  for (const pitch of parsed.scale.pitches) {
    if (!(pitch.ratio > previousRatio)) {
      problems.push({
        path: ['temperament', 'scl'],
        message:
          `line ${pitch.line}: pitch "${pitch.text}" must be higher than the one before it ` +
          `(each fret must lie closer to the bridge than the last)`,
      });
      break;
    }
    previousRatio = pitch.ratio;
  }
  if (!Number.isInteger(design.perpendicularFret)) {
    problems.push({
      path: ['perpendicularFret'],
      message: 'must be a whole fret number with a Scala temperament',
    });
  }
  return problems;
}
