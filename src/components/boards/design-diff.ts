/**
 * Which fields differ between two designs (or any two JSON values): one entry per changed leaf,
 * named by its dotted path ("scale.treble", "markers.3.kind"). Used by the revision compare and
 * the conflict view; browser-safe and pure.
 */
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
