/**
 * The form's state: what the user typed, field by field, which may be incomplete or wrong.
 * It turns into a design only through the shared schema (validateDesign), so the form, the API
 * and the database all accept exactly the same designs.
 *
 * Unit switching converts every length exactly: a converted field remembers the text it was
 * converted from, computes with the exact converted value (the text shows it rounded), and
 * switching back restores the original text as long as the field was not edited.
 */
import { convertLength, type LengthUnit } from '~/lib/format/units';
import { validateDesign, type Design, type DesignIssue, type Marker } from '~/lib/schemas/design';
import {
  CHOICE_ROWS,
  COUNT_ROWS,
  FLAG_ROWS,
  LENGTH_ROWS,
  fieldValue,
  setFieldValue,
  type ChoicePath,
  type CountPath,
  type FlagPath,
  type LengthPath,
} from '~/lib/schemas/design-fields';

/** Every length field of the field table (design-fields.ts), by path. */
export const LENGTH_FIELDS: readonly LengthPath[] = LENGTH_ROWS.map((row) => row.path);
export type LengthField = LengthPath;

/** The table's counts, and the divisions of an equal temperament (typed like a count). */
export const NUMBER_FIELDS: readonly NumberField[] = [...COUNT_ROWS.map((row) => row.path), 'temperament.divisions'];
export type NumberField = CountPath | 'temperament.divisions';

export type FlagField = FlagPath;
export type ChoiceField = ChoicePath;

export interface LengthText {
  text: string;
  /** Set while the text shows a unit conversion of `text` given in `from`. */
  converted?: { from: LengthUnit; text: string };
}

export interface DesignDraft {
  name: string;
  units: LengthUnit;
  numbers: Record<NumberField, string>;
  lengths: Record<LengthField, LengthText>;
  flags: Record<FlagField, boolean>;
  /** The chosen word of each choice field (the schema checks it is one of the row's options). */
  choices: Record<ChoiceField, string>;
  temperamentKind: 'equal' | 'scala';
  /** Text of a Scala .scl file (kept when switching to equal divisions and back). */
  scl: string;
  /** Frets with one marker, and with two, as whole numbers separated by spaces or commas. */
  singleMarkers: string;
  doubleMarkers: string;
}

export type DraftValidation = { ok: true; design: Design } | { ok: false; issues: DesignIssue[] };

/** Decimal numbers as people type them: optional sign, digits, optional fraction and exponent. */
const NUMBER_PATTERN = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Decimal places shown after a unit conversion (the exact value is kept behind the text). */
const CONVERTED_DECIMALS: Readonly<Record<LengthUnit, number>> = { mm: 4, in: 5 };

export function draftFromDesign(design: Design): DesignDraft {
  const lengths = Object.fromEntries(
    LENGTH_FIELDS.map((field) => [field, { text: String(fieldValue(design, field)) }]),
  ) as Record<LengthField, LengthText>;
  const counts = Object.fromEntries(COUNT_ROWS.map((row) => [row.path, String(fieldValue(design, row.path))]));
  const flags = Object.fromEntries(FLAG_ROWS.map((row) => [row.path, fieldValue(design, row.path) === true])) as Record<FlagField, boolean>;
  const choices = Object.fromEntries(CHOICE_ROWS.map((row) => [row.path, String(fieldValue(design, row.path))])) as Record<ChoiceField, string>;
  const markersOf = (kind: Marker['kind']) =>
    design.markers
      .filter((marker) => marker.kind === kind)
      .map((marker) => marker.fret)
      .join(' ');
  return {
    name: design.name,
    units: design.units,
    numbers: {
      ...counts,
      'temperament.divisions': String(design.temperament.kind === 'equal' ? design.temperament.divisions : 12),
    } as Record<NumberField, string>,
    lengths,
    flags,
    choices,
    temperamentKind: design.temperament.kind,
    scl: design.temperament.kind === 'scala' ? design.temperament.scl : '',
    singleMarkers: markersOf('single'),
    doubleMarkers: markersOf('double'),
  };
}

/** Parses a typed number; null when the text is not a plain decimal number. */
export function parseNumber(text: string): number | null {
  const trimmed = text.trim();
  return NUMBER_PATTERN.test(trimmed) ? Number(trimmed) : null;
}

