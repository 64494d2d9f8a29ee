/**
 * The Template shelf's shapes: a physical index template, the ways to create and edit one, the
 * list query, and a Template check request. Shared by the API routes, the pages and the database
 * layer. Lengths are in the template's `units`.
 */
import { z } from 'zod';
import { DESIGN_LIMITS } from '~/lib/schemas/design.ts';
import { fromMm } from '~/lib/format/units.ts';
import type { MeasureLine } from '~/lib/templates/check/measure-lines.ts';

export const TEMPLATE_LIMITS = {
  nameMaxChars: 120,
  shortTextMaxChars: 80,
  notesMaxChars: 4000,
  /** Upper limits in mm, converted for templates in inches. */
  mm: { scale: DESIGN_LIMITS.mm.length, width: DESIGN_LIMITS.mm.slotWidth, tolerance: 5 },
  maxMeasurements: 2 * DESIGN_LIMITS.maxFrets * DESIGN_LIMITS.maxStrings,
} as const;

/** A physical template's condition; the database's enum is made from this list. */
export const templateConditionSchema = z.enum(['in_use', 'worn', 'retired']);
export type TemplateCondition = z.infer<typeof templateConditionSchema>;
const unitsSchema = z.enum(['mm', 'in']);

const positive = z.number({ invalid_type_error: 'must be a number' }).finite({ message: 'must be a finite number' }).positive({ message: 'must be greater than 0' });
const text = (max: number) => z.string().trim().max(max, { message: `must be at most ${max} characters` });
const isoDate = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, { message: 'must be a date as YYYY-MM-DD' })
  .refine((value) => !Number.isNaN(Date.parse(`${value}T00:00:00Z`)) && new Date(`${value}T00:00:00Z`).toISOString().startsWith(value), {
    message: 'must be a real calendar date',
  });

/** A line's word as the measure-lines vocabulary spells it (whether the board has it is checked with the design). */
const measureLineSchema = z
  .string()
  .regex(/^(treble-edge|bass-edge|centre-line|string-[1-9]\d*)$/, { message: 'must be treble-edge, bass-edge, centre-line or string-N' })
  .transform((word) => word as MeasureLine);

/**
 * One measured slot along a named line. Older bodies name `string: N` instead (1 = treble, the
 * default when neither is given): they were compared along string N, and still are.
 */
const measurementSchema = z
  .object({
    fret: z.number().int().min(1).max(DESIGN_LIMITS.maxFrets),
    along: measureLineSchema.optional(),
    string: z.number().int().min(1).max(DESIGN_LIMITS.maxStrings).optional(),
    fromNut: positive,
  })
  .strict()
  .superRefine((value, ctx) => {
    if (value.along !== undefined && value.string !== undefined) {
      ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['string'], message: 'give along or string, not both' });
    }
  })
  .transform(({ fret, along, string, fromNut }) => ({ fret, along: along ?? (`string-${string ?? 1}` as MeasureLine), fromNut }));

/**
 * How measurements and the tolerance are given: in mm or in, tolerance +/- in those units, and
 * (for a CSV upload) the line that rows without an `along` column were measured along; omitted,
 * string 1, as before lines were named.
 */
export const checkSettingsSchema = z
  .object({
    units: unitsSchema,
    tolerance: positive,
    along: measureLineSchema.default('string-1'),
  })
  .strict()
  .superRefine((value, ctx) => {
    if (value.tolerance > fromMm(TEMPLATE_LIMITS.mm.tolerance, value.units)) {
      ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['tolerance'], message: `must be at most ${TEMPLATE_LIMITS.mm.tolerance} mm` });
    }
  });
export type CheckSettings = z.infer<typeof checkSettingsSchema>;

