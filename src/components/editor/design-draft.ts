/**
 * The form's state: what the user typed, field by field, which may be incomplete or wrong.
 * It turns into a design only through the shared schema (validateDesign), so the form, the API
 * and the database all accept exactly the same designs.
 *
 * Lengths read like a rule: a field shows its value rounded to 0.01 mm or 0.0001 in and keeps the
 * exact value behind the text until the user edits it. Inch fields also take fractions as a
 * luthier writes them (`1 3/4`, `3/4`, `25 1/2"`, `25.5 in`).
 *
 * Unit switching converts every length exactly: a converted field remembers the text it was
 * converted from, computes with the exact converted value (the text shows it rounded), and
 * switching back restores the original text as long as the field was not edited.
 */
import { convertLength, type LengthUnit } from '~/lib/format/units.ts';
import { validateDesign, type Design, type DesignIssue, type Marker } from '~/lib/schemas/design.ts';
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
} from '~/lib/schemas/design-fields.ts';

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
  /** The exact value behind a rounded `text` (a loaded design's value), until the field is edited. */
  exact?: number;
  /** Set while the text shows a unit conversion of the field as it was in `from`. */
  converted?: { from: LengthUnit; text: string; exact?: number };
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

/** Decimal places a length shows: 0.01 mm, 0.0001 in (the exact value is kept behind the text). */
const SHOWN_DECIMALS: Readonly<Record<LengthUnit, number>> = { mm: 2, in: 4 };

/** An inch length as written on a rule: whole and fraction (`25 1/2`), a fraction (`3/4`), a decimal; `"` or `in` may follow. */
const INCH_PATTERN = /^(?:(?<whole>\d+)\s+)?(?<num>\d+)\s*\/\s*(?<den>\d+)$/;

export function draftFromDesign(design: Design): DesignDraft {
  const lengths = Object.fromEntries(
    LENGTH_FIELDS.map((field) => [field, shownLength(fieldValue(design, field) as number, design.units)]),
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

/** Parses a typed length: a decimal number, and in inches also fractions with an optional `"` or `in`. */
export function parseLength(text: string, units: LengthUnit): number | null {
  if (units === 'mm') return parseNumber(text.trim().replace(/\s*mm$/i, ''));
  const bare = text.trim().replace(/\s*(?:"|in|inch|inches)$/i, '');
  const decimal = parseNumber(bare);
  if (decimal !== null) return decimal;
  const fraction = INCH_PATTERN.exec(bare)?.groups;
  if (!fraction) return null;
  const denominator = Number(fraction['den']);
  if (denominator === 0) return null;
  return Number(fraction['whole'] ?? 0) + Number(fraction['num']) / denominator;
}

/** A length as the form shows it: rounded like a rule reads, the exact value kept when rounding changed it. */
function shownLength(value: number, units: LengthUnit): LengthText {
  const text = showRounded(value, units);
  return Number(text) === value ? { text } : { text, exact: value };
}

/** The exact value behind a length field in the draft's current units, or null if unparseable. */
export function lengthValue(field: LengthText, units: LengthUnit): number | null {
  if (field.converted) {
    const original = field.converted.exact ?? parseLength(field.converted.text, field.converted.from);
    return original === null ? null : convertLength(original, field.converted.from, units);
  }
  return field.exact ?? parseLength(field.text, units);
}

/** Switches the draft's units, converting every length exactly (see the module comment). */
export function switchUnits(draft: DesignDraft, to: LengthUnit): DesignDraft {
  if (draft.units === to) return draft;
  const lengths = { ...draft.lengths };
  for (const name of LENGTH_FIELDS) {
    const field = draft.lengths[name];
    if (field.converted?.from === to) {
      lengths[name] = field.converted.exact === undefined ? { text: field.converted.text } : { text: field.converted.text, exact: field.converted.exact };
      continue;
    }
    const value = lengthValue(field, draft.units);
    if (value === null) continue;
    lengths[name] = {
      text: showRounded(convertLength(value, draft.units, to), to),
      converted: field.converted ?? { from: draft.units, text: field.text, ...(field.exact === undefined ? {} : { exact: field.exact }) },
    };
  }
  return { ...draft, units: to, lengths };
}

function showRounded(value: number, units: LengthUnit): string {
  const fixed = value.toFixed(SHOWN_DECIMALS[units]);
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

/** What keeping the per-string spacing would do after the string count changed (null when nothing to offer). */
export interface SpacingOffer {
  from: number;
  to: number;
  /** Per-string spacing kept, and the new outer spacings, in the draft's units. */
  perStringNut: number;
  perStringBridge: number;
  nut: number;
  bridge: number;
}

/**
 * After the string count changed from `from`, the outer spacings that keep the same distance
 * between neighbouring strings at the nut and at the bridge (a 6-string at 43/58 mm becoming a
 * 7-string: 8.6 and 11.6 mm per string, so 51.6 and 69.6 mm).
 */
export function spacingOffer(draft: DesignDraft, from: number): SpacingOffer | null {
  const to = parseNumber(draft.numbers.strings);
  const nut = lengthValue(draft.lengths['stringSpacing.nut'], draft.units);
  const bridge = lengthValue(draft.lengths['stringSpacing.bridge'], draft.units);
  if (to === null || nut === null || bridge === null || !Number.isInteger(to) || to < 2 || from < 2 || to === from) return null;
  const perStringNut = nut / (from - 1);
  const perStringBridge = bridge / (from - 1);
  return { from, to, perStringNut, perStringBridge, nut: perStringNut * (to - 1), bridge: perStringBridge * (to - 1) };
}

/** The draft with the offer's outer spacings (shown rounded, kept exact). */
export function applySpacingOffer(draft: DesignDraft, offer: SpacingOffer): DesignDraft {
  return {
    ...draft,
    lengths: {
      ...draft.lengths,
      'stringSpacing.nut': shownLength(offer.nut, draft.units),
      'stringSpacing.bridge': shownLength(offer.bridge, draft.units),
    },
  };
}
