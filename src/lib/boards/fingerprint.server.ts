/**
 * A board's fingerprint: a short digest of its normalised design, printed on every export and
 * shown in History and on the proof page, so a print on the bench, a proof and a revision can be
 * compared by eye. Normalised means validated (every default filled), keys in sorted order, and
 * the name left out: renaming a board does not change its layout, so it does not change the
 * fingerprint or undo an approval. 48 bits of SHA-256, written as three groups of four hex digits.
 */
import { createHash } from 'node:crypto';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';

/** "4f2a-9c1d-77e0" for a design (validated again here, so stored JSON and parsed designs agree). */
export function designFingerprint(design: Design | unknown): string {
  const checked = validateDesign(design);
  if (!checked.ok) throw new Error(`cannot fingerprint an invalid design: ${checked.issues[0]?.path}`);
  const { name: _name, ...layout } = checked.design;
  const hex = createHash('sha256').update(canonicalJson(layout), 'utf8').digest('hex');
  return `${hex.slice(0, 4)}-${hex.slice(4, 8)}-${hex.slice(8, 12)}`;
}

/** JSON with object keys sorted at every depth, so equal values give equal text. */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}
