import { validateDesign, type Design, type DesignInput } from '~/lib/schemas/design';

/** A validated 12-TET design with plain defaults; `overrides` change any field. */
export function designOf(overrides: Partial<DesignInput> = {}): Design {
  const validation = validateDesign({
    name: 'Test board',
    units: 'mm',
    strings: 6,
    scale: { treble: 635, bass: 635 },
    perpendicularFret: 0,
    frets: 20,
    stringSpacing: { nut: 43, bridge: 56 },
    temperament: { kind: 'equal', divisions: 12 },
    ...overrides,
  });
  if (!validation.ok) throw new Error(`test design invalid: ${JSON.stringify(validation.issues)}`);
  return validation.design;
}
