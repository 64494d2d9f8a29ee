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

export const LENGTH_FIELDS = [
  'scale.treble',
  'scale.bass',
  'stringSpacing.nut',
  'stringSpacing.bridge',
  'overhang.nut',
  'overhang.end',
  'endExtension',
  'slot.width',
  'slot.stopDistance',
  'compensation.nut',
  'compensation.saddleTreble',
  'compensation.saddleBass',
  'zeroFretNutGap',
] as const;
export type LengthField = (typeof LENGTH_FIELDS)[number];

export const NUMBER_FIELDS = ['strings', 'frets', 'perpendicularFret', 'temperament.divisions'] as const;
export type NumberField = (typeof NUMBER_FIELDS)[number];

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
  slotStopped: boolean;
  zeroFret: boolean;
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
    LENGTH_FIELDS.map((field) => [field, { text: String(lengthOf(design, field)) }]),
  ) as Record<LengthField, LengthText>;
  const markersOf = (kind: Marker['kind']) =>
    design.markers
      .filter((marker) => marker.kind === kind)
      .map((marker) => marker.fret)
      .join(' ');
  return {
    name: design.name,
    units: design.units,
    numbers: {
      strings: String(design.strings),
      frets: String(design.frets),
      perpendicularFret: String(design.perpendicularFret),
      'temperament.divisions': String(design.temperament.kind === 'equal' ? design.temperament.divisions : 12),
    },
    lengths,
    slotStopped: design.slot.stopped,
    zeroFret: design.zeroFret,
    temperamentKind: design.temperament.kind,
    scl: design.temperament.kind === 'scala' ? design.temperament.scl : '',
    singleMarkers: markersOf('single'),
    doubleMarkers: markersOf('double'),
  };
}

function lengthOf(design: Design, field: LengthField): number {
  switch (field) {
    case 'scale.treble':
      return design.scale.treble;
    case 'scale.bass':
      return design.scale.bass;
    case 'stringSpacing.nut':
      return design.stringSpacing.nut;
    case 'stringSpacing.bridge':
      return design.stringSpacing.bridge;
    case 'overhang.nut':
      return design.overhang.nut;
    case 'overhang.end':
      return design.overhang.end;
    case 'endExtension':
      return design.endExtension;
    case 'slot.width':
      return design.slot.width;
    case 'slot.stopDistance':
      return design.slot.stopDistance;
    case 'compensation.nut':
      return design.compensation.nut;
    case 'compensation.saddleTreble':
      return design.compensation.saddleTreble;
    case 'compensation.saddleBass':
      return design.compensation.saddleBass;
    case 'zeroFretNutGap':
      return design.zeroFretNutGap;
  }
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

  const input = {
    name: draft.name,
    units: draft.units,
    strings: number('strings', draft.numbers.strings),
    scale: { treble: length('scale.treble'), bass: length('scale.bass') },
    perpendicularFret: number('perpendicularFret', draft.numbers.perpendicularFret),
    frets: number('frets', draft.numbers.frets),
    stringSpacing: { nut: length('stringSpacing.nut'), bridge: length('stringSpacing.bridge') },
    temperament:
      draft.temperamentKind === 'equal'
        ? { kind: 'equal', divisions: number('temperament.divisions', draft.numbers['temperament.divisions']) }
        : { kind: 'scala', scl: draft.scl },
    overhang: { nut: length('overhang.nut'), end: length('overhang.end') },
    endExtension: length('endExtension'),
    slot: { width: length('slot.width'), stopped: draft.slotStopped, stopDistance: length('slot.stopDistance') },
    compensation: {
      nut: length('compensation.nut'),
      saddleTreble: length('compensation.saddleTreble'),
      saddleBass: length('compensation.saddleBass'),
    },
    markers,
    zeroFret: draft.zeroFret,
    zeroFretNutGap: length('zeroFretNutGap'),
  };
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