/** A Template check entered as a grid (JSON). A CSV upload sends units and tolerance in the URL. */
export const checkGridSchema = z
  .object({
    units: unitsSchema,
    tolerance: positive,
    measurements: z.array(measurementSchema).min(1, { message: 'enter at least one measured slot' }).max(TEMPLATE_LIMITS.maxMeasurements),
  })
  .strict()
  .superRefine((value, ctx) => {
    const seen = new Set<string>();
    value.measurements.forEach((m, index) => {
      const key = `${m.fret}/${m.along}`;
      if (seen.has(key)) ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['measurements', index, 'fret'], message: `fret ${m.fret} is listed twice along ${m.along}` });
      seen.add(key);
    });
    if (value.tolerance > fromMm(TEMPLATE_LIMITS.mm.tolerance, value.units)) {
      ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['tolerance'], message: `must be at most ${TEMPLATE_LIMITS.mm.tolerance} mm` });
    }
  });
export type CheckGrid = z.infer<typeof checkGridSchema>;

/** What a person may edit on any template. */
const shelfFields = {
  name: text(TEMPLATE_LIMITS.nameMaxChars).min(1, { message: 'must not be empty' }),
  /** The width of the template's own slots. */
  slotWidth: positive,
  /** The width of the jig's key that drops into the slots. */
  keyWidth: positive,
  material: text(TEMPLATE_LIMITS.shortTextMaxChars).default(''),
  storagePlace: text(TEMPLATE_LIMITS.shortTextMaxChars).default(''),
  condition: templateConditionSchema.default('in_use'),
  madeOn: isoDate.nullable().default(null),
  notes: text(TEMPLATE_LIMITS.notesMaxChars).default(''),
};

const fromDesignSchema = z
  .object({
    source: z.literal('design'),
    boardId: z.number().int().positive(),
    /** Omitted: the design's current revision. */
    revision: z.number().int().positive().optional(),
    ...shelfFields,
    name: shelfFields.name.optional(),
    /** Omitted: the design's slot width. */
    slotWidth: positive.optional(),
    /** A Template check to save with the new template (made from a check of the design). */
    check: checkGridSchema.optional(),
  })
  .strict();

const typedSchema = z
  .object({
    source: z.literal('typed'),
    units: unitsSchema,
    trebleScale: positive,
    bassScale: positive,
    frets: z.number().int().min(DESIGN_LIMITS.minFrets).max(DESIGN_LIMITS.maxFrets),
    ...shelfFields,
    check: checkGridSchema.optional(),
  })
  .strict();

/** Create: from a saved design (and revision), or typed scale lengths for an older template. */
export const templateCreateSchema = z.discriminatedUnion('source', [fromDesignSchema, typedSchema]).superRefine((value, ctx) => {
  const units = value.source === 'typed' ? value.units : 'mm';
  if (value.source === 'typed') {
    for (const field of ['trebleScale', 'bassScale'] as const) {
      if (value[field] > fromMm(TEMPLATE_LIMITS.mm.scale, units)) {
        ctx.addIssue({ code: z.ZodIssueCode.custom, path: [field], message: `must be at most ${TEMPLATE_LIMITS.mm.scale} mm` });
      }
    }
  }
  widthIssues(value, units, ctx);
});
export type TemplateCreate = z.infer<typeof templateCreateSchema>;

/** Update: any shelf field; the design link and scale lengths stay as made. */
export const templateUpdateSchema = z
  .object({
    name: shelfFields.name,
    slotWidth: positive,
    keyWidth: positive,
    material: text(TEMPLATE_LIMITS.shortTextMaxChars),
    storagePlace: text(TEMPLATE_LIMITS.shortTextMaxChars),
    condition: templateConditionSchema,
    madeOn: isoDate.nullable(),
    notes: text(TEMPLATE_LIMITS.notesMaxChars),
  })
  .partial()
  .strict()
  .refine((value) => Object.keys(value).length > 0, { message: 'name at least one field to change' });
export type TemplateUpdate = z.infer<typeof templateUpdateSchema>;

