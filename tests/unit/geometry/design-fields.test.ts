/**
 * The field table drives the design schema: every row is accepted, defaulted, limited and refused
 * by the schema exactly as the row says. Defaults and limits are the table's own (demo and common
 * practice values); 1 in = 25.4 mm exactly (NIST SP 811, appendix B).
 */
import { describe, expect, it } from 'vitest';
import { DESIGN_FIELDS, LENGTH_ROWS, fieldValue, setFieldValue } from '~/lib/schemas/design-fields.ts';
import { validateDesign } from '~/lib/schemas/design.ts';
import { draftFromDesign, validateDraft } from '~/components/editor/design-draft.ts';
import { designInput } from '../../support/design-builders.ts';

const MM_PER_IN = 25.4;

function without(path: string): Record<string, unknown> {
  const input = structuredClone(designInput()) as Record<string, unknown>;
  const [head, member] = path.split('.');
  if (member === undefined) delete input[head!];
  else if (typeof input[head!] === 'object') delete (input[head!] as Record<string, unknown>)[member];
  return input;
}

function withValue(path: string, value: unknown, base: Record<string, unknown> = designInput() as Record<string, unknown>): Record<string, unknown> {
  const input = structuredClone(base);
  setFieldValue(input, path, value);
  return input;
}

describe('the design field table', () => {
  it('has one row per path', () => {
    const paths = DESIGN_FIELDS.map((row) => row.path);
    expect(new Set(paths).size).toBe(paths.length);
  });

  it.each(DESIGN_FIELDS.map((row) => [row.path, row] as const))('%s: missing is refused when required, defaulted otherwise', (path, row) => {
    const result = validateDesign(without(path));
    const optional = row.kind === 'flag' || row.kind === 'choice' || (row.kind === 'length' && 'defaultMm' in row) || (row.kind === 'whole' && 'default' in row);
    if (!optional) {
      expect(result.ok).toBe(false);
      if (!result.ok) expect(result.issues.map((i) => i.path)).toContain(path);
      return;
    }
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const expected = 'default' in row ? row.default : (row as { defaultMm: number }).defaultMm;
    expect(fieldValue(result.design, path)).toBe(expected);
  });

  it.each(LENGTH_ROWS.filter((row) => 'defaultMm' in row).map((row) => [row.path, row.defaultMm] as const))(
    '%s: its default is converted for a design in inches',
    (path, defaultMm) => {
      const result = validateDesign({ ...without(path), units: 'in', scale: { treble: 25.5, bass: 25.5 }, stringSpacing: { nut: 1.4, bridge: 2.1 } });
      expect(result.ok).toBe(true);
      if (result.ok) expect(Math.abs((fieldValue(result.design, path) as number) - defaultMm / MM_PER_IN)).toBeLessThan(1e-12);
    },
  );

  it.each(LENGTH_ROWS.map((row) => [row.path, row.maxMm] as const))('%s: more than %d mm is refused, naming the field and the limit', (path, maxMm) => {
    const result = validateDesign(withValue(path, maxMm * 1.001));
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues).toContainEqual({ path, message: `must be at most ${maxMm} mm` });
  });

  it.each(LENGTH_ROWS.filter((row) => row.sign !== 'signed').map((row) => [row.path, row.sign] as const))('%s (%s) refuses a negative length', (path) => {
    const result = validateDesign(withValue(path, -1));
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues.map((i) => i.path)).toContain(path);
  });

  it.each(DESIGN_FIELDS.filter((row) => row.kind === 'flag').map((row) => [row.path] as const))('%s takes true or false only', (path) => {
    expect(validateDesign(withValue(path, true)).ok).toBe(true);
    expect(validateDesign(withValue(path, 'yes')).ok).toBe(false);
  });

  it.each(DESIGN_FIELDS.filter((row) => row.kind === 'choice').map((row) => [row.path, row.options] as const))('%s takes one of its words only', (path, options) => {
    for (const option of options) expect(validateDesign(withValue(path, option)).ok).toBe(true);
    const refused = validateDesign(withValue(path, 'sideways'));
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.issues).toContainEqual({ path, message: `must be one of: ${options.join(', ')}` });
  });

  it('the editor draft carries every row there and back', () => {
    const design = validateDesign(withValue('scaleAlong', 'centreLine', withValue('slot.stopped', true, withValue('zeroFret', true))));
    expect(design.ok).toBe(true);
    if (!design.ok) return;
    const back = validateDraft(draftFromDesign(design.design));
    expect(back).toEqual({ ok: true, design: design.design });
  });
});
