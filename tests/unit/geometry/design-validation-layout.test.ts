/**
 * validateDesignWithLayout (what POST /api/layout uses): the same verdict and issues as
 * validateDesign and as the zod schema itself (designSchema), and the layout computeLayout gives,
 * whether the radius check computed it or not.
 */
import { describe, expect, it } from 'vitest';
import { computeLayout } from '~/lib/geometry/layout.ts';
import { designSchema, validateDesign, validateDesignWithLayout } from '~/lib/schemas/design.ts';
import { designInput, withField } from '../../support/design-builders.ts';

/** The issues designSchema.safeParse gives, in validateDesign's path spelling. */
function schemaIssues(input: unknown): { path: string; message: string }[] {
  const result = designSchema.safeParse(input);
  if (result.success) return [];
  return result.error.issues.map((issue) => {
    const path = issue.code === 'unrecognized_keys' && issue.keys.length === 1 ? [...issue.path, ...issue.keys] : issue.path;
    return { path: path.length === 0 ? 'design' : path.join('.'), message: issue.message };
  });
}

const radiused = designInput({ radius: { nut: 254, end: 406.4 } });
/** [what, input, whether it is a valid design] */
const inputs: [string, unknown, boolean][] = [
  ['flat', designInput(), true],
  ['radiused (the radius check computes the layout)', radiused, true],
  ['fanned, in inches', designInput({ units: 'in', scale: { treble: 25.5, bass: 27 }, stringSpacing: { nut: 1.7, bridge: 2.2 }, perpendicularFret: 7 }), true],
  ['radius too small for the board', designInput({ radius: { nut: 10, end: 0 } }), false],
  ['a field out of range', withField('scale.treble', -1), false],
  ['an unknown field', withField('scale.middle', 600), false],
  ['a marker past the last fret', designInput({ frets: 12, markers: [{ fret: 15, kind: 'single' }] }), false],
  ['perpendicular fret past the last', designInput({ frets: 12, perpendicularFret: 13 }), false],
  ['not an object', 'design', false],
  ['several problems at once', { ...designInput({ frets: 40, name: '' }), colour: 'red' }, false],
];

describe('validateDesignWithLayout', () => {
  it.each(inputs)('%s: the same verdict and issues as validateDesign and designSchema', (_label, input, valid) => {
    const plain = validateDesign(input);
    expect(plain.ok).toBe(valid);
    const withLayout = validateDesignWithLayout(input);
    expect(withLayout.ok).toBe(plain.ok);
    if (!plain.ok && !withLayout.ok) {
      expect(withLayout.issues).toEqual(plain.issues);
      expect(plain.issues).toEqual(schemaIssues(input));
      expect(plain.issues.length).toBeGreaterThan(0);
    }
    if (plain.ok && withLayout.ok) {
      expect(designSchema.safeParse(input)).toEqual({ success: true, data: plain.design });
      expect(withLayout.design).toEqual(plain.design);
      expect(withLayout.layout).toEqual(computeLayout(plain.design));
    }
  });

  it('a radiused design is accepted and carries the layout of its radius', () => {
    const checked = validateDesignWithLayout(radiused);
    if (!checked.ok) expect.fail(JSON.stringify(checked.issues));
    expect(checked.design.radius).toEqual({ nut: 254, end: 406.4 });
    expect(checked.layout.strings).toHaveLength(6);
  });
});