/** Slot and key widths are bounded in the template's units (the design's for "design"). */
function widthIssues(value: { slotWidth?: number | undefined; keyWidth: number }, units: 'mm' | 'in', ctx: z.RefinementCtx): void {
  const max = fromMm(TEMPLATE_LIMITS.mm.width, units);
  for (const field of ['slotWidth', 'keyWidth'] as const) {
    const width = value[field];
    if (width !== undefined && width > max) {
      ctx.addIssue({ code: z.ZodIssueCode.custom, path: [field], message: `must be at most ${TEMPLATE_LIMITS.mm.width} mm` });
    }
  }
}

/**
 * What a typed fanned template lacks for its index template's slot angles: the outer string
 * spacing at the nut and at the saddle (template units) and the perpendicular fret (0 = nut).
 */
export const FAN_GEOMETRY_LABELS = {
  nutSpacing: 'string spacing at the nut',
  saddleSpacing: 'string spacing at the saddle',
  perpendicularFret: 'perpendicular fret',
} as const;

const fanRequired = (field: keyof typeof FAN_GEOMETRY_LABELS) => ({
  required_error: `the ${FAN_GEOMETRY_LABELS[field]} is needed for a fanned template with typed scale lengths`,
  invalid_type_error: 'must be a number',
});

export const fanGeometrySchema = z
  .object({
    nutSpacing: z.number(fanRequired('nutSpacing')).finite({ message: 'must be a finite number' }).positive({ message: 'must be greater than 0' }),
    saddleSpacing: z.number(fanRequired('saddleSpacing')).finite({ message: 'must be a finite number' }).positive({ message: 'must be greater than 0' }),
    perpendicularFret: z.number(fanRequired('perpendicularFret')).finite({ message: 'must be a finite number' }).nonnegative({ message: 'must not be negative' }),
  })
  .strict();
export type FanGeometry = z.infer<typeof fanGeometrySchema>;

export const TEMPLATE_SORTS = ['name', 'scale', 'madeOn', 'lastChecked', 'updated'] as const;
export type TemplateSort = (typeof TEMPLATE_SORTS)[number];

/** The last Template check's result, as a filter: passed, failed, or never checked. */
export const LAST_RESULT_FILTERS = ['pass', 'fail', 'never'] as const;

/** The shelf's list query (from URL search parameters). */
export const templateListQuerySchema = z
  .object({
    q: z.string().trim().max(120).default(''),
    condition: templateConditionSchema.optional(),
    lastResult: z.enum(LAST_RESULT_FILTERS).optional(),
    sort: z.enum(TEMPLATE_SORTS).default('updated'),
    dir: z.enum(['asc', 'desc']).default('desc'),
    page: z.coerce.number().int().min(1).max(10_000).default(1),
    pageSize: z.coerce.number().int().min(1).max(100).default(25),
  })
  .strict();
export type TemplateListQuery = z.infer<typeof templateListQuerySchema>;

/** One template as the API and pages show it. Dates are ISO strings. */
export const templateViewSchema = z.object({
  id: z.number(),
  name: z.string(),
  boardId: z.number().nullable(),
  boardName: z.string().nullable(),
  revision: z.number().nullable(),
  units: unitsSchema,
  trebleScale: z.number(),
  bassScale: z.number(),
  frets: z.number(),
  slotWidth: z.number(),
  keyWidth: z.number(),
  material: z.string(),
  storagePlace: z.string(),
  condition: templateConditionSchema,
  madeOn: z.string().nullable(),
  lastCheckedOn: z.string().nullable(),
  lastCheckPassed: z.boolean().nullable(),
  notes: z.string(),
  updatedAt: z.string(),
});
export type TemplateView = z.infer<typeof templateViewSchema>;

/** What identifies a template's slots: printed on its label, and enough for a stand-in design. */
export type TemplateSpec = Pick<TemplateView, 'name' | 'units' | 'trebleScale' | 'bassScale' | 'frets' | 'slotWidth'>;

export interface TemplatePage {
  items: TemplateView[];
  total: number;
  page: number;
  pageSize: number;
}
