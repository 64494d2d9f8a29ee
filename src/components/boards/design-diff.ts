/**
 * Which fields differ between two designs (or any two JSON values): one entry per changed leaf,
 * named by its dotted path ("scale.treble", "markers.3.kind"), and how a person reads it: the
 * form's label and the value in the design's units (describeChange). Used by the revision compare
 * and the conflict view; browser-safe and pure.
 */
import { formatLength, type LengthUnit } from '~/lib/format/units.ts';
import { DESIGN_FIELDS } from '~/lib/schemas/design-fields.ts';
export interface FieldChange {
  path: string;
  /** The value in the first design; undefined when the field is only in the second. */
  before: unknown;
  after: unknown;
}

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function join(prefix: string, key: string | number): string {
  return prefix ? `${prefix}.${key}` : String(key);
}

export function diffDesigns(before: unknown, after: unknown, prefix = ''): FieldChange[] {
  if (isPlainObject(before) && isPlainObject(after)) {
    const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])];
    return keys.flatMap((key) => diffDesigns(before[key], after[key], join(prefix, key)));
  }
  if (Array.isArray(before) && Array.isArray(after)) {
    const length = Math.max(before.length, after.length);
    return Array.from({ length }, (_, i) => diffDesigns(before[i], after[i], join(prefix, i))).flat();
  }
  if (Object.is(before, after)) return [];
  return [{ path: prefix || '(design)', before, after }];
}

/** A changed value as shown in the compare table: numbers unrounded, missing fields as "—". */
export function showValue(value: unknown): string {
  if (value === undefined) return '—';
  if (typeof value === 'string') return value;
  return JSON.stringify(value);
}

/** A change as the compare table shows it: the field's label and both values in words and units. */
export interface ChangeInWords {
  label: string;
  before: string;
  after: string;
}

const OTHER_LABELS: Readonly<Record<string, string>> = {
  name: 'Design name',
  units: 'Units',
  'temperament.kind': 'Temperament',
  'temperament.divisions': 'Divisions per octave',
  'temperament.scl': 'Scala scale file',
};

function unitsOf(design: unknown): LengthUnit | undefined {
  const units = isPlainObject(design) ? design['units'] : undefined;
  return units === 'mm' || units === 'in' ? units : undefined;
}

/**
 * `change` in words: the label the design form uses (with the units for a length) and each value
 * as the form shows it; `before` and `after` are the two whole designs (for their units).
 */
export function describeChange(change: FieldChange, before: unknown, after: unknown): ChangeInWords {
  const row = DESIGN_FIELDS.find((field) => field.path === change.path);
  const marker = /^markers\.(\d+)(?:\.(fret|kind))?$/.exec(change.path);
  const [unitsBefore, unitsAfter] = [unitsOf(before), unitsOf(after)];
  const shown = (value: unknown, units: LengthUnit | undefined): string => {
    if (value === undefined) return '—';
    if (row?.kind === 'length' && typeof value === 'number' && units) return formatLength(value, units, true);
    if (row?.kind === 'flag') return value === true ? 'yes' : 'no';
    if (row?.kind === 'choice' && typeof value === 'string') return (row.optionLabels as Readonly<Record<string, string>>)[value] ?? value;
    if (change.path === 'units') return value === 'mm' ? 'millimetres' : value === 'in' ? 'inches' : showValue(value);
    if (change.path === 'temperament.scl' && typeof value === 'string') return `${value.split('\n').length} lines`;
    if (marker && isPlainObject(value)) return `fret ${String(value['fret'])}, ${String(value['kind'])}`;
    return showValue(value);
  };
  const label = row
    ? row.label
    : marker
      ? `Marker ${Number(marker[1]) + 1}${marker[2] ? ` (${marker[2] === 'fret' ? 'fret' : 'single or double'})` : ''}`
      : (OTHER_LABELS[change.path] ?? change.path);
  return { label, before: shown(change.before, unitsBefore), after: shown(change.after, unitsAfter) };
}
