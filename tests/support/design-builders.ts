/** Designs for unit tests: one plain default design, overridden per test, validated or failing the test. */
import { expect } from 'vitest';
import { computeLayout, type Layout } from '~/lib/geometry/layout.ts';
import { validateDesign, type Design, type DesignInput } from '~/lib/schemas/design.ts';

/** A plain six-string design in mm; override any field. */
export function designInput(overrides: Partial<DesignInput> = {}): DesignInput {
  return {
    name: 'Test board',
    units: 'mm',
    strings: 6,
    scale: { treble: 650, bass: 650 },
    perpendicularFret: 0,
    frets: 24,
    stringSpacing: { nut: 43, bridge: 58 },
    temperament: { kind: 'equal', divisions: 12 },
    ...overrides,
  };
}

/** Validates or fails the test with the issues listed. */
export function validDesign(input: unknown): Design {
  const validation = validateDesign(input);
  if (!validation.ok) expect.fail(`design rejected: ${JSON.stringify(validation.issues)}`);
  return validation.design;
}

/** The validated default design with `overrides`. */
export function designOf(overrides: Partial<DesignInput> = {}): Design {
  return validDesign(designInput(overrides));
}

export function layoutOf(overrides: Partial<DesignInput> = {}): Layout {
  return computeLayout(designOf(overrides));
}

/** The point of fret `fret` on string `string` (both 1-based). */
export function fretPoint(layout: Layout, fret: number, string: number) {
  const point = layout.frets[fret - 1]?.points[string - 1];
  if (!point) expect.fail(`no fret ${fret} on string ${string}`);
  return point;
}

/** A valid design with one field replaced (or removed with `undefined`) at a dotted path. */
export function withField(path: string, value: unknown): Record<string, unknown> {
  const design = structuredClone(designInput()) as Record<string, unknown>;
  const keys = path.split('.');
  let target = design;
  for (const key of keys.slice(0, -1)) {
    target[key] ??= {};
    target = target[key] as Record<string, unknown>;
  }
  const last = keys[keys.length - 1]!;
  if (value === undefined) delete target[last];
  else target[last] = value;
  return design;
}
