/**
 * The design's plain fields as one table: each row is a field (its dotted path in the design
 * file), what kind of value it takes, its default and limit, and the label and help the form
 * shows. From the rows come the zod shape (design.ts), the defaults, the magnitude checks, the
 * editor's draft (design-draft.ts) and the form rows (DesignForm.tsx). Adding a length field is one
 * row here, plus whatever the geometry does with it.
 *
 * Lengths are in the design's units; `defaultMm` and `maxMm` are millimetres, converted for designs
 * in inches (1 in = 25.4 mm). Defaults are common practice, from memory.
 */
import { z } from 'zod';
import { formatLength, fromMm, type LengthUnit } from '~/lib/format/units.ts';

/** The form's groups of fields, in the order the form shows them. */
export const FIELD_GROUPS = ['Strings and scale', 'Board', 'Slots', 'Fret wire', 'Compensation'] as const;
export type FieldGroup = (typeof FIELD_GROUPS)[number];

interface RowBase {
  /** Dotted path in the design, e.g. "scale.treble"; at most one dot. */
  path: string;
  group: FieldGroup;
  /** The form's label; a length's label gets its units appended. */
  label: string;
  /** One sentence for the form and the docs: what the value means and along what it is measured. */
  help: string;
  /** The form shows the field only while this flag (a flag row's path) is on. */
  shownWhen?: string;
}

/** A length in the design's units: > 0, ≥ 0, or any sign (a setback may be negative). */
export interface LengthRow extends RowBase {
  kind: 'length';
  sign: 'positive' | 'nonNegative' | 'signed';
  /** Absent: the field is required. */
  defaultMm?: number;
  /** Largest accepted magnitude, in millimetres. */
  maxMm: number;
}

/** A whole number within [min, max] (strings, frets). Required unless it has a default. */
export interface WholeRow extends RowBase {
  kind: 'whole';
  min: number;
  max: number;
  default?: number;
}

/** A real number ≥ 0 (the perpendicular fret may lie between frets). Required. */
export interface RealRow extends RowBase {
  kind: 'real';
}

export interface FlagRow extends RowBase {
  kind: 'flag';
  default: boolean;
}

/** One of a few words, each with the form's label for it. */
export interface ChoiceRow extends RowBase {
  kind: 'choice';
  options: readonly [string, ...string[]];
  optionLabels: Readonly<Record<string, string>>;
  default: string;
}

export type FieldRow = LengthRow | WholeRow | RealRow | FlagRow | ChoiceRow;

/** Longest scale length or string spacing, in millimetres. */
const LONGEST_MM = 5000;

