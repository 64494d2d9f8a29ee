import { z } from 'zod';
import { formatLength, fromMm, type LengthUnit } from '~/lib/format/units';
import { parseScl } from '~/lib/geometry/scala';

/**
 * The design: everything needed to lay out one fretboard. The required field names are part of
 * the public API (HTTP and CLI). Every length is in the design's `units`.
 * Optional fields get defaults in `normaliseDesign` (defaults are chosen in mm and converted when
 * the design is in inches), so a parsed `Design` has every field present.
 */

export const DESIGN_LIMITS = {
  nameMaxChars: 120,
  minStrings: 2,
  maxStrings: 16,
  minFrets: 1,
  maxFrets: 36,
  maxDivisions: 1024,
  maxSclChars: 65_536,
  /** Upper limits in millimetres; converted for designs in inches. */
  mm: {
    length: 5000,
    overhang: 100,
    endExtension: 500,
    slotWidth: 10,
    stopDistance: 100,
    compensation: 50,
    zeroFretNutGap: 50,
  },
} as const;

/** Defaults in millimetres (common practice, from memory), converted for designs in inches. */
export const DESIGN_DEFAULTS_MM = {
  overhang: { nut: 3.5, end: 4 },
  endExtension: 6,
  slot: { width: 0.6, stopDistance: 2 },
  zeroFretNutGap: 5,
} as const;

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

const finiteNumber = z.number().finite({ message: 'must be a finite number' });
const positiveLength = finiteNumber.positive({ message: 'must be greater than 0' });
const nonNegativeLength = finiteNumber.nonnegative({ message: 'must not be negative' });

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
    strings: wholeNumber(DESIGN_LIMITS.minStrings, DESIGN_LIMITS.maxStrings),
    /** Along-string nut-to-saddle length of string 1 (treble) and string N (bass). */
    scale: z.object({ treble: positiveLength, bass: positiveLength }).strict(),
    /** Fret whose line is square to the centre line; real, 0 = perpendicular nut. */
    perpendicularFret: finiteNumber.nonnegative({ message: 'must not be negative' }),
    frets: wholeNumber(DESIGN_LIMITS.minFrets, DESIGN_LIMITS.maxFrets),
    /** Outer string centre to centre, at the nut and at the saddle. */
    stringSpacing: z.object({ nut: positiveLength, bridge: positiveLength }).strict(),
    temperament: temperamentSchema,
    /** Board edge beyond the outer strings (measured square to the centre line). */
    overhang: z
      .object({ nut: nonNegativeLength.optional(), end: nonNegativeLength.optional() })
      .strict()
      .optional(),
    /** Board length past the last fret, measured along the centre line. */
    endExtension: nonNegativeLength.optional(),
    slot: z
      .object({
        /** Slot width (kerf). */
        width: positiveLength.optional(),
        /** Stopped slots end short of both board edges by `stopDistance`. */
        stopped: z.boolean().optional(),
        stopDistance: nonNegativeLength.optional(),
      })
      .strict()
      .optional(),
    /**
     * Setbacks along each outer string: `nut` moves the drawn nut toward the bridge, `saddleTreble`
     * and `saddleBass` move the drawn saddle away from the nut. Frets ignore them.
     */
    compensation: z
      .object({
        nut: finiteNumber.optional(),
        saddleTreble: finiteNumber.optional(),
        saddleBass: finiteNumber.optional(),
      })
      .strict()
      .optional(),
    markers: z.array(markerSchema).max(DESIGN_LIMITS.maxFrets).optional(),
    /** A zero fret sits where the nut would be; the nut then only guides the strings. */
    zeroFret: z.boolean().optional(),
    /** Distance from the zero fret back to the string-guide nut, along the outer strings. */
    zeroFretNutGap: nonNegativeLength.optional(),
  })
  .strict();

export type DesignInput = z.input<typeof designObjectSchema>;

