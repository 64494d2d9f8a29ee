/**
 * The editor's "blank" starting point: a plain single-scale six-string board in millimetres,
 * with neutral values (common practice, from memory) for the user to type over.
 */
import { validateDesign, type Design } from '~/lib/schemas/design.ts';

const BLANK_INPUT = {
  name: 'Untitled board',
  units: 'mm',
  strings: 6,
  scale: { treble: 650, bass: 650 },
  // A single-scale board is quoted along the centre line, as the trade quotes it.
  scaleAlong: 'centreLine',
  perpendicularFret: 0,
  frets: 22,
  stringSpacing: { nut: 35, bridge: 52 },
  temperament: { kind: 'equal', divisions: 12 },
} as const;

export function blankDesign(): Design {
  const validation = validateDesign(BLANK_INPUT);
  if (!validation.ok) throw new Error('the blank design is invalid');
  return validation.design;
}