export const DESIGN_FIELDS = [
  { path: 'strings', kind: 'whole', min: 2, max: 16, group: 'Strings and scale', label: 'Strings', help: 'Number of strings; string 1 is the treble (highest) string.' },
  { path: 'scale.treble', kind: 'length', sign: 'positive', maxMm: LONGEST_MM, group: 'Strings and scale', label: 'Treble scale length, string 1', help: 'Nut to saddle on string 1.' },
  { path: 'scale.bass', kind: 'length', sign: 'positive', maxMm: LONGEST_MM, group: 'Strings and scale', label: 'Bass scale length, last string', help: 'Nut to saddle on the last string; the same as the treble for a single-scale board.' },
  {
    path: 'scaleAlong',
    kind: 'choice',
    options: ['strings', 'centreLine'],
    optionLabels: { strings: 'along each outer string', centreLine: 'along the centre line (square to the nut)' },
    default: 'strings',
    group: 'Strings and scale',
    label: 'Scale lengths are measured',
    help: 'Along the string itself, or as the string’s run along the centre line from the nut to the saddle. On a single-scale board the centre line reads the scale exactly.',
  },
  { path: 'perpendicularFret', kind: 'real', group: 'Strings and scale', label: 'Perpendicular fret (0 = nut)', help: 'The fret whose line is square to the centre line; it may lie between frets.' },
  { path: 'frets', kind: 'whole', min: 1, max: 36, group: 'Strings and scale', label: 'Frets', help: 'Number of frets.' },
  { path: 'stringSpacing.nut', kind: 'length', sign: 'positive', maxMm: LONGEST_MM, group: 'Strings and scale', label: 'String spacing at the nut', help: 'Outer string centre to centre at the nut.' },
  { path: 'stringSpacing.bridge', kind: 'length', sign: 'positive', maxMm: LONGEST_MM, group: 'Strings and scale', label: 'String spacing at the bridge', help: 'Outer string centre to centre at the saddle.' },
  { path: 'overhang.nut', kind: 'length', sign: 'nonNegative', defaultMm: 3.5, maxMm: 100, group: 'Board', label: 'Edge overhang at the nut', help: 'Board edge beyond the outer strings at the nut, square to the centre line.' },
  { path: 'overhang.end', kind: 'length', sign: 'nonNegative', defaultMm: 4, maxMm: 100, group: 'Board', label: 'Edge overhang at the board end', help: 'Board edge beyond the outer strings at the board end, square to the centre line.' },
  { path: 'endExtension', kind: 'length', sign: 'nonNegative', defaultMm: 6, maxMm: 500, group: 'Board', label: 'Board end past the last fret', help: 'The margin between the last fret and the board end, measured as chosen below.' },
  {
    path: 'endMarginAt',
    kind: 'choice',
    options: ['centreLine', 'edge'],
    optionLabels: { centreLine: 'along the centre line', edge: 'along the edge where it is smallest' },
    default: 'centreLine',
    group: 'Board',
    label: 'The board-end margin is measured',
    help: 'On a fan the last fret is slanted, so the margin differs from edge to edge; "smallest" keeps at least this much wood past the fret everywhere.',
  },
  {
    path: 'endLine',
    kind: 'choice',
    options: ['parallelToLastFret', 'squareToCentreLine'],
    optionLabels: { parallelToLastFret: 'parallel to the last fret', squareToCentreLine: 'square to the centre line' },
    default: 'parallelToLastFret',
    group: 'Board',
    label: 'The board end runs',
    help: 'The direction of the cut across the board end.',
  },
  { path: 'radius.nut', kind: 'length', sign: 'nonNegative', defaultMm: 0, maxMm: LONGEST_MM, group: 'Board', label: 'Board radius at the nut (0 = flat)', help: 'The top’s radius square to the centre line at the nut; common radii run 184–508 mm (7.25–20 in).' },
  { path: 'radius.end', kind: 'length', sign: 'nonNegative', defaultMm: 0, maxMm: LONGEST_MM, group: 'Board', label: 'Board radius at the last fret (0 = as at the nut)', help: 'Larger than at the nut for a compound (conical) board; the radius changes evenly along the board.' },
  { path: 'faceDotDiameter', kind: 'length', sign: 'positive', defaultMm: 6, maxMm: 50, group: 'Board', label: 'Face dot diameter', help: 'Diameter of each face dot inlay; every drawing and export draws the dots this size.' },
  { path: 'sideDotDiameter', kind: 'length', sign: 'positive', defaultMm: 2, maxMm: 20, group: 'Board', label: 'Side dot diameter', help: 'Diameter of each side dot on the bass edge; every drawing and export draws the dots this size.' },
  { path: 'slot.width', kind: 'length', sign: 'positive', defaultMm: 0.6, maxMm: 10, group: 'Slots', label: 'Slot width (kerf)', help: 'The width the saw or cutter leaves.' },
  { path: 'slot.overrun', kind: 'length', sign: 'nonNegative', defaultMm: 0, maxMm: 20, group: 'Slots', label: 'Through slots run past each edge by', help: 'Along the slot, so a slanted kerf clears the board corner; 1 mm suits most CNC work.' },
  { path: 'slot.depth', kind: 'length', sign: 'positive', defaultMm: 3, maxMm: 50, group: 'Slots', label: 'Slot depth', help: 'Measured straight down from the board top, so on a radiused board the slot bottom follows the radius.' },
  { path: 'slot.stopped', kind: 'flag', default: false, group: 'Slots', label: 'Stopped slots (end short of both board edges)', help: 'Slots that stop before the edges, as for bound or hidden-tang boards.' },
  { path: 'slot.stopDistance', kind: 'length', sign: 'nonNegative', defaultMm: 2, maxMm: 100, group: 'Slots', label: 'Stop short of each edge by', help: 'How far each stopped slot ends before the board edge, square to the edge.', shownWhen: 'slot.stopped' },
  { path: 'thickness', kind: 'length', sign: 'nonNegative', defaultMm: 0, maxMm: 100, group: 'Board', label: 'Board thickness at the crown (0 = not given)', help: 'Used only to check the wood left under the slots.' },
  { path: 'wire.id', kind: 'whole', min: 0, max: 2_147_483_647, default: 0, group: 'Fret wire', label: "Fret wire (its number on the shop's fret wire list; 0 = none)", help: 'The wire the cut list and the checks use; the list is under Fret wire.' },
  { path: 'wire.endAllowance', kind: 'length', sign: 'nonNegative', defaultMm: 2, maxMm: 50, group: 'Fret wire', label: 'Wire left past each end of a slot', help: 'Added at both ends of every piece in the cut list, for trimming.' },
  { path: 'compensation.nut', kind: 'length', sign: 'signed', defaultMm: 0, maxMm: 50, group: 'Compensation', label: 'Nut setback', help: 'Moves the drawn nut toward the bridge, along the outer strings; frets do not move.' },
  { path: 'compensation.saddleTreble', kind: 'length', sign: 'signed', defaultMm: 0, maxMm: 50, group: 'Compensation', label: 'Saddle setback, treble', help: 'Moves the drawn saddle away from the nut on string 1.' },
  { path: 'compensation.saddleBass', kind: 'length', sign: 'signed', defaultMm: 0, maxMm: 50, group: 'Compensation', label: 'Saddle setback, bass', help: 'Moves the drawn saddle away from the nut on the last string.' },
  { path: 'zeroFret', kind: 'flag', default: false, group: 'Compensation', label: 'Zero fret', help: 'A fret where the nut would be; the nut then only guides the strings.' },
  { path: 'zeroFretNutGap', kind: 'length', sign: 'nonNegative', defaultMm: 5, maxMm: 50, group: 'Compensation', label: 'Zero fret to nut', help: 'From the zero fret back to the string-guide nut, along the outer strings.', shownWhen: 'zeroFret' },
] as const satisfies readonly FieldRow[];

