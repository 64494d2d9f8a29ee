/**
 * The compact layout answer of POST /api/layout (docs/api.md) carries everything the full Layout
 * does: expanding it gives back computeLayout's output, number for number, and its JSON text
 * (fast-json-stringify from the schema) parses to the same doubles, unrounded.
 */
import { readdirSync, readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compactLayoutJson } from '~/lib/export/layout-json.server.ts';
import { compactLayout, expandLayout, type CompactLayout } from '~/lib/geometry/compact-layout.ts';
import { computeLayout, fretFractions } from '~/lib/geometry/layout.ts';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';
import { validDesignArbitrary } from './design-arbitraries.ts';

const DEMO_DIR = 'src/lib/boards/demo';
const demoDesigns: [string, Design][] = readdirSync(DEMO_DIR)
  .filter((file) => file.endsWith('.json'))
  .map((file) => {
    const checked = validateDesign(JSON.parse(readFileSync(`${DEMO_DIR}/${file}`, 'utf8')));
    if (!checked.ok) throw new Error(`${file} does not validate`);
    return [file, checked.design];
  });

function answerText(design: Design): string {
  return compactLayoutJson(computeLayout(design), fretFractions(design.temperament, design.frets));
}

/** Every number in `value`, in a fixed order (keys sorted), so two values can be compared exactly. */
function numbersOf(value: unknown, into: number[] = []): number[] {
  if (typeof value === 'number') into.push(value);
  else if (Array.isArray(value)) for (const item of value) numbersOf(item, into);
  else if (value && typeof value === 'object') for (const key of Object.keys(value).sort()) numbersOf((value as Record<string, unknown>)[key], into);
  return into;
}

describe('compact layout answer', () => {
  it('has demo designs to check', () => {
    expect(demoDesigns.length).toBeGreaterThan(3);
  });

  it.each(demoDesigns)('%s: expands to the full layout, every double the same', (_file, design) => {
    const full = computeLayout(design);
    const expanded = expandLayout(JSON.parse(answerText(design)) as CompactLayout);
    // JSON has no -0: both sides go through it, as both answers do on the wire.
    expect(JSON.parse(JSON.stringify(expanded))).toEqual(JSON.parse(JSON.stringify(full)));
    const exact = numbersOf(JSON.parse(JSON.stringify(expanded)));
    const expected = numbersOf(JSON.parse(JSON.stringify(full)));
    expect(exact.length).toBe(expected.length);
    expect(exact.every((n, i) => Object.is(n, expected[i]))).toBe(true);
  });

  it.each(demoDesigns)('%s: is smaller than the full layout', (_file, design) => {
    expect(answerText(design).length).toBeLessThan(JSON.stringify(computeLayout(design)).length / 2);
  });

  it('property: any valid design round-trips through the compact JSON (fast-check)', () => {
    fc.assert(
      fc.property(validDesignArbitrary, (input) => {
        const checked = validateDesign(input);
        if (!checked.ok) return;
        const full = JSON.parse(JSON.stringify(computeLayout(checked.design))) as unknown;
        const expanded = expandLayout(JSON.parse(answerText(checked.design)) as CompactLayout);
        expect(JSON.parse(JSON.stringify(expanded))).toEqual(full);
      }),
      { numRuns: 200 },
    );
  });

  it('the schema serialiser writes the same text as JSON.stringify of the compact value: doubles unrounded', () => {
    for (const [, design] of demoDesigns) {
      const layout = computeLayout(design);
      const compact = compactLayout(layout, fretFractions(design.temperament, design.frets));
      const text = answerText(design);
      expect(text).toBe(JSON.stringify(compact));
      expect(numbersOf(JSON.parse(text)).every((n, i) => Object.is(n, numbersOf(compact)[i]))).toBe(true);
    }
  });

  it('keeps doubles that need all 17 significant digits, and names with quotes and non-ASCII letters', () => {
    const [, design] = demoDesigns[0]!;
    const layout = computeLayout({ ...design, name: 'Señor "test" \u2028 board' });
    const hard = [0.1 + 0.2, 1 / 3, 2 ** -1074, 123456.78901234567, -0.000001234];
    const fractions = fretFractions(design.temperament, design.frets);
    const tweaked = { ...layout, slotWidth: hard[0]!, minimumOverrun: hard[1]!, perpendicularFret: { fret: hard[2]!, x: hard[3]! }, dotDiameters: { face: hard[4]!, side: 1 } };
    const parsed = JSON.parse(compactLayoutJson(tweaked, fractions)) as CompactLayout;
    expect([parsed.slotWidth, parsed.minimumOverrun, parsed.perpendicularFret.fret, parsed.perpendicularFret.x, parsed.dotDiameters.face]).toEqual(hard);
    expect(parsed.name).toBe('Señor "test" \u2028 board');
  });
});