/** Fills every optional field; defaults in mm are converted into the design's units. */
export function normaliseDesign(input: z.output<typeof designObjectSchema>) {
  const units = input.units;
  const mm = (value: number) => fromMm(value, units);
  return {
    name: input.name,
    units,
    strings: input.strings,
    scale: { treble: input.scale.treble, bass: input.scale.bass },
    perpendicularFret: input.perpendicularFret,
    frets: input.frets,
    stringSpacing: { nut: input.stringSpacing.nut, bridge: input.stringSpacing.bridge },
    temperament: input.temperament,
    overhang: {
      nut: input.overhang?.nut ?? mm(DESIGN_DEFAULTS_MM.overhang.nut),
      end: input.overhang?.end ?? mm(DESIGN_DEFAULTS_MM.overhang.end),
    },
    endExtension: input.endExtension ?? mm(DESIGN_DEFAULTS_MM.endExtension),
    slot: {
      width: input.slot?.width ?? mm(DESIGN_DEFAULTS_MM.slot.width),
      stopped: input.slot?.stopped ?? false,
      stopDistance: input.slot?.stopDistance ?? mm(DESIGN_DEFAULTS_MM.slot.stopDistance),
    },
    compensation: {
      nut: input.compensation?.nut ?? 0,
      saddleTreble: input.compensation?.saddleTreble ?? 0,
      saddleBass: input.compensation?.saddleBass ?? 0,
    },
    markers:
      input.markers ??
      DEFAULT_MARKERS.filter((marker) => marker.fret <= input.frets).map((marker) => ({ ...marker })),
    zeroFret: input.zeroFret ?? false,
    zeroFretNutGap: input.zeroFretNutGap ?? mm(DESIGN_DEFAULTS_MM.zeroFretNutGap),
  };
}

/** A validated design with every optional field filled in. */
export type Design = ReturnType<typeof normaliseDesign>;

export const designSchema = designObjectSchema
  .transform(normaliseDesign)
  .superRefine((design, ctx) => {
    for (const problem of geometryProblems(design)) {
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
  const result = designSchema.safeParse(input);
  if (result.success) return { ok: true, design: result.data };
  return { ok: false, issues: result.error.issues.map(toDesignIssue) };
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

/** Checks that need several fields at once, or the design's units. */
function geometryProblems(design: Design): Problem[] {
  const problems: Problem[] = [
    ...magnitudeProblems(design),
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
  return problems;
}

function magnitudeProblems(design: Design): Problem[] {
  const { units } = design;
  const limits = DESIGN_LIMITS.mm;
  const checks: [(string | number)[], number, number][] = [
    [['scale', 'treble'], design.scale.treble, limits.length],
    [['scale', 'bass'], design.scale.bass, limits.length],
    [['stringSpacing', 'nut'], design.stringSpacing.nut, limits.length],
    [['stringSpacing', 'bridge'], design.stringSpacing.bridge, limits.length],
    [['overhang', 'nut'], design.overhang.nut, limits.overhang],
    [['overhang', 'end'], design.overhang.end, limits.overhang],
    [['endExtension'], design.endExtension, limits.endExtension],
    [['slot', 'width'], design.slot.width, limits.slotWidth],
    [['slot', 'stopDistance'], design.slot.stopDistance, limits.stopDistance],
    [['compensation', 'nut'], Math.abs(design.compensation.nut), limits.compensation],
    [['compensation', 'saddleTreble'], Math.abs(design.compensation.saddleTreble), limits.compensation],
    [['compensation', 'saddleBass'], Math.abs(design.compensation.saddleBass), limits.compensation],
    [['zeroFretNutGap'], design.zeroFretNutGap, limits.zeroFretNutGap],
  ];
  return checks
    .filter(([, value, maxMm]) => value > fromMm(maxMm, units))
    .map(([path, , maxMm]) => ({ path, message: `must be at most ${describeLimit(maxMm, units)}` }));
}

function describeLimit(maxMm: number, units: LengthUnit): string {
  return units === 'mm' ? `${maxMm} mm` : `${formatLength(fromMm(maxMm, units), 'in')} in (${maxMm} mm)`;
}

/** Each outer string must be longer than its sideways spread, or it would have no length along x. */
function spreadProblems(design: Design): Problem[] {
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