type Row = (typeof DESIGN_FIELDS)[number];
/** One row of the table, with its literal path and kind. */
export type DesignFieldRow = Row;
export type FieldPath = Row['path'];
export type LengthPath = Extract<Row, { kind: 'length' }>['path'];
export type CountPath = Extract<Row, { kind: 'whole' | 'real' }>['path'];
export type FlagPath = Extract<Row, { kind: 'flag' }>['path'];
export type ChoicePath = Extract<Row, { kind: 'choice' }>['path'];

type RowAt<P> = Extract<Row, { path: P }>;
type TopPath = Exclude<FieldPath, `${string}.${string}`>;
type GroupKey = FieldPath extends infer P ? (P extends `${infer G}.${string}` ? G : never) : never;
type MemberKey<G extends string> = FieldPath extends infer P ? (P extends `${G}.${infer M}` ? M : never) : never;
type IsOptional<R> = R extends { defaultMm: number } | { default: boolean | string | number } ? true : false;
type Options<R> = R extends { options: infer O extends readonly [string, ...string[]] } ? O : never;
type ValueOf<R> = R extends { kind: 'flag' } ? boolean : R extends { kind: 'choice' } ? Options<R>[number] : number;
type ZodOf<R> = R extends { kind: 'choice' }
  ? z.ZodOptional<z.ZodEnum<z.Writeable<Options<R>>>>
  : IsOptional<R> extends true
    ? z.ZodOptional<R extends { kind: 'flag' } ? z.ZodBoolean : z.ZodNumber>
    : z.ZodNumber;