/** The exact value behind a length field in the draft's current units, or null if unparseable. */
export function lengthValue(field: LengthText, units: LengthUnit): number | null {
  if (field.converted) {
    const original = parseNumber(field.converted.text);
    return original === null ? null : convertLength(original, field.converted.from, units);
  }
  return parseNumber(field.text);
}

/** Switches the draft's units, converting every length exactly (see the module comment). */
export function switchUnits(draft: DesignDraft, to: LengthUnit): DesignDraft {
  if (draft.units === to) return draft;
  const lengths = { ...draft.lengths };
  for (const name of LENGTH_FIELDS) {
    const field = draft.lengths[name];
    if (field.converted?.from === to) {
      lengths[name] = { text: field.converted.text };
      continue;
    }
    const value = lengthValue(field, draft.units);
    if (value === null) continue;
    lengths[name] = {
      text: showConverted(convertLength(value, draft.units, to), to),
      converted: field.converted ?? { from: draft.units, text: field.text },
    };
  }
  return { ...draft, units: to, lengths };
}

function showConverted(value: number, units: LengthUnit): string {
  const fixed = value.toFixed(CONVERTED_DECIMALS[units]);
  const trimmed = fixed.includes('.') ? fixed.replace(/0+$/, '').replace(/\.$/, '') : fixed;
  return trimmed === '-0' ? '0' : trimmed;
}

/** A length field after the user typed `text` into it: no longer a conversion. */
export function typedLength(text: string): LengthText {
  return { text };
}

/**
 * Turns the draft into a design with the shared schema. Text that is not a number is reported
 * on its own field; everything else is the schema's verdict, with the schema's field paths.
 */
export function validateDraft(draft: DesignDraft): DraftValidation {
  const typingIssues: DesignIssue[] = [];
  const number = (path: string, text: string): number => {
    const value = parseNumber(text);
    if (value === null) typingIssues.push({ path, message: 'enter a number' });
    return value ?? Number.NaN;
  };
  const length = (path: LengthField): number => {
    const value = lengthValue(draft.lengths[path], draft.units);
    if (value === null) typingIssues.push({ path, message: 'enter a number' });
    return value ?? Number.NaN;
  };
  const markers = [
    ...parseMarkerList(draft.singleMarkers, 'single', typingIssues),
    ...parseMarkerList(draft.doubleMarkers, 'double', typingIssues),
  ].sort((a, b) => a.fret - b.fret);

  const input: Record<string, unknown> = {
    name: draft.name,
    units: draft.units,
    temperament:
      draft.temperamentKind === 'equal'
        ? { kind: 'equal', divisions: number('temperament.divisions', draft.numbers['temperament.divisions']) }
        : { kind: 'scala', scl: draft.scl },
    markers,
  };
  for (const row of COUNT_ROWS) setFieldValue(input, row.path, number(row.path, draft.numbers[row.path]));
  for (const path of LENGTH_FIELDS) setFieldValue(input, path, length(path));
  for (const row of FLAG_ROWS) setFieldValue(input, row.path, draft.flags[row.path]);
  for (const row of CHOICE_ROWS) setFieldValue(input, row.path, draft.choices[row.path]);
  const validation = validateDesign(input);
  if (typingIssues.length === 0) return validation;
  const typed = new Set(typingIssues.map((issue) => issue.path));
  const schemaIssues = validation.ok ? [] : validation.issues.filter((issue) => !typed.has(issue.path));
  return { ok: false, issues: [...typingIssues, ...schemaIssues] };
}

function parseMarkerList(text: string, kind: Marker['kind'], issues: DesignIssue[]): Marker[] {
  const words = text.split(/[\s,]+/).filter((word) => word !== '');
  const markers: Marker[] = [];
  for (const word of words) {
    if (!/^\d+$/.test(word)) {
      issues.push({ path: 'markers', message: `"${word}" is not a fret number` });
      continue;
    }
    markers.push({ fret: Number(word), kind });
  }
  return markers;
}

/** The form field an issue belongs to: marker issues go to the marker lists. */
export function fieldOfIssue(path: string): string {
  return path.startsWith('markers') ? 'markers' : path;
}
