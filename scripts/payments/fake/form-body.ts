/**
 * Reads the body the payment SDK sends: `application/x-www-form-urlencoded` with bracketed keys
 * (`line_items[0][price_data][currency]=eur`, `metadata[deposit_id]=7`), into nested plain data.
 * Numeric brackets make arrays, as the SDK's encoder writes them.
 */
export type FormValue = string | FormValue[] | { [key: string]: FormValue };
export type FormObject = { [key: string]: FormValue };

function keyPath(name: string): string[] {
  const first = name.indexOf('[');
  if (first < 0) return [name];
  const rest = [...name.slice(first).matchAll(/\[([^\]]*)\]/g)].map((m) => m[1] ?? '');
  return [name.slice(0, first), ...rest];
}

function place(target: FormObject | FormValue[], path: string[], value: string): void {
  const [head, ...rest] = path;
  if (head === undefined) return;
  const slot = Array.isArray(target) ? Number(head) : head;
  const holder = target as Record<string | number, FormValue>;
  if (rest.length === 0) {
    holder[slot] = value;
    return;
  }
  const nextIsIndex = /^\d+$/.test(rest[0] ?? '');
  const existing = holder[slot];
  const child = typeof existing === 'object' ? existing : nextIsIndex ? [] : {};
  holder[slot] = child;
  place(child, rest, value);
}

export function parseFormBody(body: string): FormObject {
  const out: FormObject = {};
  for (const [name, value] of new URLSearchParams(body)) place(out, keyPath(name), value);
  return out;
}

/** A string field, or undefined. */
export function text(value: FormValue | undefined): string | undefined {
  return typeof value === 'string' ? value : undefined;
}

/** A nested object field, or an empty object. */
export function nested(value: FormValue | undefined): FormObject {
  return value && typeof value === 'object' && !Array.isArray(value) ? value : {};
}

/** A list field (arrays, or objects keyed 0, 1, ...), or an empty list. */
export function list(value: FormValue | undefined): FormValue[] {
  if (Array.isArray(value)) return value.filter((v) => v !== undefined);
  if (value && typeof value === 'object') return Object.values(value);
  return [];
}

/** String-to-string metadata, as the service keeps it. */
export function metadataOf(value: FormValue | undefined): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(nested(value))) if (typeof v === 'string') out[k] = v;
  return out;
}