type RequiredMember<G extends string> = Extract<Row, { path: `${G}.${string}` }> extends infer R ? (IsOptional<R> extends true ? never : R) : never;
type GroupShape<G extends string> = { [M in MemberKey<G>]: ZodOf<RowAt<`${G}.${M}`>> };
type GroupZod<G extends string> = [RequiredMember<G>] extends [never]
  ? z.ZodOptional<z.ZodObject<GroupShape<G>, 'strict'>>
  : z.ZodObject<GroupShape<G>, 'strict'>;

/** The zod shape of the table's fields (design.ts adds name, units, temperament and markers). */
export type FieldShape = { [P in TopPath]: ZodOf<RowAt<P>> } & { [G in GroupKey]: GroupZod<G> };

/** Every table field of a validated design, defaults filled in. */
export type FieldValues = { [P in TopPath]: ValueOf<RowAt<P>> } & { [G in GroupKey]: { [M in MemberKey<G>]: ValueOf<RowAt<`${G}.${M}`>> } };

const finiteNumber = z.number().finite({ message: 'must be a finite number' });

function wholeNumber(min: number, max: number) {
  const message = `must be a whole number from ${min} to ${max}`;
  return z.number().int({ message }).min(min, { message }).max(max, { message });
}

function schemaOf(row: FieldRow): z.ZodTypeAny {
  switch (row.kind) {
    case 'flag':
      return z.boolean().optional();
    case 'choice':
      return z.enum(row.options, { errorMap: () => ({ message: `must be one of: ${row.options.join(', ')}` }) }).optional();
    case 'whole':
      return row.default === undefined ? wholeNumber(row.min, row.max) : wholeNumber(row.min, row.max).optional();
    case 'real':
      return finiteNumber.nonnegative({ message: 'must not be negative' });
    case 'length': {
      const base =
        row.sign === 'positive'
          ? finiteNumber.positive({ message: 'must be greater than 0' })
          : row.sign === 'nonNegative'
            ? finiteNumber.nonnegative({ message: 'must not be negative' })
            : finiteNumber;
      return row.defaultMm === undefined ? base : base.optional();
    }
  }
}

function isOptional(row: FieldRow): boolean {
  return row.kind === 'flag' || row.kind === 'choice' || (row.kind === 'length' && row.defaultMm !== undefined) || (row.kind === 'whole' && row.default !== undefined);
}

function split(path: string): [string] | [string, string] {
  const [head, member] = path.split('.');
  return member === undefined ? [head!] : [head!, member];
}

/** The zod shape of every table field, nested as the design file nests them, in table order. */
export function fieldShape(): FieldShape {
  const shape: Record<string, z.ZodTypeAny> = {};
  const groups = new Map<string, { members: Record<string, z.ZodTypeAny>; optional: boolean }>();
  for (const row of DESIGN_FIELDS as readonly FieldRow[]) {
    const [head, member] = split(row.path);
    if (member === undefined) {
      shape[head] = schemaOf(row);
      continue;
    }
    const group = groups.get(head) ?? { members: {}, optional: true };
    group.members[member] = schemaOf(row);
    group.optional &&= isOptional(row);
    if (!groups.has(head)) {
      groups.set(head, group);
      shape[head] = z.never(); // keeps the group's place in the table order; set below
    }
  }
  for (const [head, group] of groups) {
    const object = z.object(group.members).strict();
    shape[head] = group.optional ? object.optional() : object;
  }
  // The rows above build exactly FieldShape; TypeScript cannot follow a loop over them.
  return shape as unknown as FieldShape;
}

