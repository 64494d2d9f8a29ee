/**
 * Compares the browser's preview layout with the server's. Both come from the same geometry
 * module, so they should agree to the last bit; the tolerance only allows for last-bit
 * differences in Math functions between JavaScript engines.
 */

/** Largest difference accepted between preview and server numbers, in the design's units. */
export const LAYOUT_MATCH_TOLERANCE = 1e-9;

export type LayoutComparison =
  | { kind: 'same' }
  /** Same shape, some number differs: the server's layout can be shown instead. */
  | { kind: 'numbers-differ'; path: string; preview: number; server: number }
  /** Different fields or types: the server's answer cannot be drawn by this page. */
  | { kind: 'shape-differs'; path: string };

/** Walks two JSON values side by side and reports the first difference. */
export function compareLayouts(preview: unknown, server: unknown, path = 'layout'): LayoutComparison {
  if (typeof preview === 'number' && typeof server === 'number') {
    return Math.abs(preview - server) <= LAYOUT_MATCH_TOLERANCE || preview === server
      ? { kind: 'same' }
      : { kind: 'numbers-differ', path, preview, server };
  }
  if (Array.isArray(preview) && Array.isArray(server)) {
    if (preview.length !== server.length) return { kind: 'shape-differs', path: `${path}.length` };
    for (let index = 0; index < preview.length; index++) {
      const result = compareLayouts(preview[index], server[index], `${path}.${index}`);
      if (result.kind !== 'same') return result;
    }
    return { kind: 'same' };
  }
  if (isRecord(preview) && isRecord(server)) {
    const keys = Object.keys(preview);
    if (keys.length !== Object.keys(server).length) return { kind: 'shape-differs', path };
    for (const key of keys) {
      if (!Object.hasOwn(server, key)) return { kind: 'shape-differs', path: `${path}.${key}` };
      const result = compareLayouts(preview[key], server[key], `${path}.${key}`);
      if (result.kind !== 'same') return result;
    }
    return { kind: 'same' };
  }
  return preview === server ? { kind: 'same' } : { kind: 'shape-differs', path };
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}