/** The value at a table path of a design (or part of one); undefined when absent. */
export function fieldValue(source: unknown, path: string): unknown {
  let value: unknown = source;
  for (const key of path.split('.')) {
    if (typeof value !== 'object' || value === null) return undefined;
    value = (value as Record<string, unknown>)[key];
  }
  return value;
}

/** Sets a table path in a plain object being built (creating the group object as needed). */
export function setFieldValue(target: Record<string, unknown>, path: string, value: unknown): void {
  const [head, member] = split(path);
  if (member === undefined) {
    target[head] = value;
    return;
  }
  const group = (target[head] ??= {}) as Record<string, unknown>;
  group[member] = value;
}

function defaultOf(row: FieldRow, units: LengthUnit): unknown {
  if (row.kind === 'flag' || row.kind === 'choice' || row.kind === 'whole') return row.default;
  if (row.kind === 'length' && row.defaultMm !== undefined) return fromMm(row.defaultMm, units);
  return undefined;
}

/** Each row with its path split once (every design validated reads every row). */
const KEYED_ROWS = (DESIGN_FIELDS as readonly FieldRow[]).map((row) => ({ row, keys: split(row.path) }));

function valueAt(source: unknown, [head, member]: [string] | [string, string]): unknown {
  if (typeof source !== 'object' || source === null) return undefined;
  const value = (source as Record<string, unknown>)[head];
  if (member === undefined) return value;
  return typeof value === 'object' && value !== null ? (value as Record<string, unknown>)[member] : undefined;
}

/** Every table field of parsed input, with the defaults (converted into `units`) filled in. */
export function fieldValues(input: unknown, units: LengthUnit): FieldValues {
  const values: Record<string, unknown> = {};
  for (const { row, keys } of KEYED_ROWS) {
    const value = valueAt(input, keys) ?? defaultOf(row, units);
    const [head, member] = keys;
    if (member === undefined) values[head] = value;
    else ((values[head] ??= {}) as Record<string, unknown>)[member] = value;
  }
  // Built row by row from input the schema accepted (required fields present, numbers and flags).
  return values as FieldValues;
}

/** The rows of one kind, typed by their paths. */
export const LENGTH_ROWS = DESIGN_FIELDS.filter((row): row is Extract<Row, { kind: 'length' }> => row.kind === 'length');
export const COUNT_ROWS = DESIGN_FIELDS.filter((row): row is Extract<Row, { kind: 'whole' | 'real' }> => row.kind === 'whole' || row.kind === 'real');
export const FLAG_ROWS = DESIGN_FIELDS.filter((row): row is Extract<Row, { kind: 'flag' }> => row.kind === 'flag');
export const CHOICE_ROWS = DESIGN_FIELDS.filter((row): row is Extract<Row, { kind: 'choice' }> => row.kind === 'choice');

const KEYED_LENGTH_ROWS = LENGTH_ROWS.map((row) => ({ row, keys: split(row.path) }));

/** The largest accepted value of a length field, in millimetres. */
export function maxLengthMm(path: LengthPath): number {
  return LENGTH_ROWS.find((row) => row.path === path)!.maxMm;
}

export interface FieldProblem {
  path: string[];
  message: string;
}

/** Lengths larger than their row allows (the sign was checked by the schema). */
export function magnitudeProblems(values: FieldValues, units: LengthUnit): FieldProblem[] {
  const problems: FieldProblem[] = [];
  for (const { row, keys } of KEYED_LENGTH_ROWS) {
    const value = valueAt(values, keys);
    if (typeof value === 'number' && Math.abs(value) > fromMm(row.maxMm, units)) {
      problems.push({ path: [...keys], message: `must be at most ${describeLimit(row.maxMm, units)}` });
    }
  }
  return problems;
}

function describeLimit(maxMm: number, units: LengthUnit): string {
  return units === 'mm' ? `${maxMm} mm` : `${formatLength(fromMm(maxMm, units), 'in')} in (${maxMm} mm)`;
}
